import { expect, test } from './csp';
import { encodeConfiguration } from '@loomwright/shared';
import { countedBoard, signInHere } from './people';

// A plain serial board from the demo price book.
const configuration = countedBoard(6);

test('a player requests a build, pays the deposit on the hosted page and sees it paid in My builds', async ({ page }) => {
  await page.goto(`/request?c=${encodeConfiguration(configuration)}`);
  // Not signed in: sent to sign in, then back to the request page with the same configuration.
  await expect(page).toHaveURL(/\/sign-in\?next=/);
  await signInHere(page, 'player@mail.example');
  await expect(page).toHaveURL(/\/request\?c=/);
  await expect(page.getByText(/refundable until a bench date is set/)).toBeVisible();
  await page.getByLabel('Notes for the shop (optional)').fill('Tuner first in the chain, please.');
  await page.getByRole('button', { name: 'Request build and pay deposit' }).click();

  // The fake's hosted page. Stripe testing documentation: 4000 0000 0000 0002 is a generic decline.
  await expect(page.getByRole('heading', { name: 'Test checkout' })).toBeVisible();
  await page.getByLabel('Card number').fill('4000 0000 0000 0002');
  await page.getByLabel('Expiry (MM/YY)').fill('12/34');
  await page.getByLabel('Security code').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();
  await expect(page.getByRole('alert')).toContainText('Your card was declined.');
  // … and 4242 4242 4242 4242 succeeds.
  await page.getByLabel('Card number').fill('4242 4242 4242 4242');
  await page.getByLabel('Expiry (MM/YY)').fill('12/34');
  await page.getByLabel('Security code').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();

  await expect(page).toHaveURL(/\/checkout\/return\?booking=.*&result=paid/);
  await expect(page.getByRole('heading', { name: 'Deposit paid' })).toBeVisible();
  await page.getByRole('link', { name: 'My builds' }).first().click();
  const row = page.getByRole('row', { name: /6 pedals · serial/ }).first();
  await expect(row).toContainText('Deposit paid, waiting for a bench date');
  await expect(row).toContainText('Paid');
});
