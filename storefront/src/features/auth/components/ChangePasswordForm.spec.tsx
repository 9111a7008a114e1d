import { fireEvent, screen, waitFor } from '@testing-library/react';
import { json, renderWithProviders, stubFetch } from '@loomwright/shared/ui/testing';
import { describe, expect, it } from 'vitest';
import { storefrontTheme } from 'src/theme';
import { ChangePasswordForm } from './ChangePasswordForm';

/** The form with a scripted API: `answer` gives the reply to POST /api/auth/password. */
function renderWith(answer: () => Response) {
  const fetchMock = stubFetch(answer);
  renderWithProviders(<ChangePasswordForm onCancel={() => {}} />, { theme: storefrontTheme() });
  return fetchMock;
}

function fill(current: string, next: string, again = next) {
  fireEvent.change(screen.getByLabelText('Current password'), { target: { value: current } });
  fireEvent.change(screen.getByLabelText('New password'), { target: { value: next } });
  fireEvent.change(screen.getByLabelText('New password again'), { target: { value: again } });
  fireEvent.click(screen.getByRole('button', { name: 'Change password' }));
}

describe('Change your password (account page)', () => {
  it('refuses a mistyped repeat and an unchanged password in the shared words, and sends nothing', async () => {
    const fetchMock = renderWith(() => json(200, {}));
    fill('old-secret-1', 'new-secret-12', 'new-secret-13');
    expect(await screen.findByText('The two passwords do not match; type the same password twice')).toBeTruthy();
    fill('same-secret-1', 'same-secret-1');
    expect(await screen.findByText('Choose a new password that differs from your current one')).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('puts a wrong current password (400 current_password_wrong) under its field, not in an alert', async () => {
    renderWith(() =>
      json(400, { statusCode: 400, code: 'current_password_wrong', message: 'That is not your current password. Type it again.' }),
    );
    fill('not-it-at-all', 'new-secret-12');
    expect(await screen.findByText('That is not your current password. Type it again.')).toBeTruthy();
    expect(screen.queryByRole('alert')).toBeNull();
    await waitFor(() => expect(document.activeElement).toBe(screen.getByLabelText('Current password')));
  });

  it('sends the current and the new password once, then says the other devices are signed out and clears the fields', async () => {
    const fetchMock = renderWith(() => json(200, { user: { id: 'u1', email: 'player@mail.example', name: 'Rowan', role: 'customer' } }));
    fill('old-secret-1', 'new-secret-12');
    expect((await screen.findByRole('status')).textContent).toContain('Every other device where you were signed in is now signed out.');
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(String(url)).toMatch(/\/api\/auth\/password$/);
    expect(JSON.parse(String(init.body))).toEqual({ currentPassword: 'old-secret-1', password: 'new-secret-12' });
    expect((screen.getByLabelText('New password') as HTMLInputElement).value).toBe('');
  });
});
