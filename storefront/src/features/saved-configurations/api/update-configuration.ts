import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SavedConfiguration, UpdateConfigurationInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { configurationKeys } from './query-keys';

/** Renames a saved configuration, saves changes to it, or both. */
export const updateConfiguration = ({ id, ...change }: UpdateConfigurationInput & { id: string }) =>
  api.request<SavedConfiguration>(`/configurations/${encodeURIComponent(id)}`, { method: 'PATCH', body: change });

export const useUpdateConfiguration = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateConfiguration,
    onSuccess: (saved) => {
      queryClient.setQueryData(configurationKeys.detail(saved.id), saved);
      void queryClient.invalidateQueries({ queryKey: configurationKeys.list() });
    },
  });
};
