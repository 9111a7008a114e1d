import type { APIRequestContext, Page } from '@playwright/test';
import { expect, test } from './csp';
import { countedBoard, ownBenchBooking, shoot, signInHere, signUpHere } from './people';

/**
 * The main journey, end to end, as a player and the shop live it: configure a board, sign up,
 * request the build, pay the deposit on the payment provider's hosted page (the local fake),
 * a builder accepts it at the bench date the schedule suggests, the player's mailbox holds the
 * scheduled message with its calendar file, and a later price change leaves the quote alone.
 *
 * Card numbers are the payment provider's published test cards (Stripe testing documentation):
 * 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002 is a generic decline.
 */

const mailUrl = process.env.E2E_MAIL_URL ?? 'http://127.0.0.1:8125';

const decode = (c: string) => JSON.parse(Buffer.from(c, 'base64url').toString('utf8'));
/** Next, at a person's pace: once the estimate for the last change is on screen, and on to the named step. */
async function nextStep(page: Page, title: string) {
  // Figures for the last change on screen, or (before the first surface, case and pedals) the
  // panel saying what is still to choose.
  const panel = page.getByRole('complementary', { name: 'Estimate' });
  await expect(panel.getByText('Up to date').or(panel.getByTestId('estimate-missing'))).toBeVisible();
  await page
    .getByRole('navigation', { name: 'Step navigation' })
    .getByRole('button', { name: `Next: ${title}` })
    .click();
  await expect(
    page.getByRole('navigation', { name: 'Configurator steps' }).getByText(new RegExp(`^Step \\d of 7: ${title}$`)),
  ).toBeVisible();
}

/** A day as both apps and the e-mail write it for the demo shop (en-US, CLDR yMMMEd "EEE, MMM d, y"): "Tue, Jan 12, 2027". */
function writtenDay(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Intl.DateTimeFormat('en-US', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(Date.UTC(y!, m! - 1, d!, 12)),
  );
}

async function payOnHostedPage(page: Page, card: string) {
  await expect(page.getByRole('heading', { name: 'Test checkout' })).toBeVisible();
  await page.getByLabel('Card number').fill(card);
  await page.getByLabel('Expiry (MM/YY)').fill('12/34');
  await page.getByLabel('Security code').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();
}

interface MailMessage {
  id: string;
  to: string;
  subject: string;
  text: string;
  attachments: Array<{ filename: string; contentType: string; content: string }>;
}

async function mailboxOf(request: APIRequestContext, to: string): Promise<MailMessage[]> {
  const res = await request.get(`${mailUrl}/api/messages`, { params: { to } });
  expect(res.ok()).toBeTruthy();
  const body = await res.json();
  return (Array.isArray(body) ? body : body.messages) as MailMessage[];
}

async function signUpFromSignIn(page: Page, name: string, email: string) {
  await expect(page).toHaveURL(/\/sign-in\?next=/);
  await page.getByRole('link', { name: 'Create an account' }).click();
  await signUpHere(page, name, email, 'a-long-player-password');
}

async function staffSignIn(page: Page, email: string) {
  await page.goto('/backoffice/sign-in');
  await signInHere(page, email);
  await expect(page.getByRole('navigation', { name: 'Backoffice' })).toBeVisible();
}

