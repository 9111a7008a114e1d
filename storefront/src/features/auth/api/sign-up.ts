import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AuthSessionResponse, SignUpInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { switchPerson } from './get-me';

export const signUp = (input: SignUpInput) => api.post<AuthSessionResponse>('/auth/sign-up', input);

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: ({ user }) => switchPerson(queryClient, user),
  });
}
