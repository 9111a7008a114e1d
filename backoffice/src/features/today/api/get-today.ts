import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { TodayResponse, TodayScope } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { todayKeys } from './query-keys';

export const getToday = (scope: TodayScope | undefined, signal?: AbortSignal) =>
  api.get<TodayResponse>('/today', { query: scope ? { scope } : {}, signal });

export const todayQueryOptions = (scope: TodayScope | undefined) =>
  queryOptions({
    queryKey: todayKeys.scope(scope),
    queryFn: ({ signal }) => getToday(scope, signal),
    placeholderData: keepPreviousData,
    // A builder keeps this page open at the bench: refresh it now and then.
    refetchInterval: 60_000,
  });

export const useToday = (scope: TodayScope | undefined) => useQuery(todayQueryOptions(scope));
