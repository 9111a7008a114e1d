import { expect, test } from './csp';
import { signInHere } from './people';

test('the storefront and the backoffice load, name the shop and report the database up', async ({ page, request }) => {
  const health = await request.get('/api/health');
  expect(await health.json()).toEqual({ status: 'ok', db: 'up' });
  const shop = await (await request.get('/api/shop')).json();

  await page.goto('/');
  await expect(page.getByRole('link', { name: new RegExp(shop.name) })).toBeVisible();
  await expect(page.getByText('Booking system online')).toBeVisible();

  // The backoffice is staff-only: it asks for a sign-in first.
  await page.goto('/backoffice/');
  await expect(page.getByRole('heading', { name: 'Staff sign in' })).toBeVisible();
  await signInHere(page, 'owner@shop.example');
  await expect(page.getByRole('navigation', { name: 'Backoffice' })).toBeVisible();
  await expect(page.getByText('API and database up')).toBeVisible();

  // A client-side route of each app falls back to that app's own page.
  const deep = await request.get('/backoffice/bench');
  expect(deep.status()).toBe(200);
  expect(await deep.text()).toContain('/backoffice/');
});
