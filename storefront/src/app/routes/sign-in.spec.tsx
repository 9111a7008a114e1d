import { fireEvent, screen, waitFor } from '@testing-library/react';
import { useLocation } from 'react-router';
import { json, renderWithProviders, stubFetch } from '@loomwright/shared/ui/testing';
import { describe, expect, it, vi } from 'vitest';
import { storefrontTheme } from 'src/theme';
import { Component as SignInPage } from './sign-in';

const player = { id: 'u1', email: 'player@mail.example', name: 'Rowan Achterberg', role: 'customer' };

function Where() {
  const location = useLocation();
  return <p>at {location.pathname + location.search}</p>;
}

/** The sign-in page in a memory router, with a fresh query client (no retries) and a scripted API. */
function renderAt(url: string, api: (path: string, init?: RequestInit) => Response) {
  const fetchMock = stubFetch(api);
  renderWithProviders(<Where />, { theme: storefrontTheme(), url, routes: [{ path: '/sign-in', element: <SignInPage /> }] });
  return fetchMock;
}

const signInCalls = (fetchMock: ReturnType<typeof vi.fn>) =>
  fetchMock.mock.calls.filter(([input]) => String(input).endsWith('/api/auth/sign-in'));

describe('sign-in page', () => {
  it('refuses empty fields in the shared words and sends nothing', async () => {
    const fetchMock = renderAt('/sign-in', () => json(200, { user: null }));
    fireEvent.click(await screen.findByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter an e-mail address, like name@example.com')).toBeTruthy();
    expect(screen.getByText('Enter your password')).toBeTruthy();
    expect(signInCalls(fetchMock)).toHaveLength(0);
  });

  it('shows the API’s own words when the password is wrong, and no "Sign in again" (a 401 invalid_credentials is not an ended session)', async () => {
    renderAt('/sign-in', (path) =>
      path === '/api/auth/session'
        ? json(200, { user: null })
        : json(401, {
            statusCode: 401,
            code: 'invalid_credentials',
            message: 'That e-mail and password do not match an account. Check them, or reset your password.',
          }),
    );
    fireEvent.change(await screen.findByLabelText('E-mail'), { target: { value: 'player@mail.example' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'wrong-one' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect((await screen.findByRole('alert')).textContent).toContain('do not match an account');
    expect(screen.queryByRole('link', { name: 'Sign in again' })).toBeNull();
  });

  // RFC 6585 §4: 429 Too Many Requests; the client waits before it tries again.
  it('after too many attempts (429 too_many_attempts) says to wait before trying again', async () => {
    renderAt('/sign-in', (path) =>
      path === '/api/auth/session'
        ? json(200, { user: null })
        : json(429, { statusCode: 429, code: 'too_many_attempts', message: 'Too many sign-in attempts for this account.' }),
    );
    fireEvent.change(await screen.findByLabelText('E-mail'), { target: { value: 'player@mail.example' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'wrong-one' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Too many sign-in attempts for this account.');
    expect(alert.textContent).toContain('Wait a moment, then try again.');
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
