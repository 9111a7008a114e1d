import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AuthSessionResponse, PasswordResetConfirmInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { switchPerson } from './get-me';

export const confirmPasswordReset = (input: PasswordResetConfirmInput) =>
  api.post<AuthSessionResponse>('/auth/password-reset/confirm', input);

/** A successful reset also signs the player in. */
export function useConfirmPasswordReset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: confirmPasswordReset,
    onSuccess: ({ user }) => switchPerson(queryClient, user),
  });
}
