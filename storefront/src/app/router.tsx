import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router';
import { queryClient } from 'src/app/query-client';
import { AppLayout } from 'src/components/AppLayout';
import { RouteError } from 'src/components/RouteError';
import { catalogQueryOptions } from 'src/features/configurator/api/get-catalog';
import type { RouteTitleHandle } from '@loomwright/shared/ui';

/** Each route's `handle.title` names its browser tab: "My builds · <shop name>". */
const titled = (title: string): RouteTitleHandle => ({ title });

// Each screen is its own chunk, so the first load ships only what the first screen needs.
// A new page also goes into `storefrontPaths` (@loomwright/shared), or the API answers it with 404.
export const routes: RouteObject[] = [
  {
    path: '/',
    element: <AppLayout />,
    errorElement: <RouteError />,
    children: [
      { index: true, handle: titled('Pedalboards wired by hand'), lazy: () => import('src/app/routes/home') },
      { path: 'sign-in', handle: titled('Sign in'), lazy: () => import('src/app/routes/sign-in') },
      { path: 'sign-up', handle: titled('Create your account'), lazy: () => import('src/app/routes/sign-up') },
      { path: 'forgot-password', handle: titled('Forgot your password?'), lazy: () => import('src/app/routes/forgot-password') },
      { path: 'reset-password', handle: titled('Choose a new password'), lazy: () => import('src/app/routes/reset-password') },
      { path: 'account', handle: titled('My account'), lazy: () => import('src/app/routes/account') },
      {
        path: 'configure',
        handle: titled('Configure your board'),
        // A static loader runs beside lazy(): the price book is on its way while the screen's code loads.
        loader: () => {
          void queryClient.prefetchQuery(catalogQueryOptions());
          return null;
        },
        lazy: () => import('src/app/routes/configure'),
      },
      { path: 'request', handle: titled('Request this build'), lazy: () => import('src/app/routes/request') },
      { path: 'configurations', handle: titled('Saved boards'), lazy: () => import('src/app/routes/configurations') },
      // A short link to a configuration (POST /api/configuration-links); ?c= links keep working.
      { path: 'c/:code', handle: titled('Configure your board'), lazy: () => import('src/app/routes/short-link') },
      { path: 'checkout/return', handle: titled('Your payment'), lazy: () => import('src/app/routes/checkout-return') },
      { path: 'builds', handle: titled('My builds'), lazy: () => import('src/app/routes/builds') },
      { path: 'builds/:id', handle: titled('Your build'), lazy: () => import('src/app/routes/build-detail') },
      { path: '*', handle: titled('Page not found'), lazy: () => import('src/app/routes/not-found') },
    ],
  },
];

const router = createBrowserRouter(routes);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
