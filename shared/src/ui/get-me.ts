import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import type { AuthSessionResponse } from '../auth-schemas';
import type { AuthUser } from '../domain';
import { createApiClient, isSignedOutError } from '../api-client';

const api = createApiClient('/api');

/** Every query about the signed-in person lives under this key; sign-in and sign-out reset it. */
export const authKeys = { all: ['auth'] as const, me: () => [...authKeys.all, 'me'] as const };

/**
 * The signed-in person (player or staff), or null when nobody is signed in. Asked of
 * `GET /api/auth/session`, which answers 200 `{ user: null }` to a visitor, so a signed-out page
 * logs no failed request; a 401 (an older API) still reads as nobody. Any other failure (a 503 while the shop's database is down, no connection)
 * stays an error: it says nothing about who is signed in, so screens show ShopUnavailable rather
 * than sending the person to sign in.
 */
export async function getMe(signal?: AbortSignal): Promise<AuthUser | null> {
  try {
    return (await api.get<AuthSessionResponse>('/auth/session', { signal })).user;
  } catch (error) {
    if (isSignedOutError(error)) return null;
    throw error;
  }
}

/** While the shop is not answering, ask again every 10 s, so every screen recovers by itself when it returns. */
export const ME_RETRY_MS = 10_000;

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
    refetchInterval: (query) => (query.state.status === 'error' ? ME_RETRY_MS : false),
  });

export const useMe = () => useQuery(meQueryOptions());

/**
 * After a sign-in, sign-up or sign-out: drop everything cached for the previous person (the shop
 * profile stays), then record who is here now. The "me" query is updated in place rather than
 * removed, so every screen watching it re-renders at once.
 */
export function switchPerson(queryClient: QueryClient, user: AuthUser | null): void {
  queryClient.removeQueries({ predicate: (q) => !['shop', 'auth'].includes(String(q.queryKey[0])) });
  queryClient.setQueryData(authKeys.me(), user);
}
