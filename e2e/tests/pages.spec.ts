import type { APIRequestContext, Page } from '@playwright/test';
import { expect, test } from './csp';
import { countedBoard, shoot, signInHere } from './people';

/**
 * Pages as a player and the shop meet them: every browser tab names its page and the shop (the
 * shop's name from its own settings, GET /api/shop), and My builds on a phone 390 px wide shows
 * each build as a card with nothing past the edge. 390 CSS px is the viewport width of a common
 * current phone (common practice, no published source).
 */

const PHONE = { width: 390, height: 844 };

async function shopName(request: APIRequestContext): Promise<string> {
  const shop = await (await request.get('/api/shop')).json();
  expect(shop.name).toBeTruthy();
  return shop.name as string;
}

async function playerSignIn(page: Page, next: string) {
  await page.goto(`/sign-in?next=${encodeURIComponent(next)}`);
  await signInHere(page, 'player@mail.example');
  await expect(page).toHaveURL(new RegExp(`${next.replace(/\//g, '\\/')}$`), { timeout: 30_000 });
}

/** A request of the player's own, made through the API as the Request page makes it, so My builds has a row. */
async function requestABuild(page: Page) {
  const configuration = countedBoard(7);
  const res = await page.request.post('/api/bookings', { data: { configuration, notes: 'Phone check' } });
  expect(res.status()).toBe(201);
}

const overflow = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);

test('every page names itself and the shop in the browser tab', async ({ page, request }) => {
  test.setTimeout(120_000);
  const shop = await shopName(request);
  const storefront: Array<[string, string]> = [
    ['/', `Pedalboards wired by hand · ${shop}`],
    ['/configure', `Configure your board · ${shop}`],
    ['/sign-in', `Sign in · ${shop}`],
    ['/sign-up', `Create your account · ${shop}`],
    ['/no-such-page', `Page not found · ${shop}`],
  ];
  for (const [url, title] of storefront) {
    await page.goto(url);
    await expect(page, url).toHaveTitle(title);
  }
  await playerSignIn(page, '/builds');
  await expect(page).toHaveTitle(`My builds · ${shop}`);
  await requestABuild(page);
  await page.reload();
  await page.getByRole('link', { name: /^LW-/ }).first().click();
  await expect(page.getByRole('heading', { level: 1, name: /^Build LW-/ })).toBeVisible();
  await expect(page).toHaveTitle(`Your build · ${shop}`);

  // The shop's side, signed in as the owner instead of the player.
  await page.context().clearCookies();
  await page.goto('/backoffice/sign-in');
  await expect(page).toHaveTitle(`Staff sign in · ${shop} · Backoffice`);
  await signInHere(page, 'owner@shop.example');
  await expect(page.getByRole('navigation', { name: 'Backoffice' })).toBeVisible({ timeout: 30_000 });
  for (const [url, title] of [
    ['/backoffice/requests', 'Requests'],
    ['/backoffice/bench', 'Bench'],
    ['/backoffice/builds', 'Builds'],
    ['/backoffice/settings', 'Settings'],
  ] as const) {
    await page.goto(url);
    await expect(page, url).toHaveTitle(`${title} · ${shop} · Backoffice`);
  }
});

test('My builds at 390 px: a card per build, every fact labelled, nothing past the edge', async ({ page }, testInfo) => {
  test.setTimeout(120_000);
  await page.setViewportSize(PHONE);
  await playerSignIn(page, '/builds');
  await requestABuild(page);
  await page.reload();
  const list = page.getByRole('list', { name: 'My builds' });
  await expect(list).toBeVisible();
  await expect(page.getByRole('table')).toHaveCount(0);
  const cards = list.getByRole('listitem');
  expect(await cards.count()).toBeGreaterThan(0);
  for (const card of await cards.all()) {
    await expect(card.getByRole('link', { name: /^LW-/ })).toBeVisible();
    for (const label of ['Deposit', 'Bench date', 'Total']) await expect(card.getByText(label, { exact: true })).toBeVisible();
    const box = await card.boundingBox();
    expect(box!.x + box!.width, 'the card ends inside the screen').toBeLessThanOrEqual(PHONE.width);
  }
  expect(await overflow(page), 'My builds scrolls only up and down').toBeLessThanOrEqual(0);
  await shoot(page, testInfo, 'storefront-my-builds-phone');

  // The build's own page fits the same phone.
  await cards.first().getByRole('link', { name: /^LW-/ }).click();
  await expect(page.getByRole('heading', { level: 1, name: /^Build LW-/ })).toBeVisible();
  expect(await overflow(page), 'the build page scrolls only up and down').toBeLessThanOrEqual(0);

  // From 600 px up, the same builds are a table with its column headers.
  await page.setViewportSize({ width: 1024, height: 800 });
  await page.goto('/builds');
  await expect(page.getByRole('table', { name: 'My builds' }).getByRole('columnheader')).toHaveText([
    'Build',
    'Board',
    'Status',
    'Deposit',
    'Bench date',
    'Total',
  ]);
});

test('every backoffice page at 390 px scrolls only up and down; wide tables scroll inside their card', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize(PHONE);
  await page.goto('/backoffice/sign-in');
  await signInHere(page, 'owner@shop.example');
  await expect(page.getByRole('navigation', { name: 'Backoffice' })).toBeVisible({ timeout: 30_000 });
  for (const [url, heading] of [
    ['/backoffice/today', 'Today'],
    ['/backoffice/requests', 'Requests'],
    ['/backoffice/bench', 'Bench'],
    ['/backoffice/builds', 'Builds'],
    ['/backoffice/customers', 'Customers'],
    ['/backoffice/reports', 'Reports'],
    ['/backoffice/price-book', 'Price book'],
    ['/backoffice/team', 'Team'],
    ['/backoffice/settings', 'Settings'],
    ['/backoffice/mail', 'Mail log'],
    ['/backoffice/calendars', 'Calendar links'],
  ] as const) {
    await page.goto(url);
    await expect(page.getByRole('heading', { level: 1, name: heading }), url).toBeVisible();
    await page.waitForLoadState('networkidle');
    expect(await overflow(page), `${url} scrolls only up and down`).toBeLessThanOrEqual(0);
  }
  // The price book's lists stay whole: the table is wider than the phone and scrolls sideways in its card.
  await page.goto('/backoffice/price-book');
  const functions = page.getByRole('table', { name: 'Price book: functions' });
  await expect(functions).toBeVisible();
  const box = await functions.boundingBox();
  expect(box!.width, 'the functions table keeps its columns').toBeGreaterThan(PHONE.width);
});
