import { useEffect } from 'react';
import { useMatches } from 'react-router';

/** What a route may carry in its `handle`: the page's own name for the browser tab. */
export interface RouteTitleHandle {
  title?: string;
}

/** "My builds · Oakridge Rigs": the page, then the shop, then (in the backoffice) the app. */
export function documentTitle(page: string | undefined, shopName: string | undefined, app?: string): string {
  return [page, shopName || 'Loomwright', app].filter(Boolean).join(' · ');
}

/**
 * Keeps the browser tab's title on the page shown: the deepest matched route's `handle.title`,
 * with the shop's name (from its settings) after it, so a player with several tabs, a bookmark or
 * the history list can tell the pages apart and knows whose shop it is.
 */
export function useRouteTitle(shopName: string | undefined, app?: string): void {
  const matches = useMatches();
  const page = [...matches]
    .reverse()
    .map((m) => (m.handle as RouteTitleHandle | undefined)?.title)
    .find(Boolean);
  const title = documentTitle(page, shopName, app);
  useEffect(() => {
    document.title = title;
  }, [title]);
}
