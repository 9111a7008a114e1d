import { cleanup, fireEvent, screen } from '@testing-library/react';
import { ApiError, apiErrorFrom } from '@loomwright/shared';
import { renderWithProviders } from '@loomwright/shared/ui/testing';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { theme } from 'src/theme';
import { ErrorNote } from './ErrorNote';

// Each case is an error body as the API writes it (`{ statusCode, code, message }`), read by the
// apps' own client (`apiErrorFrom`). The advice is picked by `code`; the message is shown as sent.
const show = (error: Error, onRetry?: () => void) => {
  renderWithProviders(<ErrorNote error={error} onRetry={onRetry} />, { theme });
  return screen.getByRole('alert');
};

describe('ErrorNote: what to do next, by the answer’s code', () => {
  afterEach(cleanup);

  it('a session that ended (401 session_ended) offers "Sign in again", leading to the sign-in page', () => {
    const alert = show(apiErrorFrom(401, { statusCode: 401, code: 'session_ended', message: 'Your session has ended.' }));
    expect(alert.textContent).toContain('Your session has ended.');
    expect(screen.getByRole('link', { name: 'Sign in again' }).getAttribute('href')).toBe('/sign-in');
  });

  // RFC 6585 §4: 429 Too Many Requests asks the client to wait (Retry-After) before trying again.
  it('too many attempts (429 too_many_attempts) says to wait, and "Try again" retries', () => {
    const onRetry = vi.fn();
    const alert = show(apiErrorFrom(429, { statusCode: 429, code: 'too_many_attempts', message: 'Too many tries.' }), onRetry);
    expect(alert.textContent).toContain('Wait a moment, then try again.');
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    expect(onRetry).toHaveBeenCalledTimes(1);
    expect(screen.queryByRole('link', { name: 'Sign in again' })).toBeNull();
  });

  it('a shop that could not be reached at all (no answer, code unreachable) says to wait and retry', () => {
    const alert = show(new ApiError(0, 'The shop could not be reached; check your connection and try again.'));
    expect(alert.textContent).toContain('Wait a moment, then try again.');
  });

  it('bench time taken meanwhile (409 bench_time_taken) asks for another date', () => {
    const alert = show(apiErrorFrom(409, { statusCode: 409, code: 'bench_time_taken', message: 'That bench time was just taken.' }));
    expect(alert.textContent).toContain('That bench time was just taken.');
    expect(alert.textContent).toContain('Pick another date');
  });

  it('another 409 (conflict) shows the server’s words and no date advice, even when its words mention a date', () => {
    const alert = show(
      apiErrorFrom(409, { statusCode: 409, code: 'conflict', message: 'The bench date moved; this request is no longer waiting.' }),
    );
    expect(alert.textContent).toContain('no longer waiting');
    expect(alert.textContent).not.toContain('Pick another date');
    expect(alert.textContent).not.toContain('Wait a moment');
  });

  it('a used or expired link (400 link_invalid) says to ask for a new one', () => {
    const alert = show(apiErrorFrom(400, { statusCode: 400, code: 'link_invalid', message: 'This invitation link is not valid.' }));
    expect(alert.textContent).toContain('ask for a new one');
  });

  it('an answer without a code is read by its status class (401 → sign in again), the fallback the client documents', () => {
    show(apiErrorFrom(401, { statusCode: 401, message: 'Unauthorized' }));
    expect(screen.getByRole('link', { name: 'Sign in again' })).toBeTruthy();
  });
});
