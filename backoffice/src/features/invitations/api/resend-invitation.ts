import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InvitationResent } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const resendInvitation = (builderId: string) => api.post<InvitationResent>(`/invitations/${builderId}/resend`, {});

/** The owner mails a fresh invitation link; the one sent before stops working. */
export const useResendInvitation = () => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: resendInvitation, onSuccess: () => queryClient.invalidateQueries({ queryKey: ['team'] }) });
};
