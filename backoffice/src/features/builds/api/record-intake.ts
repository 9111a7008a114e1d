import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { IntakeItemView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

export interface IntakeItemInput {
  item: string;
  condition: 'working' | 'faulty';
  note?: string;
}

export const recordIntake = (id: string, items: IntakeItemInput[]) =>
  api.post<IntakeItemView[]>(`/bookings/${encodeURIComponent(id)}/intake`, { items });

export const useRecordIntake = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (items: IntakeItemInput[]) => recordIntake(id, items),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};
