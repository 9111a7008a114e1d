import { CssVarsProvider } from '@mui/joy/styles';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, fireEvent, render, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { theme } from 'src/theme';
import { InviteBuilderForm } from './InviteBuilderForm';

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

const json = (status: number, body: unknown) =>
  new Response(JSON.stringify(body), { status, headers: { 'Content-Type': 'application/json' } });

function renderForm(answer: () => Response) {
  const fetchMock = vi.fn(async () => answer());
  vi.stubGlobal('fetch', fetchMock);
  render(
    <CssVarsProvider theme={theme}>
      <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>
        <InviteBuilderForm />
      </QueryClientProvider>
    </CssVarsProvider>,
  );
  return fetchMock;
}

describe('Invite a builder', () => {
  afterEach(() => {
    cleanup();
    vi.unstubAllGlobals();
  });

  it('refuses a zero rate and a missing name in the shared words, sending nothing', async () => {
    const fetchMock = renderForm(() => json(500, {}));
    fireEvent.change(screen.getByLabelText('Hourly rate'), { target: { value: '0' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText('Enter a name')).toBeTruthy();
    expect(screen.getByText('Hourly rate must be an amount above 0 with at most two decimals, like 85.00')).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('sends the invitation with a normalised e-mail and says until when the link works', async () => {
    const fetchMock = renderForm(() =>
      json(201, {
        user: { id: 'b9', email: 'marit.solberg@shop.example', name: 'Marit Solberg-Ames', role: 'builder' },
        builderId: 'x',
        expiresAt: '2026-12-08T17:00:00.000Z',
        resent: false,
      }),
    );
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'Marit Solberg-Ames' } });
    fireEvent.change(screen.getByLabelText('E-mail'), { target: { value: ' Marit.Solberg@Shop.Example ' } });
    fireEvent.change(screen.getByLabelText('Hourly rate'), { target: { value: '48.50' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect((await screen.findByRole('status')).textContent).toMatch(
      /Invitation sent to marit\.solberg@shop\.example\. The link works once, until/,
    );
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(new URL(url).pathname).toBe('/api/invitations');
    expect(JSON.parse(String(init.body))).toEqual({
      name: 'Marit Solberg-Ames',
      email: 'marit.solberg@shop.example',
      level: 'apprentice',
      hourlyRate: '48.50',
    });
  });

  it('shows the API’s refusal in its own words', async () => {
    renderForm(() =>
      json(409, { statusCode: 409, message: 'Someone already has an account with this e-mail; invite a different address.' }),
    );
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'Rowan' } });
    fireEvent.change(screen.getByLabelText('E-mail'), { target: { value: 'player@mail.example' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect((await screen.findByRole('alert')).textContent).toContain('already has an account');
  });
});
