import { screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { storefrontTheme } from 'src/theme';
import { AppLayout } from './AppLayout';
import { Page } from './Page';
import { json, renderWithProviders } from '@loomwright/shared/ui/testing';

function renderAt(url: string) {
  vi.stubGlobal(
    'fetch',
    vi.fn(async (input: string | URL | Request) => {
      const path = new URL(String(input)).pathname;
      if (path === '/api/shop') return json(200, { name: 'Harrow & Pine Boards', contactEmail: 'bench@harrow.example', tagline: '' });
      if (path === '/api/health') return json(200, { status: 'ok', db: 'up' });
      if (path === '/api/auth/me') return json(401, { message: 'Please sign in to do this.' });
      return json(404, { message: 'not scripted' });
    }),
  );
  renderWithProviders(<AppLayout />, {
    theme: storefrontTheme(),
    url,
    path: '/',
    children: [
      { path: 'builds', element: <Page title="My builds" screen={() => <p>builds page</p>} /> },
      { path: 'nameless', element: <Page screen={() => <p>a page with no title of its own</p>} /> },
    ],
  });
}

describe('the browser tab title', () => {
  it('names the page, then the shop from its settings', async () => {
    renderAt('/builds');
    await screen.findAllByText(/Harrow & Pine Boards/);
    await vi.waitFor(() => expect(document.title).toBe('My builds · Harrow & Pine Boards'));
  });

  it('is the shop alone on a page without a title of its own', async () => {
    renderAt('/nameless');
    await screen.findAllByText(/Harrow & Pine Boards/);
    await vi.waitFor(() => expect(document.title).toBe('Harrow & Pine Boards'));
  });
});
