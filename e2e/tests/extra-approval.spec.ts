import { request as playwrightRequest, type APIRequestContext } from '@playwright/test';
import { expect, test } from './csp';
import { acceptAtEarliest, apiAs, payDeposit, requestBuild, tunerAndReverb, signInHere, signInOnPage } from './people';

/**
 * An extra from proposal to delivery: the owner proposes an extra with its price, the player
 * approves it from the link in the e-mail, both see a balance that includes it, the player pays the
 * balance on the payment provider's hosted page, and the owner delivers the board.
 *
 * Amounts are checked in whole cents against the rule the shop states:
 * balance = firm total + approved extras − net payments (common practice, no published source).
 */

const mailUrl = process.env.E2E_MAIL_URL ?? 'http://127.0.0.1:8125';
const cents = (amount: string) => BigInt(Math.round(Number(amount) * 100));
const dollars = (c: bigint) => `$${(c / 100n).toLocaleString('en-US')}.${String(c % 100n).padStart(2, '0')}`;

test('the owner proposes an extra, the player approves it from the e-mail, pays the balance that includes it, and the board is delivered', async ({
  browser,
  baseURL,
  request,
  page: me,
}) => {
  test.setTimeout(300_000);
  const stamp = Date.now();
  const email = `noor.${stamp}@mail.example`;
  const password = 'a-long-player-password';
  const name = `Noor Halvorsen ${stamp % 10000}`;

  // Setup through the API (the deposit on the fake's hosted page): a paid, accepted build on the bench.
  const player: APIRequestContext = await playwrightRequest.newContext({ baseURL });
  expect((await player.post('/api/auth/sign-up', { data: { email, password, name } })).status()).toBe(201);
  const booking = await requestBuild(player, { recommendedCase: true, level: 'master', pedals: tunerAndReverb });
  const payPage = await browser.newPage();
  await payDeposit(payPage, player, booking.id, baseURL!);
  await payPage.close();

  const builder = await apiAs(baseURL!, 'builder@shop.example');
  await acceptAtEarliest(builder, booking.id);
  const intake = await builder.post(`/api/bookings/${booking.id}/intake`, {
    data: { items: ['Tuner', 'Plate reverb', 'Power supply'].map((item) => ({ item, condition: 'working' })) },
  });
  expect(intake.ok(), await intake.text()).toBeTruthy();
  for (const to of ['pedals_received', 'on_bench']) {
    const moved = await builder.post(`/api/bookings/${booking.id}/state`, { data: { to } });
    expect(moved.ok(), await moved.text()).toBeTruthy();
  }

  // The owner proposes the extra from the build page.
  const shop = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
  await signInOnPage(shop, 'backoffice', 'owner@shop.example');
  await expect(shop.getByRole('navigation', { name: 'Backoffice' })).toBeVisible();
  await shop.goto(`/backoffice/builds/${booking.id}`);
  await shop.getByLabel('Extra', { exact: true }).fill('Longer road case');
  await shop.getByLabel(/^Price/).fill('45.50');
  await shop.getByLabel('Why').fill('The rig no longer fits the first case');
  await shop.getByRole('button', { name: 'Ask the player', exact: true }).click();
  await expect(shop.getByRole('table', { name: 'Extras' })).toContainText('Longer road case');

  // The e-mail reaches the player with the price and a link to answer.
  let mail: { subject: string; text: string } | undefined;
  await expect
    .poll(
      async () => {
        const list = (await (await request.get(`${mailUrl}/api/messages`, { params: { to: email } })).json()) as Array<{
          subject: string;
          text: string;
        }>;
        mail = list.find((m) => m.subject.startsWith('Your approval, please'));
        return mail?.subject ?? '';
      },
      { timeout: 60_000 },
    )
    .toBe(`Your approval, please: Longer road case for $45.50 (${booking.reference})`);
  const link = mail!.text.match(/https?:\/\/\S+\/builds\/[0-9a-f-]{36}/)?.[0];
  expect(link, mail!.text).toBeTruthy();

  // The player follows the link, signs in, and approves.
  // The player's page is the test's own (its console is watched for CSP violations).
  await me.goto(link!);
  await me.waitForURL(/\/sign-in/);
  await signInHere(me, email, password);
  await me.waitForURL((url) => url.pathname === `/builds/${booking.id}`);
  const card = me.getByRole('region', { name: 'Extra: Longer road case' }).or(me.getByLabel('Extra: Longer road case'));
  await expect(card).toContainText('$45.50');
  await card.getByRole('button', { name: 'Approve' }).click();
  await expect(card).toContainText(/approved/i);

  // Both see the same balance, and it includes the extra.
  const detail = await (await player.get(`/api/bookings/${booking.id}`)).json();
  const expected = cents(detail.firmQuote.total) + 4550n - cents(detail.deposit);
  expect(cents(detail.money.balanceDue)).toBe(expected);
  const money = me.getByRole('table', { name: 'Money' });
  await expect(money).toContainText(`Approved extras${dollars(4550n)}`);
  await expect(money).toContainText(`Balance due${dollars(expected)}`);
  await me.screenshot({ path: test.info().outputPath('player-balance.png'), fullPage: true });
  await shop.reload();
  await expect(shop.getByRole('table', { name: 'Money' })).toContainText(`Approved extras${dollars(4550n)}`);
  await expect(shop.getByRole('table', { name: 'Money' })).toContainText(`Balance due${dollars(expected)}`);
  await shop.screenshot({ path: test.info().outputPath('shop-balance.png'), fullPage: true });

  // The shop finishes the build and marks it ready; the player pays the balance on the hosted page.
  for (const to of ['testing', 'ready']) {
    const moved = await builder.post(`/api/bookings/${booking.id}/state`, { data: { to } });
    expect(moved.ok(), await moved.text()).toBeTruthy();
  }
  await me.reload();
  await me.getByRole('button', { name: 'Pay the balance' }).click();
  await me.waitForURL((url) => !url.href.startsWith(baseURL!));
  await expect(me.getByText(dollars(expected)).first()).toBeVisible();
  await me.getByLabel('Card number').fill('4242 4242 4242 4242');
  await me.getByLabel('Expiry (MM/YY)').fill('12/34');
  await me.getByLabel('Security code').fill('123');
  await me.getByRole('button', { name: /^Pay / }).click();
  await me.waitForURL((target) => target.origin === new URL(baseURL!).origin);
  await expect
    .poll(async () => (await (await player.get(`/api/bookings/${booking.id}`)).json()).money.settled, { timeout: 20_000 })
    .toBe(true);

  // With nothing due, the owner is offered delivery and delivers.
  await shop.reload();
  await shop.getByRole('button', { name: 'Mark delivered' }).click();
  await shop.getByRole('dialog').getByRole('button', { name: 'Confirm' }).click();
  await expect(shop.getByText(`${booking.reference}: Delivered.`)).toBeVisible();
  const done = await (await player.get(`/api/bookings/${booking.id}`)).json();
  expect(done.state).toBe('delivered');
  expect(done.money.balanceDue).toBe('0.00');
  expect(cents(done.money.netPaid)).toBe(cents(detail.firmQuote.total) + 4550n);
  await me.goto(`/builds/${booking.id}`);
  await expect(me.getByRole('table', { name: 'Money' })).toContainText(`Balance due${dollars(0n)}`);
  await me.screenshot({ path: test.info().outputPath('player-delivered.png'), fullPage: true });

  await player.dispose();
  await builder.dispose();
});
