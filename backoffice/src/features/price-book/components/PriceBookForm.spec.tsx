import { fireEvent, screen, within } from '@testing-library/react';
import { json, renderWithProviders, stubFetch, wordsUnder } from '@loomwright/shared/ui/testing';
import { describe, expect, it } from 'vitest';
import { demoPriceBook } from '../../../../../shared/src/price-book/demo-price-book';
import { theme } from 'src/theme';
import { PriceBookForm } from './PriceBookForm';

function renderForm(answer: () => Response) {
  const fetchMock = stubFetch(answer);
  renderWithProviders(<PriceBookForm book={demoPriceBook} version={3} canEdit onPublished={() => {}} />, { theme });
  return fetchMock;
}

/** The alerts that say something went wrong (Joy's Alert is role="alert"; the one about versions at the top always stands). */
const problemAlerts = () =>
  screen.getAllByRole('alert').filter((alert) => !alert.textContent?.startsWith('Publishing saves a new version'));
const findProblemAlert = async () => {
  await screen.findByText((_, element) => element?.getAttribute('role') === 'alert' && problemAlerts().includes(element as HTMLElement));
  return problemAlerts()[0]!;
};

// The whole book is a long form: jsdom takes seconds to render it on a busy machine.
describe('Price book: the server’s refusal of a publish', { timeout: 30_000 }, () => {
  // The body the API's ZodValidationPipe writes for POST /api/price-book's `{ book, notes }`
  // (DEVELOPERS.md, "Error answers and their codes"): each path starts with `book.`.
  it('a validation_failed answer stands under the field of the book it names, and no second alert repeats it', async () => {
    const words = 'Patch cable price per foot must be an amount with at most two decimals, like 1.25';
    const fetchMock = renderForm(() =>
      json(400, {
        statusCode: 400,
        code: 'validation_failed',
        message: [words],
        issues: [{ path: 'book.materials.cablePricePerFoot', message: words }],
      }),
    );
    fireEvent.click(screen.getByRole('button', { name: 'Publish as version 4' }));
    expect(await screen.findAllByText(words)).toHaveLength(2); // under the field, and in "Fix these before publishing"
    expect(wordsUnder('Patch cable price per foot')).toBe(words);
    expect(problemAlerts()).toHaveLength(1);
    expect(problemAlerts()[0]!.textContent).toContain('Fix these before publishing');
    expect(fetchMock).toHaveBeenCalledOnce();
  });

  it('a refusal of a row of a list marks that cell, and lists its words', async () => {
    const words = 'Surface 1: price must be an amount with at most two decimals, like 1.25';
    renderForm(() =>
      json(400, {
        statusCode: 400,
        code: 'validation_failed',
        message: [words],
        issues: [{ path: 'book.surfaces[0].price', message: words }],
      }),
    );
    fireEvent.click(screen.getByRole('button', { name: 'Publish as version 4' }));
    expect((await findProblemAlert()).textContent).toContain(words);
    const surfaces = within(screen.getByRole('table', { name: 'Price book: surfaces' }));
    expect(surfaces.getByLabelText('Price, row 1').closest('.MuiInput-root')?.className).toContain('Mui-error');
  });

  it('a refusal about the notes beside the book (no field of the form) keeps the server’s alert', async () => {
    renderForm(() =>
      json(400, {
        statusCode: 400,
        code: 'validation_failed',
        message: ['What changed can be at most 500 characters'],
        issues: [{ path: 'notes', message: 'What changed can be at most 500 characters' }],
      }),
    );
    fireEvent.click(screen.getByRole('button', { name: 'Publish as version 4' }));
    expect((await findProblemAlert()).textContent).toContain('What changed can be at most 500 characters');
  });
});
