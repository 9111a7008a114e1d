import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptBookingRequest, AcceptBookingResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const acceptBooking = (id: string, body: AcceptBookingRequest) =>
  api.post<AcceptBookingResponse>(`/bookings/${encodeURIComponent(id)}/accept`, body);

export const useAcceptBooking = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: AcceptBookingRequest }) => acceptBooking(id, body),
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: ['bookings'] }),
        queryClient.invalidateQueries({ queryKey: ['bench'] }),
      ]),
  });
};
