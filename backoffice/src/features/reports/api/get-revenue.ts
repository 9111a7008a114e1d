import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { DateRangeQuery, RevenueReport } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { reportKeys } from './query-keys';

export const getRevenue = (range: DateRangeQuery, signal?: AbortSignal) =>
  api.get<RevenueReport>('/reports/revenue', { query: { ...range }, signal });

export const revenueQueryOptions = (range: DateRangeQuery) =>
  queryOptions({
    queryKey: reportKeys.revenue(range),
    queryFn: ({ signal }) => getRevenue(range, signal),
    placeholderData: keepPreviousData,
  });

/** Waits while the range is not a valid one (the form says why). */
export const useRevenue = (range: DateRangeQuery | null) =>
  useQuery({ ...revenueQueryOptions(range ?? { from: '', to: '' }), enabled: range !== null });
