import { cleanup, screen } from '@testing-library/react';
import { apiErrorFrom } from '@loomwright/shared';
import { renderWithProviders } from '@loomwright/shared/ui/testing';
import { afterEach, describe, expect, it } from 'vitest';
import { theme } from 'src/theme';
import { NewPasswordForm } from './NewPasswordForm';

const renderWith = (error: Error) =>
  renderWithProviders(<NewPasswordForm submitLabel="Save the new password" pending={false} error={error} onSubmit={() => {}} />, { theme });

describe('Choose a new password: a refused reset link', () => {
  afterEach(cleanup);

  it('a used or expired reset link (400 link_invalid) offers to ask for a new one, on the forgot-password page', () => {
    renderWith(apiErrorFrom(400, { statusCode: 400, code: 'link_invalid', message: 'This reset link has expired or was used already.' }));
    expect(screen.getByRole('alert').textContent).toContain('This reset link has expired or was used already.');
    expect(screen.getByRole('link', { name: 'Ask for a new reset link' }).getAttribute('href')).toBe('/forgot-password');
  });

  it('another 400 (bad_request) shows the server’s words only', () => {
    renderWith(apiErrorFrom(400, { statusCode: 400, code: 'bad_request', message: 'The reset link is missing from the address.' }));
    expect(screen.getByRole('alert').textContent).toContain('missing from the address');
    expect(screen.queryByRole('link', { name: 'Ask for a new reset link' })).toBeNull();
  });
});
