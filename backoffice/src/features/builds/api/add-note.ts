import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StaffNoteInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

export const addNote = (id: string, body: StaffNoteInput) => api.post(`/bookings/${encodeURIComponent(id)}/notes`, body);

export const useAddNote = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: (body: StaffNoteInput) => addNote(id, body), onSuccess: () => invalidateBuild(queryClient, id) });
};
