import { CssVarsProvider } from '@mui/joy/styles';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen } from '@testing-library/react';
import { MemoryRouter, Route, Routes } from 'react-router';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { theme } from 'src/theme';
import { AppLayout } from './AppLayout';
import { Page } from './Page';

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

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

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
  render(
    <CssVarsProvider theme={theme}>
      <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
        <MemoryRouter initialEntries={[url]}>
          <Routes>
            <Route path="/" element={<AppLayout />}>
              <Route path="builds" element={<Page title="My builds" screen={() => <p>builds page</p>} />} />
              <Route path="nameless" element={<Page screen={() => <p>a page with no title of its own</p>} />} />
            </Route>
          </Routes>
        </MemoryRouter>
      </QueryClientProvider>
    </CssVarsProvider>,
  );
}

describe('the browser tab title', () => {
  afterEach(() => {
    cleanup();
    vi.unstubAllGlobals();
  });

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
