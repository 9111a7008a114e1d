import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TimeEntriesResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

export interface TimeEntryInput {
  workedOn: string;
  hours: number;
  note?: string;
  builderId?: string;
}

export const addTimeEntry = (id: string, body: TimeEntryInput) =>
  api.post<TimeEntriesResponse>(`/bookings/${encodeURIComponent(id)}/time-entries`, body);

export const useAddTimeEntry = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TimeEntryInput) => addTimeEntry(id, body),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};
