import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { hasErrorCode, isShopAwayError, isSignedOutError } from '../api-client';
import { authKeys, ME_RETRY_MS } from './get-me';

/** How many times a screen's read is tried again before its error shows. */
const MAX_RETRIES = 2;
/** The longest rate-limit wait worth sitting out with a spinner; a longer one shows its "wait, then try again" at once. */
const MAX_RATE_LIMIT_WAIT_SECONDS = 10;

/**
 * Whether a failed read can answer differently if asked again, decided by its code: no answer at all
 * (`unreachable`), the shop's database away (`shop_unavailable`), the payment provider not answering
 * (`payment_provider_error`), or a rate limit whose Retry-After is short (`too_many_attempts`, asked
 * again after that wait). Every other code (a wrong field, a missing record, a refused role, a
 * session ended, a price book not yet published, the server's own failure) answers the same each time.
 */
export function canSucceedOnRetry(error: unknown): boolean {
  if (hasErrorCode(error, 'too_many_attempts')) return (error.retryAfterSeconds ?? Infinity) <= MAX_RATE_LIMIT_WAIT_SECONDS;
  return hasErrorCode(error, 'unreachable', 'shop_unavailable', 'payment_provider_error');
}

/** TanStack Query's `retry` option: up to two more tries, only for what can succeed on retry. */
export const retryRead = (failureCount: number, error: unknown) => failureCount < MAX_RETRIES && canSucceedOnRetry(error);

/** TanStack Query's `retryDelay`: a rate limit waits its Retry-After; anything else backs off as TanStack Query does by default. */
export const retryReadDelay = (failureCount: number, error: unknown) =>
  hasErrorCode(error, 'too_many_attempts') && error.retryAfterSeconds !== undefined
    ? error.retryAfterSeconds * 1000
    : Math.min(1000 * 2 ** failureCount, 30_000);

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
        retry: retryRead,
        retryDelay: retryReadDelay,
        // While the shop is not answering (503, or no connection), failed screens ask again on their
        // own, so they come back when the shop does, with nobody signed out meanwhile.
        refetchInterval: (query) => (isShopAwayError(query.state.error) ? ME_RETRY_MS : false),
      },
    },
  });
  return client;
}
