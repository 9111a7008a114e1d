import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { isCalendarDay, type BenchPreview } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { benchKeys } from './query-keys';

export interface BenchPreviewQuery {
  bookingId: string;
  benchDate: string;
  builderId: string;
}

export const getBenchPreview = (query: BenchPreviewQuery, signal?: AbortSignal) =>
  api.get<BenchPreview>('/bench/preview', { query: { ...query }, signal });

export const benchPreviewQueryOptions = (query: BenchPreviewQuery) =>
  queryOptions({
    queryKey: benchKeys.preview(query),
    queryFn: ({ signal }) => getBenchPreview(query, signal),
    placeholderData: keepPreviousData,
    staleTime: 0,
  });

/** The preview of one builder and day, for the accept and move dialogs (null until chosen). */
export function useBenchPreview(bookingId: string | null, builderId: string | null, benchDate: string) {
  const ready = Boolean(bookingId && builderId && isCalendarDay(benchDate));
  return useQuery({ ...benchPreviewQueryOptions({ bookingId: bookingId ?? '', builderId: builderId ?? '', benchDate }), enabled: ready });
}
