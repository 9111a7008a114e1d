import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AuthSessionResponse, SignInInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { switchPerson } from './get-me';

export const signIn = (input: SignInInput) => api.post<AuthSessionResponse>('/auth/sign-in', input);

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => switchPerson(queryClient, user),
  });
}
