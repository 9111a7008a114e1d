import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BenchSuggestResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

/** Each builder's earliest start for a scheduled build, planned as if its own hours were free. */
export const getMoveOptions = (bookingId: string, signal?: AbortSignal) =>
  api.get<BenchSuggestResponse>('/bench/suggest', { query: { bookingId }, signal });

export const moveOptionsQueryOptions = (bookingId: string) =>
  queryOptions({
    queryKey: ['bench', 'suggest', bookingId],
    queryFn: ({ signal }) => getMoveOptions(bookingId, signal),
    staleTime: 0,
  });

export const useMoveOptions = (bookingId: string | null) =>
  useQuery({ ...moveOptionsQueryOptions(bookingId ?? ''), enabled: Boolean(bookingId) });
