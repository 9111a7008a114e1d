import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BookingStateResponse, DecideExtraInput, ExtraView } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { bookingKeys } from './query-keys';

/** The player's yes or no to an extra (with its price) or to the waiting layout, with an optional comment. */
export type ApprovalAnswer = { bookingId: string; comment?: string; approve: boolean } & (
  { kind: 'extra'; extraId: string } | { kind: 'layout' }
);

export const answerApproval = (answer: ApprovalAnswer): Promise<ExtraView | BookingStateResponse> => {
  const body: DecideExtraInput = { approve: answer.approve, ...(answer.comment ? { comment: answer.comment } : {}) };
  const booking = encodeURIComponent(answer.bookingId);
  return answer.kind === 'extra'
    ? api.post<ExtraView>(`/bookings/${booking}/extras/${encodeURIComponent(answer.extraId)}/decision`, body)
    : api.post<BookingStateResponse>(`/bookings/${booking}/layout/decision`, body);
};

export const useAnswerApproval = () => {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: answerApproval,
    onSuccess: (_, answer) => {
      void queryClient.invalidateQueries({ queryKey: bookingKeys.detail(answer.bookingId) });
      void queryClient.invalidateQueries({ queryKey: bookingKeys.lists() });
    },
  });
};
