import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SavedConfiguration } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { configurationKeys } from './query-keys';

export const duplicateConfiguration = ({ id, name }: { id: string; name?: string }) =>
  api.post<SavedConfiguration>(`/configurations/${encodeURIComponent(id)}/duplicate`, name ? { name } : {});

export const useDuplicateConfiguration = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: duplicateConfiguration,
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: configurationKeys.list() }),
  });
};
