import type { AlertProps } from '@mui/joy/Alert';
import { lazy, Suspense, useEffect, useState } from 'react';

let loaded: typeof import('@mui/joy/Alert') | undefined;
const loadAlert = () => import('@mui/joy/Alert').then((module) => (loaded = module));
const LazyAlert = lazy(loadAlert);

/**
 * Joy's Alert, fetched the first time one is shown. The configurator's first screen shows one only
 * when something went wrong or a draft board was restored, so Alert stays out of `/configure`'s
 * first load. Once fetched (or fetched ahead by `preloadLateAlert`, when a draft is waiting) it
 * renders at once, without a Suspense pause that would move the screen below it.
 */
export function LateAlert(props: AlertProps) {
  if (loaded) return <loaded.default {...props} />;
  return (
    <Suspense fallback={null}>
      <LazyAlert {...props} />
    </Suspense>
  );
}

export const preloadLateAlert = () => void loadAlert();

/**
 * True once Alert's code is in (at once when `wanted` is false). A screen that will show an Alert on
 * its first draw waits for this, so the Alert arrives with the screen instead of after it, where it
 * would push down what was already drawn below it.
 */
export function useLateAlertReady(wanted: boolean) {
  const [ready, setReady] = useState(() => !wanted || loaded !== undefined);
  useEffect(() => {
    if (ready) return;
    let current = true;
    // A failed fetch does not hold the screen back: LateAlert's own Suspense takes over then.
    const done = () => current && setReady(true);
    loadAlert().then(done, done);
    return () => {
      current = false;
    };
  }, [ready]);
  return ready;
}