test('a player configures, signs up, pays the deposit; a builder schedules it; the mail and the quote hold', async ({
  browser,
  request,
}, testInfo) => {
  test.setTimeout(300_000);
  const stamp = Date.now();
  const playerName = `Noor Vassily ${stamp % 10000}`;
  const playerEmail = `noor.${stamp}@mail.example`;
  const player = await browser.newPage({ viewport: { width: 1440, height: 1000 } });

  // 1. Configure: eight pedals, four of them in switcher loops, stereo output.
  await player.goto('/');
  await shoot(player, testInfo, 'storefront-home');
  await player.getByRole('link', { name: 'Start configuring your board' }).click();
  await player.getByRole('radio', { name: /Ridge 100/ }).click();
  await nextStep(player, 'Case');
  await player.getByRole('radio', { name: /Tour road case/ }).click();
  await nextStep(player, 'Pedals');
  await player.getByRole('spinbutton', { name: 'Number of pedals' }).fill('6');
  await player.getByRole('button', { name: 'One pedal more' }).click();
  await player.getByRole('button', { name: 'One pedal more' }).click();
  await expect.poll(() => decode(new URL(player.url()).searchParams.get('c')!).pedalCount).toBe(8);
  await nextStep(player, 'Routing');
  await player.getByRole('radio', { name: /Loop switcher/ }).click();
  await expect.poll(() => decode(new URL(player.url()).searchParams.get('c')!).routing.mode).toBe('switcher');
  // Four pedals into loops, ticked one after another as a player does.
  for (const n of [3, 4, 5, 6]) await player.getByRole('checkbox', { name: `${n}. Pedal ${n}` }).click();
  await expect(player.getByText('4 of 8 in loops.')).toBeVisible();
  for (const n of [3, 4, 5, 6]) await expect(player.getByRole('checkbox', { name: `${n}. Pedal ${n}` })).toBeChecked();
  await nextStep(player, 'Extras');
  await player.getByRole('checkbox', { name: 'Stereo output' }).click();
  await expect(player.getByRole('checkbox', { name: 'Stereo output' })).toBeChecked();
  await nextStep(player, 'Builder');
  await player.getByRole('radio', { name: /Master/ }).click();
  await nextStep(player, 'Review');
  await expect(player.getByRole('button', { name: 'Request this build' })).toBeVisible();

  // The live estimate on screen is exactly what POST /api/estimates answers for this configuration.
  const configuration = decode(new URL(player.url()).searchParams.get('c')!);
  expect(configuration.pedals).toHaveLength(8);
  expect(configuration.pedals.filter((p: { inLoop: boolean }) => p.inLoop)).toHaveLength(4);
  expect(configuration.routing.mode).toBe('switcher');
  expect(configuration.functions).toEqual(['stereo_output']);
  const estimate = await (await request.post('/api/estimates', { data: configuration })).json();
  const panel = player.getByRole('complementary', { name: 'Estimate' });
  await expect(panel.getByTestId('estimate-labor')).toContainText(`(${Number(estimate.laborHours)} hr)`);
  await expect(panel.getByTestId('estimate-deposit')).toHaveText(
    new Intl.NumberFormat('en-US', {
      style: 'currency',
      currency: estimate.currency,
      minimumFractionDigits: /\.\d*[1-9]/.test(estimate.deposit) ? 2 : 0,
    }).format(Number(estimate.deposit)),
  );
  await shoot(player, testInfo, 'storefront-review');

  // 2. Sign up on the way, request the build, pay the deposit on the hosted page.
  await player.getByRole('button', { name: 'Request this build' }).click();
  await signUpFromSignIn(player, playerName, playerEmail);
  await expect(player).toHaveURL(/\/request\?c=/);
  // Before paying, the player sees the bench date a master builder could start on today.
  const lead = await (await request.get('/api/bench/lead-time', { params: { hours: estimate.laborHours, level: 'master' } })).json();
  expect(lead.earliestBenchDate).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  await expect(player.getByTestId('lead-time')).toContainText(`Earliest bench date ${writtenDay(lead.earliestBenchDate)}`);
  await player.getByLabel('Notes for the shop (optional)').fill('The fuzz must stay before the wah.');
  await shoot(player, testInfo, 'storefront-request');
  await player.getByRole('button', { name: 'Request build and pay deposit' }).click();
  await shoot(player, testInfo, 'payment-hosted-page');
  await payOnHostedPage(player, '4242 4242 4242 4242');
  await expect(player).toHaveURL(/\/checkout\/return\?booking=.*&result=paid/);
  await expect(player.getByRole('heading', { name: 'Deposit paid' })).toBeVisible();
  const bookingId = new URL(player.url()).searchParams.get('booking')!;
  const paid = await (await player.request.get(`/api/bookings/${bookingId}`)).json();
  expect(paid.depositStatus).toBe('paid');
  expect(paid.deposit).toBe(estimate.deposit);
  expect(paid.quote.priceBookVersion).toBe(estimate.priceBookVersion);
  await shoot(player, testInfo, 'storefront-paid');

  // 3. A builder finds the paid request and accepts it with the suggested bench date.
  const shop = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
  await staffSignIn(shop, 'builder@shop.example');
  await shop.getByRole('navigation', { name: 'Backoffice' }).getByRole('link', { name: 'Requests' }).click();
  await shop.getByLabel('Search').fill(playerName);
  await expect(shop).toHaveURL(/[?&]q=/);
  const row = shop.getByRole('row').filter({ hasText: paid.reference });
  await expect(row).toContainText('Deposit paid');
  await shoot(shop, testInfo, 'backoffice-requests');
  await row.click();
  await shop.getByRole('dialog').getByRole('button', { name: 'Accept…' }).click();
  const accept = shop.getByRole('dialog', { name: `Accept ${paid.reference} and set the bench date` });
  // The builder takes it on their own bench (earlier tests may have filled it more than Wren's,
  // so the dialog's first pick, the earliest start, may be someone else's).
  await accept.getByRole('radio', { name: /Teodor Lind \(you\)/ }).check();
  await expect(accept.getByRole('radio', { name: /Teodor Lind \(you\)/ })).toBeChecked();
  const suggested = await (await shop.request.get('/api/bench/suggest', { params: { bookingId } })).json();
  const own = suggested.suggestions.find((s: { builder: { isMe: boolean } }) => s.builder.isMe);
  await expect(accept.getByLabel('Bench date')).toHaveValue(own.benchDate);
  const benchDate = await accept.getByLabel('Bench date').inputValue();
  expect(JSON.stringify(suggested)).toContain(benchDate);
  // The only master's bench: the date the player was shown before paying holds, or comes sooner.
  expect(benchDate <= lead.earliestBenchDate).toBe(true);
  await shoot(shop, testInfo, 'backoffice-accept');
  await accept.getByRole('button', { name: 'Accept and schedule' }).click();
  await expect(shop.getByText(`${paid.reference} is scheduled with Teodor Lind`)).toBeVisible();
  await shop.keyboard.press('Escape');
  await shop.goto(`/backoffice/bench?day=${benchDate}`);
  await expect(ownBenchBooking(shop, 'Teodor Lind', paid.reference)).toBeVisible();
  await shoot(shop, testInfo, 'backoffice-bench');

  // 4. The player's mailbox: the scheduled message with that date and a calendar attachment.
  let scheduled: MailMessage | undefined;
  await expect
    .poll(async () => (scheduled = (await mailboxOf(request, playerEmail)).find((m) => m.subject.includes('bench date'))), {
      timeout: 30_000,
    })
    .toBeTruthy();
  if (!scheduled) throw new Error('no scheduled message');
  expect(scheduled.subject).toContain(writtenDay(benchDate));
  expect(scheduled.text).toContain(writtenDay(benchDate));
  const calendar = scheduled.attachments.find((a) => a.filename.endsWith('.ics') || a.contentType.startsWith('text/calendar'));
  expect(calendar, 'an iCalendar attachment').toBeTruthy();
  // RFC 5545: a VCALENDAR holding a VEVENT with a DTSTART.
  const ics = Buffer.from(calendar!.content, 'base64').toString('utf8');
  expect(ics).toMatch(/BEGIN:VCALENDAR[\s\S]*BEGIN:VEVENT[\s\S]*DTSTART/);
  await player.goto(`${mailUrl}/`);
  await shoot(player, testInfo, 'mail-fake-mailbox');

  // … and the storefront's Build detail shows it scheduled on that date.
  await player.goto(`/builds/${bookingId}`);
  await expect(player.getByText('Scheduled').first()).toBeVisible();
  await expect(player.getByText(/^Bench date:/)).toContainText(writtenDay(benchDate));
  await shoot(player, testInfo, 'storefront-build-detail');
  const before = await (await player.request.get(`/api/bookings/${bookingId}`)).json();

  // 5. The owner raises a price; the player's existing quote does not change.
  const owner = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
  await staffSignIn(owner, 'owner@shop.example');
  await owner.goto('/backoffice/price-book');
  const cablePrice = owner.getByLabel('Patch cable price per foot');
  const oldCable = Number(await cablePrice.inputValue());
  await cablePrice.fill((oldCable + 0.5).toFixed(2));
  await owner.getByLabel('What changed (kept with the version)').fill('Cable up 50 cents a foot');
  await shoot(owner, testInfo, 'backoffice-price-book');
  await owner.getByRole('button', { name: /^Publish as version/ }).click();
  await expect
    .poll(async () => (await (await request.get('/api/catalog')).json()).priceBookVersion, { timeout: 15_000 })
    .toBeGreaterThan(estimate.priceBookVersion);
  const repriced = await (await request.post('/api/estimates', { data: configuration })).json();
  expect(Number(repriced.materialsTotal)).toBeGreaterThan(Number(estimate.materialsTotal));

  const after = await (await player.request.get(`/api/bookings/${bookingId}`)).json();
  expect(after.quote).toEqual(before.quote);
  expect(after.firmQuote).toEqual(before.firmQuote);
  expect(after.quote.priceBookVersion).toBe(estimate.priceBookVersion);
  await player.reload();
  await expect(player.getByText(/^Bench date:/)).toContainText(writtenDay(benchDate));
});

