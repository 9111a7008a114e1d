import { fireEvent, screen } from '@testing-library/react';
import { json, renderWithProviders, stubFetch } from '@loomwright/shared/ui/testing';
import { describe, expect, it } from 'vitest';
import { theme } from 'src/theme';
import { InviteBuilderForm } from './InviteBuilderForm';

function renderForm(answer: () => Response) {
  const fetchMock = stubFetch(answer);
  renderWithProviders(<InviteBuilderForm />, { theme });
  return fetchMock;
}

describe('Invite a builder', () => {
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

  it('puts a validation_failed answer’s words under the field its path names, with no alert above the form', async () => {
    // The API's pipe answers 400 validation_failed with `issues: [{ path, message }]` (api/src/common/zod-validation.pipe.ts).
    renderForm(() =>
      json(400, {
        statusCode: 400,
        code: 'validation_failed',
        message: ['E-mail is already used by a pending invitation'],
        issues: [{ path: 'email', message: 'E-mail is already used by a pending invitation' }],
      }),
    );
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'Rowan' } });
    fireEvent.change(screen.getByLabelText('E-mail'), { target: { value: 'rowan@shop.example' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText('E-mail is already used by a pending invitation')).toBeTruthy();
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('keeps the alert when a problem names no field of this form', async () => {
    renderForm(() =>
      json(400, {
        statusCode: 400,
        code: 'validation_failed',
        message: ['Unknown field: team'],
        issues: [{ path: 'team', message: 'Unknown field: team' }],
      }),
    );
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'Rowan' } });
    fireEvent.change(screen.getByLabelText('E-mail'), { target: { value: 'rowan@shop.example' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect((await screen.findByRole('alert')).textContent).toContain('Unknown field: team');
  });
});
