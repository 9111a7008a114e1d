import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BookingDetail } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from './query-keys';

export const getBooking = (id: string, signal?: AbortSignal) => api.get<BookingDetail>(`/bookings/${encodeURIComponent(id)}`, { signal });

export const bookingQueryOptions = (id: string) =>
  queryOptions({ queryKey: bookingKeys.detail(id), queryFn: ({ signal }) => getBooking(id, signal) });

/** `pollUntil` keeps asking every 1.5 s until it returns true (used while a webhook is on its way). */
export const useBooking = (id: string, pollUntil?: (booking: BookingDetail) => boolean) =>
  useQuery({
    ...bookingQueryOptions(id),
    refetchInterval: pollUntil ? (query) => (query.state.data && pollUntil(query.state.data) ? false : 1500) : false,
  });
