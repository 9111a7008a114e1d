import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { DateRangeQuery, UtilisationReport } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { reportKeys } from './query-keys';

export const getUtilisation = (range: DateRangeQuery, signal?: AbortSignal) =>
  api.get<UtilisationReport>('/reports/utilisation', { query: { ...range }, signal });

export const utilisationQueryOptions = (range: DateRangeQuery) =>
  queryOptions({
    queryKey: reportKeys.utilisation(range),
    queryFn: ({ signal }) => getUtilisation(range, signal),
    placeholderData: keepPreviousData,
  });

/** Waits while the range is not a valid one (the form says why). */
export const useUtilisation = (range: DateRangeQuery | null) =>
  useQuery({ ...utilisationQueryOptions(range ?? { from: '', to: '' }), enabled: range !== null });
