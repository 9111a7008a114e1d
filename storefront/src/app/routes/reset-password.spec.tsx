import { fireEvent, screen } from '@testing-library/react';
import { json, renderWithProviders, stubFetch, validationFailed, wordsUnder } from '@loomwright/shared/ui/testing';
import { describe, expect, it } from 'vitest';
import { storefrontTheme } from 'src/theme';
import { Component as ResetPasswordPage } from './reset-password';

/** The reset page at a link's address, with the API's answer to the reset scripted. */
function renderWithAnswer(answer: Response) {
  const fetchMock = stubFetch(() => answer);
  renderWithProviders(<ResetPasswordPage />, { theme: storefrontTheme(), url: '/reset-password?token=a-link-token' });
  return fetchMock;
}

function submitPassword(password: string, again = password) {
  fireEvent.change(screen.getByLabelText('New password'), { target: { value: password } });
  fireEvent.change(screen.getByLabelText('New password again'), { target: { value: again } });
  fireEvent.click(screen.getByRole('button', { name: 'Save password and sign in' }));
}

describe('Choose a new password: what the page does with each answer', () => {
  it('two passwords that differ are refused in the shared words and nothing is sent', async () => {
    const fetchMock = renderWithAnswer(json(500, {}));
    submitPassword('a-long-password', 'a-long-passwort');
    expect(await screen.findByText('The two passwords do not match; type the same password twice')).toBeTruthy();
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it('a used or expired reset link (400 link_invalid) offers to ask for a new one, on the forgot-password page', async () => {
    renderWithAnswer(json(400, { statusCode: 400, code: 'link_invalid', message: 'This reset link has expired or was used already.' }));
    submitPassword('a-long-password');
    expect((await screen.findByRole('alert')).textContent).toContain('This reset link has expired or was used already.');
    expect(screen.getByRole('link', { name: 'Ask for a new reset link' }).getAttribute('href')).toBe('/forgot-password');
  });

  it('another 400 (bad_request) shows the server’s words only', async () => {
    renderWithAnswer(json(400, { statusCode: 400, code: 'bad_request', message: 'The reset link is missing from the address.' }));
    submitPassword('a-long-password');
    expect((await screen.findByRole('alert')).textContent).toContain('missing from the address');
    expect(screen.queryByRole('link', { name: 'Ask for a new reset link' })).toBeNull();
  });

  it('a validation_failed answer about the password stands under the password field, with no alert above the form', async () => {
    const words = 'Choose a password of at least 10 characters';
    renderWithAnswer(validationFailed('password', words));
    submitPassword('a-long-password');
    expect(await screen.findByText(words)).toBeTruthy();
    expect(wordsUnder('New password')).toBe(words);
    expect(screen.queryByRole('alert')).toBeNull();
  });
});
