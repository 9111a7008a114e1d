import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShopClosureView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export interface ClosureInput {
  startsOn: string;
  endsOn: string;
  reason: string;
}

export const addClosure = (body: ClosureInput) => api.post<ShopClosureView>('/settings/closures', body);

export const useAddClosure = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addClosure,
    onSuccess: () => Promise.all(['settings', 'bench'].map((key) => queryClient.invalidateQueries({ queryKey: [key] }))),
  });
};
