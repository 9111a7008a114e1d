import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingStateResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

export const waiveBalance = (id: string, reason: string) =>
  api.post<BookingStateResponse>(`/bookings/${encodeURIComponent(id)}/waive-balance`, { reason });

export const useWaiveBalance = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (reason: string) => waiveBalance(id, reason),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};
