import type { AlertProps } from '@mui/joy/Alert';
import { lazy, Suspense } from 'react';

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
