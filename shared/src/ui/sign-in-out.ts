import { useMutation, useQueryClient } from '@tanstack/react-query';
import { createApiClient } from '../api-client';
import type { AuthSessionResponse, SignInInput } from '../auth-schemas';
import { switchPerson } from './get-me';

const api = createApiClient('/api');

/** Signs in (either app; the role decides what the app then shows) and swaps the cached person. */
export const signIn = (input: SignInInput) => api.post<AuthSessionResponse>('/auth/sign-in', input);

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: ({ user }) => switchPerson(queryClient, user),
  });
}

export const signOut = () => api.post<{ signedOut: true }>('/auth/sign-out');

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => switchPerson(queryClient, null),
  });
}
