import { fireEvent, screen } from '@testing-library/react';
import { shopUnavailableMessage } from '@loomwright/shared';
import { useLocation } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { storefrontTheme } from 'src/theme';
import { Component as BuildsPage } from './builds';
import { json, matchMediaWhere, renderWithProviders } from '@loomwright/shared/ui/testing';

// jsdom has no matchMedia; Joy's colour-scheme provider asks it for the preferred scheme, and My
// builds asks whether the screen is at least 600 px wide (`screenWidth` below plays the screen).
let screenWidth = 1280;
const minWidth = (query: string) => Number(/min-width:\s*(\d+)/.exec(query)?.[1] ?? Number.NaN);
window.matchMedia = matchMediaWhere((query) => screenWidth >= minWidth(query));

const player = { id: 'u1', email: 'player@mail.example', name: 'Rowan Achterberg', role: 'customer' };
/** The API's own answer while its database is down (api/src/common/database-unavailable.ts). */
const unavailable = () => json(503, { statusCode: 503, error: 'Service Unavailable', message: shopUnavailableMessage });

function Where() {
  const location = useLocation();
  return <p>at {location.pathname + location.search}</p>;
}

function renderAt(url: string, api: (path: string) => Response) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: string | URL | Request) => api(new URL(String(input)).pathname)),
  );
  renderWithProviders(<Where />, { theme: storefrontTheme(), url, routes: [{ path: '/builds', element: <BuildsPage /> }] });
}

describe('My builds while the shop is down', () => {
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

const booking = {
  id: 'b1',
  reference: 'LW-2026-0042',
  state: 'scheduled',
  customer: { id: 'u1', name: 'Rowan Achterberg', email: 'player@mail.example' },
  builder: null,
  benchDate: '2026-12-14',
  expectedCompletion: '2026-12-16',
  currency: 'USD',
  laborHours: '12.00',
  totalLow: '1480.00',
  totalHigh: '1920.00',
  firmTotal: null,
  deposit: '300.00',
  depositStatus: 'paid',
  pedalCount: 9,
  routingMode: 'serial',
  summary: '9 pedals · serial',
  createdAt: '2026-12-01T10:00:00Z',
  updatedAt: '2026-12-01T10:00:00Z',
};

describe('My builds on a phone', () => {
  afterEach(() => {
    screenWidth = 1280;
  });
  const api = (path: string) =>
    path === '/api/auth/session' || path === '/api/auth/me'
      ? json(200, { user: player })
      : path === '/api/bookings'
        ? json(200, { items: [booking], total: 1, page: 1, pageSize: 20 })
        : json(404, { message: 'not scripted' });

  it('shows each build as a card with every fact labelled below 600 px, and no table', async () => {
    screenWidth = 390;
    renderAt('/builds', api);
    const cards = await screen.findByRole('list', { name: 'My builds' });
    expect(screen.queryByRole('table')).toBeNull();
    const card = cards.querySelector('li')!;
    expect(card.textContent).toContain('LW-2026-0042');
    expect(card.textContent).toContain('9 pedals · serial');
    for (const label of ['Deposit', 'Bench date', 'Total']) expect(card.querySelector('dl')!.textContent).toContain(label);
    expect(card.textContent).toContain('Paid');
    expect(screen.getByRole('link', { name: 'LW-2026-0042' }).getAttribute('href')).toBe('/builds/b1');
  });

  it('keeps the table with its six column headers from 600 px up', async () => {
    screenWidth = 600;
    renderAt('/builds', api);
    const table = await screen.findByRole('table', { name: 'My builds' });
    expect([...table.querySelectorAll('th')].map((th) => th.textContent)).toEqual([
      'Build',
      'Board',
      'Status',
      'Deposit',
      'Bench date',
      'Total',
    ]);
    expect(screen.queryByRole('list', { name: 'My builds' })).toBeNull();
  });
});
