import { fireEvent, screen } from '@testing-library/react';
import type { BookingDetail, TimeEntriesResponse } from '@loomwright/shared';
import { json, renderWithProviders, stubFetch, validationFailed, wordsUnder } from '@loomwright/shared/ui/testing';
import { describe, expect, it } from 'vitest';
import { theme } from 'src/theme';
import { HoursPanel } from './HoursPanel';

// Only what the panel reads of a build: its id for the route, its state for whether hours may be recorded.
const booking = { id: 'b1', state: 'on_bench' } as BookingDetail;
const entries: TimeEntriesResponse = { entries: [], totalHours: '0', plannedHours: '6' } as unknown as TimeEntriesResponse;

function renderPanel(answer: () => Response) {
  const fetchMock = stubFetch(answer);
  renderWithProviders(<HoursPanel booking={booking} entries={entries} meId="u1" isOwner />, { theme });
  return fetchMock;
}

describe('A build’s hours: the server’s refusal', () => {
  // The body the API's ZodValidationPipe writes (DEVELOPERS.md, "Error answers and their codes").
  it('a validation_failed answer about the hours stands under the Hours field, and no alert repeats it', async () => {
    const words = 'Hours can be at most 24 in one day';
    const fetchMock = renderPanel(() => validationFailed('hours', words));
    fireEvent.change(screen.getByLabelText('Hours'), { target: { value: '2.5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Record hours' }));
    expect(await screen.findByText(words)).toBeTruthy();
    expect(wordsUnder('Hours')).toBe(words);
    expect(screen.queryByRole('alert')).toBeNull();
    expect(fetchMock).toHaveBeenCalledOnce();
  });

  it('a refusal of another kind (409 conflict) stays an alert in the server’s words', async () => {
    renderPanel(() => json(409, { statusCode: 409, code: 'conflict', message: 'Hours are recorded once the pedals are in.' }));
    fireEvent.change(screen.getByLabelText('Hours'), { target: { value: '2.5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Record hours' }));
    expect((await screen.findByRole('alert')).textContent).toContain('Hours are recorded once the pedals are in.');
  });
});
