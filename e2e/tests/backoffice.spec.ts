import { request as playwrightRequest, type APIRequestContext } from '@playwright/test';
import { expect, test } from './csp';
import { payDeposit, requestBuild, signInOnPage } from './people';

/**
 * The shop's half of the main journey: a paid request reaches the backoffice, a builder accepts it
 * with the bench date the schedule suggests, and the build shows on the bench calendar that day.
 * The paid request is made the way a player makes one: sign up, request a build, pay the deposit
 * on the payment service's hosted page (the local fake, test card 4242 4242 4242 4242).
 */

const shots = (name: string) => `screenshots/backoffice-${name}.png`;

async function paidRequest(baseURL: string, page: import('@playwright/test').Page) {
  const player: APIRequestContext = await playwrightRequest.newContext({ baseURL });
  const stamp = Date.now();
  const name = `Marlo Quist ${stamp % 10000}`;
  const signUp = await player.post('/api/auth/sign-up', {
    data: { email: `marlo.${stamp}@mail.example`, password: 'a-long-test-pass', name },
  });
  expect(signUp.status(), await signUp.text()).toBe(201);
  const booking = await requestBuild(player, {
    recommendedCase: true,
    level: 'master',
    pedals: [
      { name: 'Tuner', kind: 'tuner', powered: true, inLoop: false, currentMa: 80, voltage: 9 },
      { name: 'Green overdrive', kind: 'compact', powered: true, inLoop: false, currentMa: 12, voltage: 9 },
      { name: 'Analog delay', kind: 'compact', powered: true, inLoop: false, currentMa: 40, voltage: 9 },
    ],
    notes: 'Please keep the tuner first in the chain.',
  });
  // A paid checkout sends the player back to the shop's own return page; the webhook marks the deposit paid.
  await payDeposit(page, player, booking.id, baseURL);
  await player.dispose();
  return { ...booking, customerName: name };
}

test('a builder accepts a paid request at the suggested bench date and sees it on the bench', async ({ page, baseURL }) => {
  const paid = await paidRequest(baseURL!, page);

  await signInOnPage(page, 'backoffice', 'builder@shop.example');
  await expect(page.getByRole('navigation', { name: 'Backoffice' })).toBeVisible();

  // Find it the way the shop does: the requests table, narrowed to paid deposits, searched by customer.
  await page.getByRole('navigation', { name: 'Backoffice' }).getByRole('link', { name: 'Requests' }).click();
  await expect(page.getByRole('heading', { name: 'Requests' })).toBeVisible();
  await page.getByRole('combobox', { name: 'Deposit' }).click();
  await page.getByRole('option', { name: 'Paid', exact: true }).click();
  await page.getByLabel('Search').fill(paid.customerName);
  // The search goes out once typing pauses; the table then holds this customer's requests only.
  await expect(page).toHaveURL(/[?&]q=Marlo/);
  const row = page.getByRole('row').filter({ hasText: paid.reference });
  await expect(row).toBeVisible();
  await expect(row).toContainText('Deposit paid');
  await page.screenshot({ path: shots('requests'), fullPage: true });

  await row.click();
  const panel = page.getByRole('dialog');
  await expect(panel.getByRole('heading', { name: `${paid.reference} · ${paid.customerName}` })).toBeVisible();
  await expect(panel.getByText('Please keep the tuner first in the chain.')).toBeVisible();
  await expect(panel.getByRole('table', { name: 'Estimate lines' })).toBeVisible();
  await page.screenshot({ path: shots('request-panel'), fullPage: true });
  await panel.getByRole('button', { name: 'Accept…' }).click();

  const accept = page.getByRole('dialog', { name: `Accept ${paid.reference} and set the bench date` });
  await expect(accept.getByText(/Teodor Lind \(you\) · master/)).toBeVisible();
  // The builder takes it on their own bench; the date field then holds that bench's suggestion.
  await accept.getByRole('radio', { name: /Teodor Lind \(you\)/ }).check();
  await expect(accept.getByRole('radio', { name: /Teodor Lind \(you\)/ })).toBeChecked();
  const benchDateInput = accept.getByLabel('Bench date');
  await expect(benchDateInput).toHaveValue(/^\d{4}-\d{2}-\d{2}$/);
  const benchDate = await benchDateInput.inputValue();
  await expect(accept.getByText(/^Suggested: the earliest day/)).toBeVisible();
  await page.screenshot({ path: shots('accept-dialog'), fullPage: true });
  await accept.getByRole('button', { name: 'Accept and schedule' }).click();
  await expect(page.getByText(`${paid.reference} is scheduled with Teodor Lind`)).toBeVisible();

  // The bench calendar for that week shows the build on the builder's own row, on that day.
  await page.keyboard.press('Escape');
  await page.goto(`/backoffice/bench?day=${benchDate}`);
  const benchTable = page.getByRole('table', { name: 'Bench time per builder and day' });
  await expect(benchTable).toBeVisible();
  const ownRow = benchTable.getByRole('row').filter({ hasText: 'Teodor Lind (you)' });
  await expect(ownRow.getByRole('link', { name: new RegExp(`${paid.reference} · ${paid.customerName}`) }).first()).toBeVisible();
  // The first row under the header is the signed-in builder's own bench.
  await expect(benchTable.getByRole('row').nth(1)).toContainText('Teodor Lind (you)');
  await expect(ownRow).toContainText(/\d+(\.\d+)? of \d+(\.\d+)? h/);
  await page.screenshot({ path: shots('bench-week'), fullPage: true });

  await page.getByRole('button', { name: 'Month' }).click();
  // One grid for every builder; the signed-in builder's month total is named above it.
  await expect(page.getByRole('grid', { name: 'Bench this month, every builder' })).toBeVisible();
  await expect(page.getByRole('list', { name: 'Booked this month' })).toContainText('Teodor Lind');
  await page.screenshot({ path: shots('bench-month'), fullPage: true });

  // And the API agrees: scheduled with that builder on that date.
  const staff = page.request;
  const detail = await (await staff.get(`/api/bookings/${paid.id}`)).json();
  expect(detail.state).toBe('scheduled');
  expect(detail.benchDate).toBe(benchDate);
  expect(detail.builder.name).toBe('Teodor Lind');

  await page.goto(`/backoffice/builds/${paid.id}`);
  await expect(page.getByRole('heading', { name: `${paid.reference} · ${paid.customerName}` })).toBeVisible();
  await expect(page.getByRole('button', { name: 'Mark pedals received' })).toBeDisabled();
  await page.screenshot({ path: shots('build-page'), fullPage: true });
});

