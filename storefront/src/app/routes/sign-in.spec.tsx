import { CssVarsProvider } from '@mui/joy/styles';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen, waitFor } from '@testing-library/react';
import { createMemoryRouter, RouterProvider, useLocation } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { theme } from 'src/theme';
import { Component as SignInPage } from './sign-in';

// jsdom has no matchMedia; Joy's colour-scheme provider asks it for the preferred scheme.
window.matchMedia ??= (query: string) =>
  ({
    matches: false,
    media: query,
    onchange: null,
    addListener() {},
    removeListener() {},
    addEventListener() {},
    removeEventListener() {},
    dispatchEvent: () => false,
  }) as MediaQueryList;

const player = { id: 'u1', email: 'player@mail.example', name: 'Rowan Achterberg', role: 'customer' };
const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

function Where() {
  const location = useLocation();
  return <p>at {location.pathname + location.search}</p>;
}

/** The sign-in page in a memory router, with a fresh query client (no retries) and a scripted API. */
function renderAt(url: string, api: (path: string, init?: RequestInit) => Response) {
  const fetchMock = vi.fn(async (input: string | URL | Request, init?: RequestInit) => api(new URL(String(input)).pathname, init));
  vi.stubGlobal('fetch', fetchMock);
  const router = createMemoryRouter(
    [
      { path: '/sign-in', element: <SignInPage /> },
      { path: '*', element: <Where /> },
    ],
    { initialEntries: [url] },
  );
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  render(
    <CssVarsProvider theme={theme}>
      <QueryClientProvider client={queryClient}>
        <RouterProvider router={router} />
      </QueryClientProvider>
    </CssVarsProvider>,
  );
  return fetchMock;
}

const signInCalls = (fetchMock: ReturnType<typeof vi.fn>) =>
  fetchMock.mock.calls.filter(([input]) => String(input).endsWith('/api/auth/sign-in'));

describe('sign-in page', () => {
  afterEach(() => {
    cleanup();
    vi.unstubAllGlobals();
  });

  it('refuses empty fields in the shared words and sends nothing', async () => {
    const fetchMock = renderAt('/sign-in', () => json(200, { user: null }));
    fireEvent.click(await screen.findByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter an e-mail address, like name@example.com')).toBeTruthy();
    expect(screen.getByText('Enter your password')).toBeTruthy();
    expect(signInCalls(fetchMock)).toHaveLength(0);
  });

  it('shows the API’s own words when the password is wrong', async () => {
    renderAt('/sign-in', (path) =>
      path === '/api/auth/session'
        ? json(200, { user: null })
        : json(401, { message: 'That e-mail and password do not match an account. Check them, or reset your password.' }),
    );
    fireEvent.change(await screen.findByLabelText('E-mail'), { target: { value: 'player@mail.example' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'wrong-one' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect((await screen.findByRole('alert')).textContent).toContain('do not match an account');
  });

  it('returns the player to the configurator page that sent them, draft and all', async () => {
    const fetchMock = renderAt('/sign-in?next=%2Fconfigure%2Frequest%3Fc%3Dv1.abc', (path) =>
      path === '/api/auth/session' ? json(200, { user: null }) : json(200, { user: player }),
    );
    fireEvent.change(await screen.findByLabelText('E-mail'), { target: { value: ' Player@Mail.Example ' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'demo-pass-2026' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('at /configure/request?c=v1.abc')).toBeTruthy();
    const [, init] = signInCalls(fetchMock)[0]!;
    expect(JSON.parse(String(init?.body))).toEqual({ email: 'player@mail.example', password: 'demo-pass-2026' });
  });

  it('never follows a next that leads off the site', async () => {
    renderAt('/sign-in?next=%2F%2Felsewhere.example%2F', (path) =>
      path === '/api/auth/session' ? json(200, { user: null }) : json(200, { user: player }),
    );
    fireEvent.change(await screen.findByLabelText('E-mail'), { target: { value: 'player@mail.example' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'demo-pass-2026' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(screen.getByText('at /builds')).toBeTruthy());
  });
});
