import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from 'src/lib/api-client';
import { authKeys } from './get-me';

export const signOut = () => api.post<{ signedOut: true }>('/auth/sign-out');

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      // The next person at this bench computer must not see the last one's cached data.
      queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== 'shop' });
      queryClient.setQueryData(authKeys.me(), null);
    },
  });
}
