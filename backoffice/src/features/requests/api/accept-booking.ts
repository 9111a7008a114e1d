import { useMutation, useQueryClient } from '@tanstack/react-query';
import { hasErrorCode, type AcceptBookingRequest, type AcceptBookingResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { benchKeys } from 'src/features/bench/api/query-keys';
import { bookingKeys } from 'src/features/bookings/api/query-keys';

export const acceptBooking = (id: string, body: AcceptBookingRequest) =>
  api.post<AcceptBookingResponse>(`/bookings/${encodeURIComponent(id)}/accept`, body);

export const useAcceptBooking = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: AcceptBookingRequest }) => acceptBooking(id, body),
    onSuccess: () => Promise.all([bookingKeys.all, benchKeys.all].map((queryKey) => queryClient.invalidateQueries({ queryKey }))),
    // Someone else took those hours meanwhile: read the bench again so the dialog offers what is free now.
    onError: (error) => {
      if (hasErrorCode(error, 'bench_time_taken')) void queryClient.invalidateQueries({ queryKey: benchKeys.all });
    },
  });
};
