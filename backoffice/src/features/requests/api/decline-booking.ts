import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingDetail } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from 'src/features/bookings/api/query-keys';

export const declineBooking = (id: string, reason: string) =>
  api.post<BookingDetail>(`/bookings/${encodeURIComponent(id)}/decline`, { reason });

export const useDeclineBooking = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, reason }: { id: string; reason: string }) => declineBooking(id, reason),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: bookingKeys.all }),
  });
};
