import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingDetail, RigConfiguration } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from './query-keys';

export const createBooking = (input: { configuration: Partial<RigConfiguration>; notes?: string }) =>
  api.post<BookingDetail>('/bookings', input);

export const useCreateBooking = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBooking,
    onSuccess: (booking) => {
      queryClient.setQueryData(bookingKeys.detail(booking.id), booking);
      void queryClient.invalidateQueries({ queryKey: bookingKeys.lists() });
    },
  });
};
