/**
 * Test helpers both apps' component tests use (vitest + Testing Library, jsdom): never imported by
 * app code, so nothing here reaches a bundle.
 */
import { CssVarsProvider } from '@mui/joy/styles';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { render, screen } from '@testing-library/react';
import type { ReactNode } from 'react';
import { vi } from 'vitest';
import { createMemoryRouter, RouterProvider, type RouteObject } from 'react-router';

/** An answer of the API as `fetch` would give it. */
export const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

/**
 * Puts `answer` in place of `fetch` for this test (undo with `vi.unstubAllGlobals()`): each call
 * gets the answer `answer(path, init)` gives; the mock is returned to read the calls made.
 */
export function stubFetch(answer: (path: string, init?: RequestInit) => Response) {
  const fetchMock = vi.fn(async (input: string | URL | Request, init?: RequestInit) =>
    answer(new URL(input instanceof Request ? input.url : String(input), 'http://localhost').pathname, init),
  );
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

/**
 * The API's 400 `validation_failed` answer as its ZodValidationPipe writes it (DEVELOPERS.md, "Error
 * answers and their codes"): one problem, its words under `message` and with its field's path under `issues`.
 */
export const validationFailed = (path: string, words: string) =>
  json(400, { statusCode: 400, code: 'validation_failed', message: [words], issues: [{ path, message: words }] });

/** Joy's FormControl ties its helper text to the input: what is read out with the field labelled `label`. */
export const wordsUnder = (label: string) =>
  document.getElementById(screen.getByLabelText(label).getAttribute('aria-describedby') ?? '')?.textContent;

/** A stand-in for `window.matchMedia` whose queries match when `matches(query)` says so. */
export const matchMediaWhere =
  (matches: (query: string) => boolean): typeof window.matchMedia =>
  (query: string) =>
    ({
      matches: matches(query),
      media: query,
      onchange: null,
      addListener() {},
      removeListener() {},
      addEventListener() {},
      removeEventListener() {},
      dispatchEvent: () => false,
    }) as unknown as MediaQueryList;

/** A QueryClient that does not retry, so a refused call shows at once. */
export const testQueryClient = () => new QueryClient({ defaultOptions: { queries: { retry: false } } });

type Theme = Parameters<typeof CssVarsProvider>[0]['theme'];

/**
 * Renders `ui` inside the app's theme, a fresh QueryClient and a memory router at `url` (at `path`,
 * with `children` under it as a layout's pages); `routes` adds pages beside it (a stand-in sign-in page, say).
 */
export function renderWithProviders(
  ui: ReactNode,
  {
    theme,
    url = '/',
    path = '*',
    children,
    routes = [],
    client = testQueryClient(),
  }: { theme: Theme; url?: string; path?: string; children?: RouteObject[]; routes?: RouteObject[]; client?: QueryClient },
) {
  const router = createMemoryRouter([...routes, { path, element: ui, children }], { initialEntries: [url] });
  render(
    <CssVarsProvider theme={theme}>
      <QueryClientProvider client={client}>
        <RouterProvider router={router} />
      </QueryClientProvider>
    </CssVarsProvider>,
  );
  return { router, client };
}
