import { startTransition, useEffect, useState } from 'react';

/** Set by main.tsx while React takes over a prerendered page; the first page to see it through clears it. */
export const hydration = { pending: false };

/**
 * False while React takes over the prerendered page (and while the build prerenders it), true after:
 * a page's data-dependent parts wait for it, so the first render equals the HTML even when the data is
 * already cached. The switch is a transition, so a page whose data is in by then is drawn in slices
 * that yield to the browser, not in one blocking task. Pages drawn by the browser alone start true.
 */
export function useHydrated() {
  const [hydrated, setHydrated] = useState(() => !import.meta.env.SSR && !hydration.pending);
  useEffect(() => {
    if (hydrated) return;
    hydration.pending = false;
    startTransition(() => setHydrated(true));
  }, [hydrated]);
  return hydrated;
}
