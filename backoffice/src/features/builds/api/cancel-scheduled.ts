import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { BookingDetail, CancellationPreview, CancelScheduledInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';
import { buildKeys } from './query-keys';

export const getCancellation = (id: string, signal?: AbortSignal) =>
  api.get<CancellationPreview>(`/bookings/${encodeURIComponent(id)}/cancellation`, { signal });

export const cancellationQueryOptions = (id: string) =>
  queryOptions({ queryKey: buildKeys.cancellation(id), queryFn: ({ signal }) => getCancellation(id, signal), staleTime: 0 });

export const useCancellation = (id: string | null) => useQuery({ ...cancellationQueryOptions(id ?? ''), enabled: Boolean(id) });

export const cancelScheduled = (id: string, body: CancelScheduledInput) =>
  api.post<BookingDetail>(`/bookings/${encodeURIComponent(id)}/cancel-scheduled`, body);

export const useCancelScheduled = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CancelScheduledInput) => cancelScheduled(id, body),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};
