import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AuthSessionResponse, SignInInput } from '@loomwright/shared';
import { api } from 'src/lib/api-client';
import { authKeys } from './get-me';

export const signIn = (input: SignInInput) => api.post<AuthSessionResponse>('/auth/sign-in', input);

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => {
      // Whatever was cached belonged to nobody (or somebody else): start clean as this person.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'shop' });
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
