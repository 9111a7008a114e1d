import path from 'node:path';
import { expect, test } from '@playwright/test';
import pg from 'pg';
import { apiAs, requestBuild, signInOnPage } from './people';

/**
 * A builder's today and the calendar links, walked in the browser. The build is put on today's
 * bench straight in the database (the bench's own earliest date is never today), as the player's
 * own request, so the page has something of today's to show.
 */
const docsDir = path.resolve(__dirname, '../../docs/screenshots');
const databaseUrl = `postgres://postgres@127.0.0.1:${process.env.TEST_PG_PORT ?? 54339}/loomwright_e2e`;

test('a builder lands on their today, sees what a build waits for and opens it; the owner copies and replaces a calendar link', async ({
  browser,
  baseURL,
}) => {
  test.setTimeout(180_000);
  const player = await apiAs(baseURL!, 'player@mail.example');
  const booking = await requestBuild(player, { pedalCount: 4, level: 'journeyman' });
  await player.dispose();

  const db = new pg.Client({ connectionString: databaseUrl });
  await db.connect();
  const { rows } = await db.query(
    `select b.id, (select timezone from shop_settings where id = 1) as tz from builders b join users u on u.id = b.user_id where u.email = 'builder@shop.example'`,
  );
  const today = new Intl.DateTimeFormat('en-CA', { timeZone: rows[0].tz }).format(new Date());
  await db.query(`update bookings set state = 'scheduled', builder_id = $1, bench_date = $2 where id = $3`, [
    rows[0].id,
    today,
    booking.id,
  ]);
  await db.query(
    `insert into bench_allocations (booking_id, builder_id, day, hours, day_capacity)
     select $1, $2, $3::date, numrange(coalesce(max(upper(a.hours)), 0), coalesce(max(upper(a.hours)), 0) + 2), 24
     from bench_allocations a where a.builder_id = $2 and a.day = $3::date`,
    [booking.id, rows[0].id, today],
  );
  await db.end();

  // Signed in with no page asked for, a builder lands on Today.
  const page = await browser.newPage({ viewport: { width: 1280, height: 900 } });
  await signInOnPage(page, 'backoffice', 'builder@shop.example');
  await page.waitForURL('**/backoffice/today');
  const card = page.getByRole('article', { name: new RegExp(booking.reference) });
  await expect(card).toBeVisible();
  await expect(card.getByText('The player has not given the parcel’s tracking number yet')).toBeVisible();
  await expect(card.getByText('Ask the player for the parcel’s tracking number')).toBeVisible();
  await expect(page.getByText(/mains wiring/i)).toBeVisible();
  await page.screenshot({ path: path.join(docsDir, 'backoffice-today.png'), fullPage: true });
  await card.getByRole('link', { name: `Open ${booking.reference}` }).click();
  await page.waitForURL(`**/backoffice/builds/${booking.id}`);

  // The builder's own calendar link, no way to replace it.
  await page.goto('/backoffice/calendars');
  await expect(page.getByRole('textbox', { name: /Calendar link for Teodor Lind/ })).toHaveValue(/\/api\/calendar-feeds\/.+\/bench\.ics$/);
  await expect(page.getByRole('button', { name: /Make a new link/ })).toHaveCount(0);

  // The owner: every link, copy, and a new link only after a confirm that says the old one stops.
  const owner = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  await owner.grantPermissions(['clipboard-read', 'clipboard-write'], { origin: baseURL });
  const office = await owner.newPage();
  await signInOnPage(office, 'backoffice', 'owner@shop.example', undefined, '/calendars');
  await office.waitForURL('**/backoffice/calendars');
  const shopFeed = office.getByRole('region', { name: 'The whole shop’s bench' });
  const oldLink = await shopFeed.getByRole('textbox').inputValue();
  await shopFeed.getByRole('button', { name: 'Copy link' }).click();
  await expect(shopFeed.getByText(/Link copied|Selected/)).toBeVisible();
  await office.screenshot({ path: path.join(docsDir, 'backoffice-calendar-links.png'), fullPage: true });
  await shopFeed.getByRole('button', { name: 'Make a new link…' }).click();
  const confirm = office.getByRole('alertdialog');
  await expect(confirm.getByText(/The old link stops working at once/)).toBeVisible();
  await confirm.getByRole('button', { name: 'Make a new link' }).click();
  await expect(office.getByText(/the old link no longer works/)).toBeVisible();
  await expect(shopFeed.getByRole('textbox')).not.toHaveValue(oldLink);
  expect((await office.request.get(oldLink)).status()).toBe(404);

  // The owner's today lists every builder's builds; the switch narrows it to their own bench.
  await office.goto('/backoffice/today');
  await expect(office.getByRole('article', { name: new RegExp(booking.reference) })).toContainText('Teodor Lind', { timeout: 30_000 });
  await office.getByText('Only my own bench').click();
  await expect(office).toHaveURL(/mine=1/);
  await expect(office.getByRole('article', { name: new RegExp(booking.reference) })).toHaveCount(0);
  await owner.close();
});
