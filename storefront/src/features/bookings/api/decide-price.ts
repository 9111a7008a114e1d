import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingDetail, PriceConsentInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from './query-keys';

export const decidePrice = ({ id, accept }: { id: string } & PriceConsentInput) =>
  api.post<BookingDetail>(`/bookings/${encodeURIComponent(id)}/price-consent`, { accept });

export const useDecidePrice = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: decidePrice,
    onSuccess: (booking) => {
      queryClient.setQueryData(bookingKeys.detail(booking.id), booking);
      void queryClient.invalidateQueries({ queryKey: bookingKeys.lists() });
    },
  });
};
