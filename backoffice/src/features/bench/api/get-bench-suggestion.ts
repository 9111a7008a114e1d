import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BenchSuggestResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { benchKeys } from './query-keys';

/**
 * Each builder's earliest start for a booking: for a request, its first free bench time; for a
 * scheduled build, planned as if its own hours were free (the move dialog).
 */
export const getBenchSuggestion = (bookingId: string, signal?: AbortSignal) =>
  api.get<BenchSuggestResponse>('/bench/suggest', { query: { bookingId }, signal });

export const benchSuggestionQueryOptions = (bookingId: string) =>
  queryOptions({
    queryKey: benchKeys.suggestion(bookingId),
    queryFn: ({ signal }) => getBenchSuggestion(bookingId, signal),
    // The bench moves whenever anyone accepts a build; always ask afresh when the dialog opens.
    staleTime: 0,
  });

export const useBenchSuggestion = (bookingId: string | null) =>
  useQuery({ ...benchSuggestionQueryOptions(bookingId ?? ''), enabled: Boolean(bookingId) });