test("the owner's pages read the shop's real data: team, price book, settings with holidays, customers, builds", async ({ page }) => {
  await signInOnPage(page, 'backoffice', 'owner@shop.example');
  await expect(page.getByRole('navigation', { name: 'Backoffice' })).toBeVisible();

  await page.goto('/backoffice/team');
  const team = page.getByRole('table', { name: 'Builders' });
  await expect(team.getByRole('row').filter({ hasText: 'Teodor Lind' })).toContainText('$125.00/hr');
  await expect(team.getByRole('button', { name: 'Edit Teodor Lind' })).toBeVisible();
  await page.screenshot({ path: shots('team'), fullPage: true });

  await page.goto('/backoffice/price-book');
  // The whole book renders as one form; on a busy test machine that can take longer than a plain page.
  await expect(page.getByRole('button', { name: /^Publish as version \d+$/ })).toBeVisible({ timeout: 30_000 });
  await expect(page.getByRole('table', { name: 'Price book versions' })).toContainText('current');
  await page.screenshot({ path: shots('price-book'), fullPage: false });

  await page.goto('/backoffice/settings');
  await expect(page.getByRole('heading', { name: 'Public holidays, next twelve months' })).toBeVisible();
  await expect(page.getByText(/From the date-holidays dataset for United States/)).toBeVisible();
  // 25 December is a US federal public holiday (5 U.S.C. 6103(a)); in 2026 it falls on a Friday.
  // The list covers the coming twelve months, so the test only runs this check while 25 Dec 2026 is ahead.
  if (new Date() < new Date('2026-12-25T00:00:00Z')) await expect(page.getByText('Fri, Dec 25 · Christmas Day')).toBeVisible();
  await page.screenshot({ path: shots('settings'), fullPage: true });

  await page.goto('/backoffice/customers');
  await page.getByLabel('Search').fill('player@mail.example');
  const row = page.getByRole('table', { name: 'Customers' }).getByRole('row').filter({ hasText: 'player@mail.example' });
  await expect(row).toBeVisible();
  await row.click();
  await expect(page.getByRole('dialog').getByRole('heading', { name: 'Messages sent' })).toBeVisible();
  // The search typed just before lands after its pause; it must narrow the list, not close the panel.
  await page.waitForTimeout(800);
  await expect(page.getByRole('dialog').getByRole('heading', { name: 'Messages sent' })).toBeVisible();
  await expect(page).toHaveURL(/q=player%40mail\.example/);
  await page.screenshot({ path: shots('customer-panel'), fullPage: true });

  await page.keyboard.press('Escape');
  await page.goto('/backoffice/builds');
  await expect(page.getByRole('tab', { name: /Scheduled/ })).toBeVisible();
  await page.screenshot({ path: shots('builds'), fullPage: true });
});
