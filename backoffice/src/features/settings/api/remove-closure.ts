import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from 'src/lib/api-client';
import { benchKeys } from 'src/features/bench/api/query-keys';
import { settingsKeys } from './query-keys';

export const removeClosure = (id: string) => api.request<void>(`/settings/closures/${encodeURIComponent(id)}`, { method: 'DELETE' });

export const useRemoveClosure = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeClosure,
    onSuccess: () => Promise.all([settingsKeys.all, benchKeys.all].map((queryKey) => queryClient.invalidateQueries({ queryKey }))),
  });
};
