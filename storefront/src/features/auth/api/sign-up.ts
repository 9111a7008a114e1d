import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AuthSessionResponse, SignUpInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { authKeys } from './get-me';

export const signUp = (input: SignUpInput) => api.post<AuthSessionResponse>('/auth/sign-up', input);

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    onSuccess: ({ user }) => {
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'shop' });
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
