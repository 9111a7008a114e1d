import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiError, isShopAwayError, isSignedOutError } from '../api-client';
import { authKeys, ME_RETRY_MS } from './get-me';

/** The one QueryClient setup both apps use. */
export function createQueryClient() {
  // A 401 from any call means the session ran out: ask "who is signed in?" again, so the screens
  // that depend on it (the header, the staff guard) catch up at once.
  const onError = (error: unknown) => {
    if (isSignedOutError(error)) void client.invalidateQueries({ queryKey: authKeys.me() });
  };
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // A 4xx will not change on retry; only network trouble and 5xx are worth another try.
        retry: (count, error) => count < 2 && !(error instanceof ApiError && error.status >= 400 && error.status < 500),
        // While the shop is not answering (503, or no connection), failed screens ask again on their
        // own, so they come back when the shop does, with nobody signed out meanwhile.
        refetchInterval: (query) => (isShopAwayError(query.state.error) ? ME_RETRY_MS : false),
      },
    },
  });
  return client;
}
