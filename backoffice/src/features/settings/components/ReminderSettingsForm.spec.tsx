import { fireEvent, screen } from '@testing-library/react';
import { json, renderWithProviders, stubFetch, validationFailed, wordsUnder } from '@loomwright/shared/ui/testing';
import { describe, expect, it } from 'vitest';
import { theme } from 'src/theme';
import { ReminderSettingsForm } from './ReminderSettingsForm';

const view = {
  shipBy: { enabled: true, daysBefore: 3 },
  balanceUnpaid: { enabled: true, daysAfterReady: 7 },
  checkoutAbandoned: { enabled: false, hoursAfter: 24 },
  requestExpiry: { enabled: true, daysUnpaid: 14 },
};

/** The Reminders form over a scripted API: its settings on GET, `saveAnswer` on PATCH. */
function renderForm(saveAnswer: () => Response) {
  const fetchMock = stubFetch((_path, init) => (init?.method === 'PATCH' ? saveAnswer() : json(200, view)));
  renderWithProviders(<ReminderSettingsForm canEdit onSaved={() => {}} />, { theme });
  return fetchMock;
}

describe('Settings → Reminders: the server’s refusal', () => {
  // The body the API's ZodValidationPipe writes (DEVELOPERS.md, "Error answers and their codes").
  it('a validation_failed answer stands under the field it names, and no alert repeats it', async () => {
    const words = 'Days before the ship-by day can be at most 30';
    renderForm(() => validationFailed('shipBy.daysBefore', words));
    fireEvent.click(await screen.findByRole('button', { name: 'Save reminders' }));
    expect(await screen.findByText(words)).toBeTruthy();
    expect(wordsUnder('Days before the ship-by day')).toBe(words);
    expect(screen.queryByRole('alert')).toBeNull();
  });

  it('another refusal (409 conflict) keeps the alert with the server’s words', async () => {
    renderForm(() => json(409, { statusCode: 409, code: 'conflict', message: 'The settings changed meanwhile; reload and try again.' }));
    fireEvent.click(await screen.findByRole('button', { name: 'Save reminders' }));
    expect((await screen.findByRole('alert')).textContent).toContain('The settings changed meanwhile');
  });
});
