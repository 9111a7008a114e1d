/**
 * Test helpers both apps' component tests use (vitest + Testing Library, jsdom): never imported by
 * app code, so nothing here reaches a bundle.
 */
import { CssVarsProvider } from '@mui/joy/styles';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render } from '@testing-library/react';
import type { ReactNode } from 'react';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router';

/** An answer of the API as `fetch` would give it. */
export const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

/** A QueryClient that does not retry, so a refused call shows at once. */
export const testQueryClient = () => new QueryClient({ defaultOptions: { queries: { retry: false } } });

type Theme = Parameters<typeof CssVarsProvider>[0]['theme'];

/**
 * Renders `ui` inside the app's theme, a fresh QueryClient and a memory router at `url`;
 * `routes` adds pages beside it (a stand-in sign-in page, say).
 */
export function renderWithProviders(
  ui: ReactNode,
  {
    theme,
    url = '/',
    path = '*',
    routes = [],
    client = testQueryClient(),
  }: { theme: Theme; url?: string; path?: string; routes?: RouteObject[]; client?: QueryClient },
) {
  const router = createMemoryRouter([...routes, { path, element: ui }], { initialEntries: [url] });
  render(
    <CssVarsProvider theme={theme}>
      <QueryClientProvider client={client}>
        <RouterProvider router={router} />
      </QueryClientProvider>
    </CssVarsProvider>,
  );
  return { router, client };
}
