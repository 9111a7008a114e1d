import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { theme } from 'src/theme';
import { SignOutEverywhere } from './SignOutEverywhere';
import { json, renderWithProviders } from '@loomwright/shared/ui/testing';

const session = (id: string, device: string) => ({
  id,
  startedAt: '2026-12-01T10:00:00Z',
  lastRenewedAt: '2026-12-01T10:20:00Z',
  expiresAt: '2026-12-01T10:50:00Z',
  device,
});

describe('sign a person out of every device', () => {
  it('asks first, says how many devices, ends them with DELETE and reports in words', async () => {
    let live = [session('s1', 'phone'), session('s2', 'laptop')];
    const fetchMock = vi.fn(async (input: string | URL | Request, init?: RequestInit) => {
      expect(new URL(String(input)).pathname).toBe('/api/users/u-cass/sessions');
      if (init?.method === 'DELETE') {
        const ended = live.length;
        live = [];
        return json(200, { userId: 'u-cass', ended });
      }
      return json(200, { userId: 'u-cass', sessions: live });
    });
    vi.stubGlobal('fetch', fetchMock);
    const onDone = vi.fn();
    renderWithProviders(<SignOutEverywhere userId="u-cass" name="Cass Lindqvist" onDone={onDone} />, { theme });
    // Nothing is asked or ended before the owner opens the dialog.
    expect(fetchMock).not.toHaveBeenCalled();
    fireEvent.click(screen.getByRole('button', { name: 'Sign Cass Lindqvist out everywhere' }));
    expect(await screen.findByText(/They are signed in on 2 devices now\./)).toBeTruthy();
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'DELETE')).toBe(false);

    fireEvent.click(screen.getByRole('button', { name: 'Sign out everywhere' }));
    await waitFor(() => expect(onDone).toHaveBeenCalledWith('Cass Lindqvist is signed out of 2 devices.'));
    expect(fetchMock.mock.calls.filter(([, init]) => init?.method === 'DELETE')).toHaveLength(1);
  });
});
