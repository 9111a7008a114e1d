import type { ReactNode } from 'react';
import { ErrorBoundary } from 'react-error-boundary';
import { useLocation } from 'react-router';
import { RouteErrorScreen } from '@loomwright/shared/ui';

/**
 * A page that throws while it loads (its chunk could not be fetched) or renders shows the error
 * screen instead of a blank window; following a link to another page leaves it.
 */
export function RouteErrorBoundary({ children }: { children: ReactNode }) {
  const { pathname } = useLocation();
  return (
    <ErrorBoundary resetKeys={[pathname]} fallbackRender={({ error }) => <RouteErrorScreen homeHref="/" error={error} />}>
      {children}
    </ErrorBoundary>
  );
}
