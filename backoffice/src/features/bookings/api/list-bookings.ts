import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { BookingState, BookingSummary, DepositStatus, Page } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from './query-keys';

export type BookingSort = 'created_at' | 'updated_at' | 'reference' | 'state' | 'bench_date';

export interface BookingListQuery {
  page: number;
  pageSize: number;
  sort: BookingSort;
  order: 'asc' | 'desc';
  /** One state, or several joined by commas ("scheduled,on_bench"). */
  state?: BookingState | string;
  deposit?: DepositStatus;
  /** Customer name, e-mail or booking reference. */
  q?: string;
}

export const listBookings = (query: BookingListQuery, signal?: AbortSignal) =>
  api.get<Page<BookingSummary>>('/bookings', { query: { ...query }, signal });

export const bookingsQueryOptions = (query: BookingListQuery) =>
  queryOptions({
    queryKey: bookingKeys.list(query),
    queryFn: ({ signal }) => listBookings(query, signal),
    // The old page stays on screen while the next one loads, so the table never jumps to empty.
    placeholderData: keepPreviousData,
  });

export const useBookings = (query: BookingListQuery) => useQuery(bookingsQueryOptions(query));
