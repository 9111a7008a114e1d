import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from 'src/lib/api-client';
import { switchPerson } from './get-me';

export const signOut = () => api.post<{ signedOut: true }>('/auth/sign-out');

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => switchPerson(queryClient, null),
  });
}
