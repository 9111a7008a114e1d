import { createBrowserRouter, RouterProvider, type RouteObject } from 'react-router';
import { queryClient } from 'src/app/query-client';
import { AppLayout } from 'src/components/AppLayout';
import { RouteError } from 'src/components/RouteError';
import { catalogQueryOptions } from 'src/features/configurator/api/get-catalog';

// Each screen is its own chunk, so the first load ships only what the first screen needs.
// A new page also goes into `storefrontPaths` (@loomwright/shared), or the API answers it with 404.
export const routes: RouteObject[] = [
  {
    path: '/',
    element: <AppLayout />,
    errorElement: <RouteError />,
    children: [
      { index: true, lazy: () => import('src/app/routes/home') },
      { path: 'sign-in', lazy: () => import('src/app/routes/sign-in') },
      { path: 'sign-up', lazy: () => import('src/app/routes/sign-up') },
      { path: 'forgot-password', lazy: () => import('src/app/routes/forgot-password') },
      { path: 'reset-password', lazy: () => import('src/app/routes/reset-password') },
      { path: 'account', lazy: () => import('src/app/routes/account') },
      {
        path: 'configure',
        // A static loader runs beside lazy(): the price book is on its way while the screen's code loads.
        loader: () => {
          void queryClient.prefetchQuery(catalogQueryOptions());
          return null;
        },
        lazy: () => import('src/app/routes/configure'),
      },
      { path: 'request', lazy: () => import('src/app/routes/request') },
      { path: 'configurations', lazy: () => import('src/app/routes/configurations') },
      // A short link to a configuration (POST /api/configuration-links); ?c= links keep working.
      { path: 'c/:code', lazy: () => import('src/app/routes/short-link') },
      { path: 'checkout/return', lazy: () => import('src/app/routes/checkout-return') },
      { path: 'builds', lazy: () => import('src/app/routes/builds') },
      { path: 'builds/:id', lazy: () => import('src/app/routes/build-detail') },
      { path: '*', lazy: () => import('src/app/routes/not-found') },
    ],
  },
];

const router = createBrowserRouter(routes);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
