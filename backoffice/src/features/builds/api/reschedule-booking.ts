import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RescheduleRequest, RescheduleResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

export const rescheduleBooking = (id: string, body: RescheduleRequest) =>
  api.post<RescheduleResponse>(`/bookings/${encodeURIComponent(id)}/reschedule`, body);

export const useRescheduleBooking = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: RescheduleRequest }) => rescheduleBooking(id, body),
    onSuccess: (_, { id }) => invalidateBuild(queryClient, id),
  });
};
