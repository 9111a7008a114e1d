import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { BookingSummary, Page } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from './query-keys';

export const getBookings = (params: { page: number; pageSize: number }, signal?: AbortSignal) =>
  api.get<Page<BookingSummary>>('/bookings', { query: { ...params, sort: 'created_at', order: 'desc' }, signal });

export const bookingsQueryOptions = (params: { page: number; pageSize: number }) =>
  queryOptions({
    queryKey: bookingKeys.list(params),
    queryFn: ({ signal }) => getBookings(params, signal),
    placeholderData: keepPreviousData,
  });

export const useBookings = (params: { page: number; pageSize: number }) => useQuery(bookingsQueryOptions(params));