test('a declined card and an abandoned checkout leave the booking unpaid, said in words; a later retry pays', async ({ page }) => {
  test.setTimeout(180_000);
  const stamp = Date.now();
  const email = `arvo.${stamp}@mail.example`;
  const configuration = countedBoard(5);
  await page.goto(`/request?c=${Buffer.from(JSON.stringify(configuration)).toString('base64url')}`);
  await signUpFromSignIn(page, `Arvo Lindqvist ${stamp % 10000}`, email);
  await page.getByRole('button', { name: 'Request build and pay deposit' }).click();

  // Declined: the hosted page says why, and nothing is paid.
  await payOnHostedPage(page, '4000 0000 0000 0002');
  await expect(page.getByRole('alert')).toContainText('Your card was declined.');
  // Abandoned: the player leaves through the cancel link and is told where things stand.
  await page.getByRole('link', { name: 'Cancel and go back to the shop' }).click();
  await expect(page).toHaveURL(/\/checkout\/return\?booking=.*&result=cancelled/);
  // The return page says what happened: the last attempt was refused, nothing was charged.
  await expect(page.getByRole('heading', { name: /^Payment (failed|cancelled)$/ })).toBeVisible();
  await expect(page.getByText(/Nothing was charged/)).toBeVisible();
  const bookingId = new URL(page.url()).searchParams.get('booking')!;
  const unpaid = await (await page.request.get(`/api/bookings/${bookingId}`)).json();
  expect(unpaid.state).toBe('requested');
  expect(unpaid.depositStatus).not.toBe('paid');
  expect(unpaid.payments.filter((p: { status: string }) => p.status === 'paid')).toHaveLength(0);

  // Later, from Build detail, the same booking is paid with the success card.
  await page.goto(`/builds/${bookingId}`);
  await page.getByRole('button', { name: 'Pay the deposit' }).click();
  await payOnHostedPage(page, '4242 4242 4242 4242');
  await expect(page.getByRole('heading', { name: 'Deposit paid' })).toBeVisible();
  const paid = await (await page.request.get(`/api/bookings/${bookingId}`)).json();
  expect(paid.depositStatus).toBe('paid');
  expect(paid.payments.filter((p: { status: string }) => p.status === 'paid')).toHaveLength(1);
});
