import { createBrowserRouter, RouterProvider } from 'react-router';
import type { RouteTitleHandle } from '@loomwright/shared/ui';
import { AppLayout } from 'src/components/AppLayout';
import { DocumentTitle } from 'src/components/DocumentTitle';
import { RouteError } from 'src/components/RouteError';

/** Each route's `handle.title` names its browser tab: "Requests · <shop name> · Backoffice". */
const titled = (title: string): RouteTitleHandle => ({ title });

const router = createBrowserRouter(
  [
    {
      element: <DocumentTitle />,
      children: [
        { path: '/sign-in', handle: titled('Staff sign in'), lazy: () => import('src/app/routes/sign-in'), errorElement: <RouteError /> },
        {
          path: '/accept-invite',
          handle: titled('Join the bench'),
          lazy: () => import('src/app/routes/accept-invite'),
          errorElement: <RouteError />,
        },
        {
          path: '/',
          element: <AppLayout />,
          errorElement: <RouteError />,
          children: [
            { index: true, handle: titled('Overview'), lazy: () => import('src/app/routes/overview') },
            { path: 'today', handle: titled('Today'), lazy: () => import('src/app/routes/today') },
            { path: 'calendars', handle: titled('Calendar links'), lazy: () => import('src/app/routes/calendars') },
            { path: 'requests', handle: titled('Requests'), lazy: () => import('src/app/routes/requests') },
            { path: 'bench', handle: titled('Bench'), lazy: () => import('src/app/routes/bench') },
            { path: 'builds', handle: titled('Builds'), lazy: () => import('src/app/routes/builds') },
            { path: 'builds/:bookingId', handle: titled('Build'), lazy: () => import('src/app/routes/build-detail') },
            { path: 'customers', handle: titled('Customers'), lazy: () => import('src/app/routes/customers') },
            { path: 'reports', handle: titled('Reports'), lazy: () => import('src/app/routes/reports') },
            { path: 'price-book', handle: titled('Price book'), lazy: () => import('src/app/routes/price-book') },
            { path: 'team', handle: titled('Team'), lazy: () => import('src/app/routes/team') },
            { path: 'settings', handle: titled('Settings'), lazy: () => import('src/app/routes/settings') },
            { path: 'mail', handle: titled('Mail log'), lazy: () => import('src/app/routes/mail-log') },
            { path: 'team/invite', handle: titled('Invite a builder'), lazy: () => import('src/app/routes/invite-builder') },
            { path: '*', handle: titled('Page not found'), lazy: () => import('src/app/routes/not-found') },
          ],
        },
      ],
    },
  ],
  { basename: '/backoffice' },
);

export function AppRouter() {
  return <RouterProvider router={router} />;
}
