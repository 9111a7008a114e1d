import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from 'src/lib/api-client';
import { configurationKeys } from './query-keys';

export const deleteConfiguration = (id: string) => api.request<void>(`/configurations/${encodeURIComponent(id)}`, { method: 'DELETE' });

export const useDeleteConfiguration = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteConfiguration,
    onSuccess: (_nothing, id) => {
      queryClient.removeQueries({ queryKey: configurationKeys.detail(id) });
      void queryClient.invalidateQueries({ queryKey: configurationKeys.list() });
    },
  });
};
