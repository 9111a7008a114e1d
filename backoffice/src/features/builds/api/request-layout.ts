import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingStateResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

export const requestLayoutApproval = (id: string, note: string) =>
  api.post<BookingStateResponse>(`/bookings/${encodeURIComponent(id)}/layout/request`, note ? { message: note } : {});

export const useRequestLayoutApproval = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (note: string) => requestLayoutApproval(id, note),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};
