import path from 'node:path';
import { request as playwrightRequest } from '@playwright/test';
import { expect, test } from './csp';
import { acceptAtEarliest, apiAs, payDeposit, requestBuild, signInOnPage } from './people';

/**
 * Messages on a build, walked in two browsers: the player writes with a photo on their build page,
 * the assigned builder sees it (and its thumbnail) on the backoffice build page and answers, the
 * player reads the answer. Unread badges appear in both lists and in the backoffice's navigation and
 * clear once the thread is opened. A builder who is not on the build reads a sentence, not a 404.
 */
const docsDir = path.resolve(__dirname, '../../docs/screenshots');
/** A 64 × 48 PNG of one colour, made once with sharp and kept here so the journey needs no image library. */
const photo = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAEAAAAAwCAIAAAAuKetIAAAACXBIWXMAAAPoAAAD6AG1e1JrAAAAf0lEQVRoge2SQQkAQRDDKieaKuL8P09GGLYQAUlp+Hqa6AYsoPqK7EK9S3QDFlB9RXah3iW6AQuoviK7UO8S3YAFVF+RXah3iW7AAqqvyC7Uu0Q3YAHVV2QX6l2iG7CA6iuyC/Uu0Q1YQPUV2YV6l+gGLKD6iuxCvUt0Ax4P+AG6CUCmmRIyDQAAAABJRU5ErkJggg==',
  'base64',
);

