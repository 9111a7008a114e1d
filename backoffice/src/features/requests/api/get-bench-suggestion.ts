import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BenchSuggestResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const getBenchSuggestion = (bookingId: string, signal?: AbortSignal) =>
  api.get<BenchSuggestResponse>('/bench/suggest', { query: { bookingId }, signal });

export const benchSuggestionQueryOptions = (bookingId: string) =>
  queryOptions({
    queryKey: ['bench', 'suggest', bookingId],
    queryFn: ({ signal }) => getBenchSuggestion(bookingId, signal),
    // The bench moves whenever anyone accepts a build; always ask afresh when the dialog opens.
    staleTime: 0,
  });

export const useBenchSuggestion = (bookingId: string | null) =>
  useQuery({ ...benchSuggestionQueryOptions(bookingId ?? ''), enabled: Boolean(bookingId) });
