import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptInvitationInput, AuthSessionResponse } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { switchPerson } from './get-me';

export const acceptInvitation = (input: AcceptInvitationInput) => api.post<AuthSessionResponse>('/invitations/accept', input);

/** Accepting sets the first password and signs the new builder in. */
export function useAcceptInvitation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: acceptInvitation,
    onSuccess: ({ user }) => switchPerson(queryClient, user),
  });
}