test('a player and their builder exchange messages with a photo; unread badges appear and clear', async ({ browser, baseURL, page }) => {
  test.setTimeout(180_000);
  const stamp = Date.now();
  const email = `ines.${stamp}@mail.example`;
  const password = 'a-long-player-password';

  // A fresh player (so My builds holds just this build) asks for a build and pays the deposit; the demo builder accepts it.
  const player = await playwrightRequest.newContext({ baseURL });
  expect((await player.post('/api/auth/sign-up', { data: { email, password, name: `Ines Marwood ${stamp % 10000}` } })).status()).toBe(201);
  const booking = await requestBuild(player, { pedalCount: 3, level: 'journeyman' });
  const payPage = await browser.newPage();
  await payDeposit(payPage, player, booking.id, baseURL!);
  await payPage.close();
  const builderApi = await apiAs(baseURL!, 'builder@shop.example');
  await acceptAtEarliest(builderApi, booking.id);
  const builderUnread = async () =>
    (
      (await (await builderApi.get('/api/messages/unread')).json()) as { total: number; bookings: { bookingId: string; unread: number }[] }
    ).bookings.find((b) => b.bookingId === booking.id)?.unread ?? 0;

  // The player writes with a photo on their build page.
  await page.setViewportSize({ width: 1280, height: 900 });
  await signInOnPage(page, 'storefront', email, password, `/builds/${booking.id}`);
  const playerPanel = page.getByRole('region', { name: 'Messages with the shop' });
  await expect(playerPanel.getByText('No messages yet.')).toBeVisible();
  await playerPanel.getByLabel('Your message').fill('Here is the tuner I mentioned; can it sit under the board?');
  await playerPanel.getByLabel('Attach photos').setInputFiles({ name: 'tuner.png', mimeType: 'image/png', buffer: photo });
  await expect(playerPanel.getByText(/1 photo/)).toBeVisible();
  await playerPanel.getByRole('button', { name: 'Send message' }).click();
  const playerThread = playerPanel.getByRole('list', { name: 'Messages' });
  await expect(playerThread.getByRole('listitem')).toHaveCount(1);
  await expect(playerThread.getByText('can it sit under the board?')).toBeVisible();
  await expect(playerThread.getByRole('img', { name: 'Photo 1 from you' })).toBeVisible();
  await expect.poll(builderUnread).toBe(1);
  // The player leaves the build page: an open thread refreshes itself and counts as read, which
  // would clear the answer's badge before My builds is looked at.
  await page.goto('/account');

  // The builder sees a badge in the navigation and on the build's row, opens the build, sees the
  // message and its thumbnail, and the badges clear.
  const shopContext = await browser.newContext({ viewport: { width: 1440, height: 1000 } });
  const shop = await shopContext.newPage();
  await signInOnPage(shop, 'backoffice', 'builder@shop.example', undefined, `/builds?state=scheduled&q=${booking.reference}`);
  const nav = shop.getByRole('navigation', { name: 'Backoffice' });
  await expect(nav.getByRole('link', { name: /^Builds \d+ unread messages?$/ })).toBeVisible();
  const row = shop.getByRole('row', { name: new RegExp(booking.reference) });
  await expect(row.getByText('1 unread message')).toBeAttached();
  await row.getByText(booking.reference).click();
  await shop.waitForURL(`**/backoffice/builds/${booking.id}`);
  const shopPanel = shop.locator('section').filter({ has: shop.getByRole('heading', { name: 'Messages with the player' }) });
  const shopThread = shopPanel.getByRole('list', { name: 'Messages' });
  await expect(shopThread.getByText('can it sit under the board?')).toBeVisible();
  // The conversation sits low on the long build page; arriving with an unread message brings it into view.
  await expect(shopThread).toBeInViewport();
  const thumbnail = shopThread.getByRole('img', { name: /^Photo 1 from / });
  await expect(thumbnail).toBeVisible();
  // The thumbnail really loaded (a broken image has no natural width).
  await expect.poll(() => thumbnail.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0)).toBe(true);
  await expect.poll(builderUnread).toBe(0);
  await shopPanel.getByLabel('Your message').fill('Yes: there is room under the top plate; I will mount it there.');
  await shopPanel.getByRole('button', { name: 'Send message' }).click();
  await expect(shopThread.getByRole('listitem')).toHaveCount(2);
  await shopPanel.scrollIntoViewIfNeeded();
  await shop.screenshot({ path: path.join(docsDir, 'backoffice-build-messages.png'), fullPage: true });
  await shop.goto(`/backoffice/builds?state=scheduled&q=${booking.reference}`);
  await expect(shop.getByRole('row', { name: new RegExp(booking.reference) })).toBeVisible();
  await expect(shop.getByRole('row', { name: new RegExp(booking.reference) }).getByText(/unread message/)).toHaveCount(0);

  // The player's My builds shows the answer waiting; opening the build shows it and clears the badge.
  await page.goto('/builds');
  const myRow = page.getByRole('row', { name: new RegExp(booking.reference) });
  await expect(myRow.getByText('1 unread message')).toBeAttached({ timeout: 20_000 });
  await myRow.getByRole('link', { name: new RegExp(booking.reference) }).click();
  await page.waitForURL(`**/builds/${booking.id}`);
  await expect(playerThread.getByText('there is room under the top plate')).toBeVisible();
  await expect(playerThread.getByRole('listitem')).toHaveCount(2);
  await playerPanel.scrollIntoViewIfNeeded();
  await page.screenshot({ path: path.join(docsDir, 'storefront-build-messages.png'), fullPage: true });
  await page.goto('/builds');
  await expect(page.getByRole('row', { name: new RegExp(booking.reference) })).toBeVisible();
  await expect(page.getByRole('row', { name: new RegExp(booking.reference) }).getByText(/unread message/)).toHaveCount(0);

  // Another builder may open the build but is not part of its conversation: a sentence, no error.
  const otherContext = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const other = await otherContext.newPage();
  await signInOnPage(other, 'backoffice', 'junior@shop.example', undefined, `/builds/${booking.id}`);
  await expect(other.getByText('Only the owner and the builder assigned to this build talk with the player here.')).toBeVisible();
  await expect(other.getByText(/whose messages you can read/)).toHaveCount(0);

  await otherContext.close();
  await shopContext.close();
  await builderApi.dispose();
  await player.dispose();
});
