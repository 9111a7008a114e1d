import { expect, test } from './csp';
import { signInHere, signUpHere } from './people';

const password = 'a-new-player-password';

test('a player signs up from a page, comes back to it, signs out and signs in again', async ({ page }) => {
  const email = `e2e.player.${Date.now()}@mail.example`;
  await page.goto('/');
  await page.getByRole('link', { name: 'Sign in' }).click();
  await page.getByRole('link', { name: 'Create an account' }).click();

  // Bad input is refused in words before anything is sent (shared zod schema).
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByText('Enter a name')).toBeVisible();
  await expect(page.getByText('Choose a password of at least 10 characters')).toBeVisible();

  await signUpHere(page, 'Ilse Brandvold', email, password);
  await expect(page.getByRole('navigation', { name: 'Main' }).getByText('Ilse Brandvold')).toBeVisible();

  await page.getByRole('link', { name: 'Account' }).click();
  await expect(page.getByRole('heading', { name: 'My account' })).toBeVisible();
  await expect(page.getByText(email)).toBeVisible();
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('link', { name: 'Sign in' })).toBeVisible();

  // `next` brings the player back to the page that sent them.
  await page.goto('/sign-in?next=%2Faccount');
  await signInHere(page, email, 'not-the-password');
  await expect(page.getByRole('alert')).toContainText('do not match an account');
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/account$/);
  await expect(page.getByText(email)).toBeVisible();

  // The same person in the backoffice gets a clear "staff only" page with a way out.
  await page.goto('/backoffice/');
  await expect(page.getByRole('heading', { name: 'Staff only' })).toBeVisible();
  await page.getByRole('button', { name: 'Sign out' }).click();
  await expect(page.getByRole('heading', { name: 'Staff sign in' })).toBeVisible();
});

test('forgot password answers the same for any address', async ({ page }) => {
  await page.goto('/forgot-password');
  await page.getByLabel('E-mail').fill('nobody.at.all@mail.example');
  await page.getByRole('button', { name: 'Send me a reset link' }).click();
  await expect(page.getByRole('status').filter({ hasText: 'If an account uses that e-mail' })).toBeVisible();
});
