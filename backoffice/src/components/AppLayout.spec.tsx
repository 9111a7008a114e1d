import { fireEvent, screen } from '@testing-library/react';
import { useLocation } from 'react-router';
import { shopUnavailableMessage } from '@loomwright/shared';
import { describe, expect, it, vi } from 'vitest';
import { theme } from 'src/theme';
import { AppLayout } from './AppLayout';
import { json, renderWithProviders } from '@loomwright/shared/ui/testing';

function SignInStandIn() {
  const location = useLocation();
  return <p>sign-in page at {location.pathname + location.search}</p>;
}

function renderAt(url: string, me: () => Response) {
  const fetchMock = vi.fn(async (input: string | URL | Request) => {
    const path = new URL(String(input)).pathname;
    if (path === '/api/auth/session') return me();
    if (path === '/api/auth/sign-out') return json(200, { signedOut: true });
    if (path === '/api/health') return json(200, { status: 'ok', db: 'up' });
    return json(200, {
      name: 'Copperline Rig Works',
      tagline: '',
      currency: 'USD',
      countryCode: 'US',
      timezone: 'UTC',
      contactEmail: 'bench@shop.example',
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  renderWithProviders(<AppLayout />, {
    theme,
    url,
    path: '/',
    children: [{ path: 'bench', element: <p>bench page</p> }],
    routes: [{ path: '/sign-in', element: <SignInStandIn /> }],
  });
  return fetchMock;
}

describe('the backoffice layout lets only staff in', () => {
  it('keeps a builder on the page with "briefly unavailable" while the API answers 503, and lets them in once it is back', async () => {
    let down = true;
    renderAt('/bench', () =>
      down
        ? json(503, { statusCode: 503, error: 'Service Unavailable', message: shopUnavailableMessage })
        : json(200, { user: { id: 'b1', email: 'builder@shop.example', name: 'Tamsin Reyes', role: 'builder' } }),
    );
    expect(await screen.findByText('The shop is briefly unavailable')).toBeTruthy();
    expect(screen.getByText(new RegExp('nobody is signed out'))).toBeTruthy();
    expect(screen.queryByText(/sign-in page at/)).toBeNull();
    down = false;
    fireEvent.click(screen.getByRole('button', { name: 'Try again now' }));
    expect(await screen.findByText('bench page')).toBeTruthy();
  });

  it('sends a visitor who is not signed in to sign-in, remembering the page', async () => {
    renderAt('/bench', () => json(200, { user: null }));
    expect(await screen.findByText('sign-in page at /sign-in?next=%2Fbench')).toBeTruthy();
    expect(screen.queryByText('bench page')).toBeNull();
  });

  it('shows a player a plain "staff only" page with a working sign-out', async () => {
    let signedIn = true;
    const fetchMock = renderAt('/bench', () =>
      signedIn
        ? json(200, { user: { id: 'c1', email: 'player@mail.example', name: 'Rowan Achterberg', role: 'customer' } })
        : json(200, { user: null }),
    );
    expect(await screen.findByRole('heading', { name: 'Staff only' })).toBeTruthy();
    expect(screen.queryByText('bench page')).toBeNull();
    expect(screen.queryByRole('navigation', { name: 'Backoffice' })).toBeNull();
    signedIn = false;
    fireEvent.click(screen.getByRole('button', { name: 'Sign out' }));
    expect(await screen.findByText(/^sign-in page at \/sign-in/)).toBeTruthy();
    expect(fetchMock.mock.calls.some(([input]) => String(input).endsWith('/api/auth/sign-out'))).toBe(true);
  });

  it('shows staff the page, with their name and a sign-out in the navigation', async () => {
    renderAt('/bench', () => json(200, { user: { id: 'o1', email: 'owner@shop.example', name: 'Odile Varga', role: 'owner' } }));
    expect(await screen.findByText('bench page')).toBeTruthy();
    expect(screen.getByRole('navigation', { name: 'Backoffice' })).toBeTruthy();
    expect(screen.getByText('Odile Varga')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Sign out' })).toBeTruthy();
  });
});
