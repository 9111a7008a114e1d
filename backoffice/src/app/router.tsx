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
        { path: 'mail', lazy: () => import('src/app/routes/mail-log') },
        { path: '*', lazy: () => import('src/app/routes/not-found') },
      ],
    },
  ],
  { basename: '/backoffice' },
);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
