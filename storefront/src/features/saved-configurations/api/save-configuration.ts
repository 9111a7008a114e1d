import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SavedConfiguration, SaveConfigurationInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { configurationKeys } from './query-keys';

export const saveConfiguration = (input: SaveConfigurationInput) => api.post<SavedConfiguration>('/configurations', input);

export const useSaveConfiguration = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: saveConfiguration,
    onSuccess: (saved) => {
      queryClient.setQueryData(configurationKeys.detail(saved.id), saved);
      void queryClient.invalidateQueries({ queryKey: configurationKeys.list() });
    },
  });
};
