import { fireEvent, screen } from '@testing-library/react';
import type { ShopSettingsView } from '@loomwright/shared';
import { json, renderWithProviders, stubFetch, validationFailed, wordsUnder } from '@loomwright/shared/ui/testing';
import { describe, expect, it } from 'vitest';
import { theme } from 'src/theme';
import { ShopDetailsForm } from './ShopDetailsForm';

// What the form reads of the settings (an invented shop); the lists of closures and holidays belong to other sections.
const settings = {
  name: 'Tinplate Signal Works',
  tagline: 'Boards wired by hand',
  contactEmail: 'bench@tinplate.example',
  countryCode: 'US',
  timezone: 'America/Chicago',
  locale: 'en-US',
  currency: 'USD',
  postalAddress: { line1: '14 Foundry Row', line2: '', city: 'Millbrook', region: 'IL', postalCode: '60000' },
} as unknown as ShopSettingsView;

function renderForm(answer: () => Response) {
  const fetchMock = stubFetch(answer);
  renderWithProviders(<ShopDetailsForm settings={settings} canEdit onSaved={() => {}} />, { theme });
  return fetchMock;
}

describe('Settings → Shop details: the server’s refusal', { timeout: 30_000 }, () => {
  // The body the API's ZodValidationPipe writes (DEVELOPERS.md, "Error answers and their codes").
  it('a validation_failed answer about the contact e-mail stands under that field, and no alert repeats it', async () => {
    const words = 'Contact e-mail can be at most 254 characters';
    renderForm(() => validationFailed('contactEmail', words));
    fireEvent.click(screen.getByRole('button', { name: 'Save shop details' }));
    expect(await screen.findByText(words)).toBeTruthy();
    expect(wordsUnder('Contact e-mail')).toBe(words);
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('another refusal (403 role_not_allowed) stays an alert in the server’s words', async () => {
    renderForm(() => json(403, { statusCode: 403, code: 'role_not_allowed', message: 'Only the shop’s owner changes its details.' }));
    fireEvent.click(screen.getByRole('button', { name: 'Save shop details' }));
    expect((await screen.findByRole('alert')).textContent).toContain('Only the shop’s owner changes its details.');
  });
});
