import { lazy, type ComponentType } from 'react';
import { BrowserRouter, useRoutes, type RouteObject } from 'react-router';
import { queryClient } from 'src/app/query-client';
import { AppLayout } from 'src/components/AppLayout';
import { Page } from 'src/components/Page';
import { RouteErrorBoundary } from 'src/components/RouteError';
import { catalogQueryOptions } from 'src/features/configurator/api/get-catalog';

/**
 * A page in its own chunk: the module's `Component`, fetched the first time the page is shown, so
 * the first load ships only what the first screen needs. `title` names the browser tab.
 */
function page(title: string, load: () => Promise<{ Component: ComponentType }>, options: { voice?: boolean } = {}) {
  const Screen = lazy(() => load().then((module) => ({ default: module.Component })));
  return <Page title={title} screen={Screen} voice={options.voice} />;
}

// React Router's declarative mode (BrowserRouter + useRoutes): the storefront uses no loaders,
// actions or fetchers, and the data router's code was 17 kB of the first load's gzipped JavaScript.
// A new page also goes into `storefrontPaths` (@loomwright/shared), or the API answers it with 404.
export const routes: RouteObject[] = [
  {
    path: '/',
    element: <AppLayout />,
    children: [
      // The home page writes no figure, so it does not wait for the shop's voice: its words are in the
      // prerendered home.html and stay there (hydrated, not redrawn) when the script arrives.
      { index: true, element: page('Pedalboards wired by hand', () => import('src/app/routes/home'), { voice: false }) },
      { path: 'sign-in', element: page('Sign in', () => import('src/app/routes/sign-in')) },
      { path: 'sign-up', element: page('Create your account', () => import('src/app/routes/sign-up')) },
      { path: 'forgot-password', element: page('Forgot your password?', () => import('src/app/routes/forgot-password')) },
      { path: 'reset-password', element: page('Choose a new password', () => import('src/app/routes/reset-password')) },
      { path: 'account', element: page('My account', () => import('src/app/routes/account')) },
      {
        path: 'configure',
        // The price book is asked for beside the screen's code, not after it has loaded.
        element: page(
          'Configure your board',
          () => {
            // Not while the build prerenders the page: there is no API to ask then.
            if (!import.meta.env.SSR) void queryClient.prefetchQuery(catalogQueryOptions());
            return import('src/app/routes/configure');
            // Its first screen (headings, step bar) writes no figure and is prerendered into configure.html;
            // the screen waits for the shop's voice itself, around the configurator.
          },
          { voice: false },
        ),
      },
      { path: 'request', element: page('Request this build', () => import('src/app/routes/request')) },
      { path: 'configurations', element: page('Saved boards', () => import('src/app/routes/configurations')) },
      // A short link to a configuration (POST /api/configuration-links); ?c= links keep working.
      { path: 'c/:code', element: page('Configure your board', () => import('src/app/routes/short-link')) },
      { path: 'checkout/return', element: page('Your payment', () => import('src/app/routes/checkout-return')) },
      { path: 'builds', element: page('My builds', () => import('src/app/routes/builds')) },
      { path: 'builds/:id', element: page('Your build', () => import('src/app/routes/build-detail')) },
      { path: '*', element: page('Page not found', () => import('src/app/routes/not-found')) },
    ],
  },
];

/** The pages in the layout, under whichever router the caller gives (the browser's, or the prerender's static one). */
export function AppRoutes() {
  return <RouteErrorBoundary>{useRoutes(routes)}</RouteErrorBoundary>;
}

export function AppRouter() {
  return (
    <BrowserRouter>
      <AppRoutes />
    </BrowserRouter>
  );
}
