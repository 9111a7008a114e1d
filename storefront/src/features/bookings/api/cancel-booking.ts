import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingDetail } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from './query-keys';

export const cancelBooking = ({ id, reason }: { id: string; reason?: string }) =>
  api.post<BookingDetail>(`/bookings/${encodeURIComponent(id)}/cancel`, reason ? { reason } : {});

export const useCancelBooking = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelBooking,
    onSuccess: (booking) => {
      queryClient.setQueryData(bookingKeys.detail(booking.id), booking);
      void queryClient.invalidateQueries({ queryKey: bookingKeys.lists() });
    },
  });
};
