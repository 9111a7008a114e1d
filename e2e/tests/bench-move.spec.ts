import { expect, request as playwrightRequest, test, type APIRequestContext, type Page } from '@playwright/test';
import { acceptAtEarliest, apiAs, ownBenchBooking, payDeposit, requestBuild, signInOnPage, tunerAndReverb } from './people';

/**
 * When plans change: a builder moves a scheduled build to another day from the Bench, and the
 * player sees the new date on their build page and in their mailbox, with a calendar file that
 * updates the first one (same UID, higher SEQUENCE: RFC 5545 §3.8.7.4).
 */

const mailUrl = process.env.E2E_MAIL_URL ?? 'http://127.0.0.1:8125';

/** A day as both apps and the e-mail write it for the demo shop (en-US, CLDR yMMMEd "EEE, MMM d, y"): "Tue, Jan 12, 2027". */
function writtenDay(day: string): string {
  const [y, m, d] = day.split('-').map(Number);
  return new Intl.DateTimeFormat('en-US', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(Date.UTC(y!, m! - 1, d!, 12)),
  );
}

const addDays = (day: string, n: number) => new Date(Date.parse(`${day}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);

/** A player signs up, requests a plain serial board and pays the deposit on the fake's hosted page. */
async function paidRequest(baseURL: string, page: Page, email: string, password: string) {
  const player: APIRequestContext = await playwrightRequest.newContext({ baseURL });
  const signUp = await player.post('/api/auth/sign-up', { data: { email, password, name: `Ines Marrow ${Date.now() % 10000}` } });
  expect(signUp.status(), await signUp.text()).toBe(201);
  const booking = await requestBuild(player, { recommendedCase: true, level: 'master', pedals: tunerAndReverb });
  await payDeposit(page, player, booking.id, baseURL);
  await player.dispose();
  return booking;
}

test('a builder moves a scheduled build to another day from the Bench; the player’s page and mailbox show the new date', async ({
  browser,
  baseURL,
  request,
}) => {
  test.setTimeout(240_000);
  const stamp = Date.now();
  const email = `ines.${stamp}@mail.example`;
  const password = 'a-long-player-password';
  const shop = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
  const paid = await paidRequest(baseURL!, shop, email, password);

  // The builder accepts it at their earliest date (the accept dialog's own path is the main journey's).
  const builder = await apiAs(baseURL!, 'builder@shop.example');
  const mine = await acceptAtEarliest(builder, paid.id);
  const firstDate: string = mine.benchDate;
  // A week later, or the first day after that which holds it (the bench's own preview says which).
  const preview = await (
    await builder.get('/api/bench/preview', {
      params: { bookingId: paid.id, benchDate: addDays(firstDate, 7), builderId: mine.builder.id },
    })
  ).json();
  const newDate: string = preview.options[0].ok ? addDays(firstDate, 7) : preview.options[0].nextPossibleDate;
  expect(newDate > firstDate).toBe(true);
  await builder.dispose();

  // From the Bench: the build's Move button, a new day, a reason, and the preview before moving.
  await signInOnPage(shop, 'backoffice', 'builder@shop.example');
  await expect(shop.getByRole('navigation', { name: 'Backoffice' })).toBeVisible();
  await shop.goto(`/backoffice/bench?day=${firstDate}`);
  const bench = shop.getByRole('table', { name: 'Bench time per builder and day' });
  await bench
    .getByRole('button', { name: `Move ${paid.reference}` })
    .first()
    .click();
  const dialog = shop.getByRole('dialog', { name: `Move ${paid.reference}` });
  await expect(dialog.getByLabel('New bench date')).toHaveValue(firstDate);
  await dialog.getByLabel('New bench date').fill(newDate);
  await expect(dialog.getByText(/days later than now/)).toBeVisible();
  await expect(dialog.getByText(/can start then and finish/)).toBeVisible();
  await dialog.getByLabel(/Why it moves/).fill('The pedals are arriving a week late.');
  await dialog.getByRole('button', { name: 'Move the build' }).click();
  await expect(shop.getByText(new RegExp(`^${paid.reference} moved to .*later\\); the player has been e-mailed`))).toBeVisible();
  await shop.goto(`/backoffice/bench?day=${newDate}`);
  await expect(ownBenchBooking(shop, 'Teodor Lind', paid.reference)).toBeVisible();

  // The player's build page shows the new date …
  const player = await browser.newPage();
  await signInOnPage(player, 'storefront', email, password, `/builds/${paid.id}`);
  // Signed in, the sign-in page sends the player on to the build it was asked for.
  await player.waitForURL((url) => url.pathname === `/builds/${paid.id}`);
  await expect(player.getByText(/^Bench date:/)).toContainText(writtenDay(newDate));
  await expect(player.getByText(/pedals are arriving a week late/).first()).toBeVisible();

  // … and so does the mailbox, with a calendar file that updates the first one.
  let moved: { subject: string; text: string; attachments: Array<{ contentType: string; content: string }> } | undefined;
  await expect
    .poll(
      async () => {
        const res = await request.get(`${mailUrl}/api/messages`, { params: { to: email } });
        const list = (await res.json()) as Array<typeof moved & object>;
        moved = list.find((m) => m.subject.startsWith('Moved:'));
        return moved?.subject ?? '';
      },
      { timeout: 60_000 },
    )
    .toBe(`Moved: bench date ${writtenDay(newDate)} for ${paid.reference} (was ${writtenDay(firstDate)})`);
  const ics = Buffer.from(moved!.attachments.find((a) => a.contentType.startsWith('text/calendar'))!.content, 'base64').toString('utf8');
  expect(ics).toContain(`UID:handover-${paid.reference}@loomwright.app`);
  expect(ics).toMatch(/SEQUENCE:1\r\n/);
});
