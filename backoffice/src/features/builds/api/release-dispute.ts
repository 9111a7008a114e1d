import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingDetail, ReleaseDisputeInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

export const releaseDispute = (id: string, body: ReleaseDisputeInput) =>
  api.post<BookingDetail>(`/bookings/${encodeURIComponent(id)}/dispute/release`, body);

export const useReleaseDispute = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (note: string) => releaseDispute(id, { note }),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};
