import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { BenchView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { benchKeys } from './query-keys';

export interface BenchQuery {
  from: string;
  to: string;
  builderId?: string;
}

export const getBench = (query: BenchQuery, signal?: AbortSignal) => api.get<BenchView>('/bench', { query: { ...query }, signal });

export const benchQueryOptions = (query: BenchQuery) =>
  queryOptions({
    queryKey: benchKeys.view(query),
    queryFn: ({ signal }) => getBench(query, signal),
    placeholderData: keepPreviousData,
  });

export const useBench = (query: BenchQuery) => useQuery(benchQueryOptions(query));
