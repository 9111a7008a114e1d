import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ExtraView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

export interface ExtraInput {
  description: string;
  /** A decimal string such as "45.00". */
  amount: string;
  reason: string;
}

export const proposeExtra = (id: string, body: ExtraInput) => api.post<ExtraView>(`/bookings/${encodeURIComponent(id)}/extras`, body);

export const useProposeExtra = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: ExtraInput) => proposeExtra(id, body),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};
