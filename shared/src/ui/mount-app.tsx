import { StrictMode, type ComponentType, type ReactNode } from 'react';
import { createRoot } from 'react-dom/client';

/** Renders an app's router inside its providers into the page's `#root`, in React's StrictMode. */
export function mountApp(Providers: ComponentType<{ children: ReactNode }>, Router: ComponentType) {
  createRoot(document.getElementById('root')!).render(
    <StrictMode>
      <Providers>
        <Router />
      </Providers>
    </StrictMode>,
  );
}
