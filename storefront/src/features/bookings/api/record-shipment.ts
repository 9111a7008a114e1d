import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingDetail, ShipmentInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from './query-keys';

export const recordShipment = ({ id, ...input }: ShipmentInput & { id: string }) =>
  api.post<BookingDetail>(`/bookings/${encodeURIComponent(id)}/shipment`, input);

export const useRecordShipment = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordShipment,
    onSuccess: (booking) => queryClient.setQueryData(bookingKeys.detail(booking.id), booking),
  });
};
