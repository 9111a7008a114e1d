import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { EditTimeEntryInput, TimeEntriesResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

const entryPath = (id: string, entryId: string) => `/bookings/${encodeURIComponent(id)}/time-entries/${encodeURIComponent(entryId)}`;

/** Corrects an hour entry (its author or the owner); the change goes in the build's history. */
export const editTimeEntry = (id: string, entryId: string, body: EditTimeEntryInput) =>
  api.request<TimeEntriesResponse>(entryPath(id, entryId), { method: 'PATCH', body });
export const deleteTimeEntry = (id: string, entryId: string) =>
  api.request<TimeEntriesResponse>(entryPath(id, entryId), { method: 'DELETE' });

export const useEditTimeEntry = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ entryId, body }: { entryId: string; body: EditTimeEntryInput }) => editTimeEntry(id, entryId, body),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};

export const useDeleteTimeEntry = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: (entryId: string) => deleteTimeEntry(id, entryId), onSuccess: () => invalidateBuild(queryClient, id) });
};
