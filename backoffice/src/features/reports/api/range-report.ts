import { keepPreviousData, queryOptions, useQuery, type QueryKey } from '@tanstack/react-query';
import type { DateRangeQuery } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

/**
 * A report over a date range (`GET /api/reports/<name>?from&to`): its fetcher, its query options
 * (the last answer stays on screen while the next range loads) and its hook, which waits while the
 * range is not a valid one (the form says why).
 */
export function rangeReport<T>(path: string, key: (range: DateRangeQuery) => QueryKey) {
  const get = (range: DateRangeQuery, signal?: AbortSignal) => api.get<T>(path, { query: { ...range }, signal });
  const options = (range: DateRangeQuery) =>
    queryOptions({ queryKey: key(range), queryFn: ({ signal }) => get(range, signal), placeholderData: keepPreviousData });
  const useReport = (range: DateRangeQuery | null) => useQuery({ ...options(range ?? { from: '', to: '' }), enabled: range !== null });
  return { get, options, useReport };
}
