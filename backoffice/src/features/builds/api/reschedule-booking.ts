import { useMutation, useQueryClient } from '@tanstack/react-query';
import { hasErrorCode, type RescheduleRequest, type RescheduleResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';
import { benchKeys } from 'src/features/bench/api/query-keys';

export const rescheduleBooking = (id: string, body: RescheduleRequest) =>
  api.post<RescheduleResponse>(`/bookings/${encodeURIComponent(id)}/reschedule`, body);

export const useRescheduleBooking = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: RescheduleRequest }) => rescheduleBooking(id, body),
    onSuccess: (_, { id }) => invalidateBuild(queryClient, id),
    // Someone else took those hours meanwhile: read the bench again so the dialog offers what is free now.
    onError: (error) => {
      if (hasErrorCode(error, 'bench_time_taken')) void queryClient.invalidateQueries({ queryKey: benchKeys.all });
    },
  });
};
