import { createBrowserRouter, RouterProvider } from 'react-router';
import { AppLayout } from 'src/components/AppLayout';
import { RouteError } from 'src/components/RouteError';

const router = createBrowserRouter(
  [
    { path: '/sign-in', lazy: () => import('src/app/routes/sign-in'), errorElement: <RouteError /> },
    { path: '/accept-invite', lazy: () => import('src/app/routes/accept-invite'), errorElement: <RouteError /> },
    {
      path: '/',
      element: <AppLayout />,
      errorElement: <RouteError />,
      children: [
        { index: true, lazy: () => import('src/app/routes/overview') },
        { path: 'requests', lazy: () => import('src/app/routes/requests') },
        { path: 'bench', lazy: () => import('src/app/routes/bench') },
        { path: 'builds', lazy: () => import('src/app/routes/builds') },
        { path: 'builds/:bookingId', lazy: () => import('src/app/routes/build-detail') },
        { path: 'customers', lazy: () => import('src/app/routes/customers') },
        { path: 'reports', lazy: () => import('src/app/routes/reports') },
        { path: 'price-book', lazy: () => import('src/app/routes/price-book') },
        { path: 'team', lazy: () => import('src/app/routes/team') },
        { path: 'settings', lazy: () => import('src/app/routes/settings') },
        { path: 'mail', lazy: () => import('src/app/routes/mail-log') },
        { path: 'team/invite', lazy: () => import('src/app/routes/invite-builder') },
        { path: '*', lazy: () => import('src/app/routes/not-found') },
      ],
    },
  ],
  { basename: '/backoffice' },
);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
