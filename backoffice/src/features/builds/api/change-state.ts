import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingStateResponse, ChangeStateRequest } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

export const changeState = (id: string, body: ChangeStateRequest) =>
  api.post<BookingStateResponse>(`/bookings/${encodeURIComponent(id)}/state`, body);

export const useChangeState = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ChangeStateRequest) => changeState(id, body),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};
