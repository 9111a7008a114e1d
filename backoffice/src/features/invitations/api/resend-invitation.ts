import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InvitationResent } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { teamKeys } from 'src/features/team/api/query-keys';

export const resendInvitation = (builderId: string) => api.post<InvitationResent>(`/invitations/${builderId}/resend`, {});

/** The owner mails a fresh invitation link; the one sent before stops working. */
export const useResendInvitation = () => {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: resendInvitation, onSuccess: () => queryClient.invalidateQueries({ queryKey: teamKeys.all }) });
};
