import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuthUser } from '@loomwright/shared';
import { api } from 'src/lib/api-client';

export const getMe = (signal?: AbortSignal) => api.get<AuthUser>('/auth/me', { signal });

export const meQueryOptions = () =>
  queryOptions({ queryKey: ['auth', 'me'], queryFn: ({ signal }) => getMe(signal), staleTime: 5 * 60_000 });

/** The signed-in person (role decides what the owner-only controls show). */
export const useMe = () => useQuery(meQueryOptions());
