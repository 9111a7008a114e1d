import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from 'src/lib/api-client';

export const removeClosure = (id: string) => api.request<void>(`/settings/closures/${encodeURIComponent(id)}`, { method: 'DELETE' });

export const useRemoveClosure = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeClosure,
    onSuccess: () => Promise.all(['settings', 'bench'].map((key) => queryClient.invalidateQueries({ queryKey: [key] }))),
  });
};
