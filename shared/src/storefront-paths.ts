/**
 * Every page the storefront's router has (`storefront/src/app/router.tsx`; a storefront test keeps
 * the two lists equal). The API answers any other path with the app and a real 404 status, so a
 * mistyped address is "not found" to a browser and a search engine alike, not a soft 404.
 */
export const storefrontPaths = [
  '/',
  '/sign-in',
  '/sign-up',
  '/forgot-password',
  '/reset-password',
  '/account',
  '/configure',
  '/request',
  '/configurations',
  '/c/:code',
  '/checkout/return',
  '/builds',
  '/builds/:id',
] as const;

const patterns = storefrontPaths.map((p) => p.split('/').filter(Boolean));

/** True when the storefront has a page at this path (`:id` stands for any one segment). */
export function isStorefrontPath(pathname: string): boolean {
  const segments = pathname.split('/').filter(Boolean);
  return patterns.some(
    (pattern) => pattern.length === segments.length && pattern.every((part, i) => part.startsWith(':') || part === segments[i]),
  );
}
