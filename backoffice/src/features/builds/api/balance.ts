import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingDetail, RecordBalanceInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

/** E-mails the player the balance due again. */
export const requestBalance = (id: string) => api.post<BookingDetail>(`/bookings/${encodeURIComponent(id)}/balance/request`, {});

/** Records the whole balance taken at the counter (owner). */
export const recordBalance = (id: string, body: RecordBalanceInput) =>
  api.post<BookingDetail>(`/bookings/${encodeURIComponent(id)}/balance/record`, body);

export const useRequestBalance = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: () => requestBalance(id), onSuccess: () => invalidateBuild(queryClient, id) });
};

export const useRecordBalance = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: RecordBalanceInput) => recordBalance(id, body),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};
