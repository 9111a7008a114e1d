import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AddClosureResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { benchKeys } from 'src/features/bench/api/query-keys';
import { settingsKeys } from './query-keys';

export interface ClosureInput {
  startsOn: string;
  endsOn: string;
  reason: string;
}

export const addClosure = (body: ClosureInput) => api.post<AddClosureResponse>('/settings/closures', body);

export const useAddClosure = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addClosure,
    onSuccess: () => Promise.all([settingsKeys.all, benchKeys.all].map((queryKey) => queryClient.invalidateQueries({ queryKey }))),
  });
};
