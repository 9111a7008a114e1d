import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BookingDetail } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from './query-keys';

export const getBooking = (id: string, signal?: AbortSignal) => api.get<BookingDetail>(`/bookings/${encodeURIComponent(id)}`, { signal });

export const bookingQueryOptions = (id: string) =>
  queryOptions({ queryKey: bookingKeys.detail(id), queryFn: ({ signal }) => getBooking(id, signal) });

export const useBooking = (id: string | null | undefined) => useQuery({ ...bookingQueryOptions(id ?? ''), enabled: Boolean(id) });
