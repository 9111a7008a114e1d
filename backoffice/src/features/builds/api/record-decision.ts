import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RecordedDecisionInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { invalidateBuild } from './invalidate';

/** Staff record the player's answer given by phone, in person or by e-mail (an extra, or the waiting layout). */
export const recordDecision = (id: string, target: { extraId: string } | { layout: true }, body: RecordedDecisionInput) =>
  api.post(
    'extraId' in target
      ? `/bookings/${encodeURIComponent(id)}/extras/${encodeURIComponent(target.extraId)}/recorded-decision`
      : `/bookings/${encodeURIComponent(id)}/layout/recorded-decision`,
    body,
  );

export const useRecordDecision = (id: string) => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ target, body }: { target: { extraId: string } | { layout: true }; body: RecordedDecisionInput }) =>
      recordDecision(id, target, body),
    onSuccess: () => invalidateBuild(queryClient, id),
  });
};
