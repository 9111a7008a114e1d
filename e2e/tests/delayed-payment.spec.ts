import { expect, test } from './csp';
import { encodeConfiguration } from '@loomwright/shared';
import { countedBoard, signInHere } from './people';

// A plain serial board from the demo price book.
const configuration = countedBoard(7);

/**
 * A deposit paid by bank debit, which settles days later. Test numbers from the provider's ACH
 * testing guide (from memory): routing 110000000 with account 000123456789 settles successfully.
 */
test('a player pays the deposit by bank debit, sees it settling, and the booking moves on when it settles', async ({ page, request }) => {
  await page.goto(`/request?c=${encodeConfiguration(configuration)}`);
  await expect(page).toHaveURL(/\/sign-in\?next=/);
  await signInHere(page, 'player@mail.example');
  await expect(page).toHaveURL(/\/request\?c=/);
  await page.getByRole('button', { name: 'Request build and pay deposit' }).click();

  await expect(page.getByRole('heading', { name: 'Test checkout' })).toBeVisible();
  await page.getByLabel('Routing number').fill('110000000');
  await page.getByLabel('Account number').fill('000123456789');
  await page.getByRole('button', { name: /^Debit .* from the bank account$/ }).click();

  await expect(page).toHaveURL(/\/checkout\/return\?booking=.*&result=paid/);
  await expect(page.getByRole('heading', { name: 'Bank payment started' })).toBeVisible();
  const bookingId = new URL(page.url()).searchParams.get('booking')!;
  await page.goto(`/builds/${bookingId}`);
  await expect(page.getByText('Bank payment settling (a few working days)')).toBeVisible();
  await expect(page.getByText(/Your bank payment is settling/)).toBeVisible();
  await expect(page.getByRole('button', { name: 'Pay the deposit' })).toHaveCount(0);

  // The bank settles: the fake reports it with its signed events.
  const settled = await request.post(`${process.env.E2E_PAYMENT_URL}/_control/payment_intents/settle_processing`);
  expect(settled.ok()).toBe(true);
  expect(((await settled.json()) as { settled: string[] }).settled).toHaveLength(1);

  await expect(async () => {
    await page.reload();
    await expect(page.getByText('Deposit paid, waiting for a bench date').first()).toBeVisible({ timeout: 5_000 });
  }).toPass({ timeout: 40_000 });
  await expect(page.getByText(/paid by bank debit; it settles in a few working days/)).toBeVisible();
});
