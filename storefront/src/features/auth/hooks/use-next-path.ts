import { safeNextPath } from '@loomwright/shared';
import { useSearchParams } from 'react-router';

/**
 * Where the player was headed before being asked to sign in (`?next=`), for instance the
 * configurator's request page with their draft in its URL. Only paths inside the storefront.
 */
export function useNextPath(fallback = '/builds'): string {
  const [params] = useSearchParams();
  return safeNextPath(params.get('next'), fallback);
}

/** A link to another account page that keeps the same `next`. */
export function withNext(path: string, next: string | null): string {
  return next ? `${path}?next=${encodeURIComponent(next)}` : path;
}
