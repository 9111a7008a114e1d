import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionsEnded } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { sessionKeys } from './query-keys';

export const endSessions = (userId: string) =>
  api.request<SessionsEnded>(`/users/${encodeURIComponent(userId)}/sessions`, { method: 'DELETE' });

/** Signs a person out of every device (owner only). */
export const useEndSessions = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: string) => endSessions(userId),
    onSuccess: (_data, userId) => queryClient.invalidateQueries({ queryKey: sessionKeys.person(userId) }),
  });
};
