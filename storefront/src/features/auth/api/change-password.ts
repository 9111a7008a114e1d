import { useMutation } from '@tanstack/react-query';
import type { AuthSessionResponse, PasswordChangeInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

/** Every other device is signed out; this one gets a fresh session cookie with the answer. */
export const changePassword = (input: PasswordChangeInput) => api.post<AuthSessionResponse>('/auth/password', input);

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
