import { CssVarsProvider } from '@mui/joy/styles';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { shopUnavailableMessage } from '@loomwright/shared';
import { createMemoryRouter, RouterProvider, useLocation } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { theme } from 'src/theme';
import { Component as BuildsPage } from './builds';

// jsdom has no matchMedia; Joy's colour-scheme provider asks it for the preferred scheme.
window.matchMedia ??= ((query: string) =>
  ({ matches: false, media: query, onchange: null, addListener() {}, removeListener() {}, addEventListener() {}, removeEventListener() {}, dispatchEvent: () => false }) as MediaQueryList);

const player = { id: 'u1', email: 'player@mail.example', name: 'Rowan Achterberg', role: 'customer' };
const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });
/** The API's own answer while its database is down (api/src/common/database-unavailable.ts). */
const unavailable = () => json(503, { statusCode: 503, error: 'Service Unavailable', message: shopUnavailableMessage });

function Where() {
  const location = useLocation();
  return <p>at {location.pathname + location.search}</p>;
}

function renderAt(url: string, api: (path: string) => Response) {
  vi.stubGlobal('fetch', vi.fn(async (input: string | URL | Request) => api(new URL(String(input)).pathname)));
  const router = createMemoryRouter(
    [
      { path: '/builds', element: <BuildsPage /> },
      { path: '*', element: <Where /> },
    ],
    { initialEntries: [url] },
  );
  render(
    <CssVarsProvider theme={theme}>
      <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
        <RouterProvider router={router} />
      </QueryClientProvider>
    </CssVarsProvider>,
  );
}

describe('My builds while the shop is down', () => {
  afterEach(() => {
    cleanup();
    vi.unstubAllGlobals();
  });

  it('says the shop is briefly unavailable instead of sending the player to sign in, and comes back', async () => {
    let down = true;
    renderAt('/builds', (path) => {
      if (down) return unavailable();
      if (path === '/api/auth/session') return json(200, { user: player });
      if (path === '/api/bookings') return json(200, { items: [], total: 0, page: 1, pageSize: 20 });
      return json(404, { message: 'not scripted' });
    });
    expect(await screen.findByText('The shop is briefly unavailable')).toBeTruthy();
    expect(screen.getByText(new RegExp('nobody is signed out'))).toBeTruthy();
    expect(screen.queryByText(/^at \/sign-in/)).toBeNull();

    down = false;
    fireEvent.click(screen.getByRole('button', { name: 'Try again now' }));
    expect(await screen.findByText('You have not requested a build yet.')).toBeTruthy();
    expect(screen.queryByText('The shop is briefly unavailable')).toBeNull();
  });

  it('still sends a visitor who is really signed out ({ user: null }) to sign in', async () => {
    renderAt('/builds', () => json(200, { user: null }));
    expect(await screen.findByText('at /sign-in?next=%2Fbuilds')).toBeTruthy();
  });
});
