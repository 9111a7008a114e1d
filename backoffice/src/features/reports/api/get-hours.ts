import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { DateRangeQuery, HoursReport } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { reportKeys } from './query-keys';

export const getHoursReport = (range: DateRangeQuery, signal?: AbortSignal) =>
  api.get<HoursReport>('/reports/hours', { query: { ...range }, signal });

export const hoursQueryOptions = (range: DateRangeQuery) =>
  queryOptions({
    queryKey: reportKeys.hours(range),
    queryFn: ({ signal }) => getHoursReport(range, signal),
    placeholderData: keepPreviousData,
  });

/** Waits while the range is not a valid one (the form says why). */
export const useHoursReport = (range: DateRangeQuery | null) =>
  useQuery({ ...hoursQueryOptions(range ?? { from: '', to: '' }), enabled: range !== null });
