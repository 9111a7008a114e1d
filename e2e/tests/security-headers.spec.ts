import { expect, test } from './csp';

/**
 * The pages the apps do not cover, under the same Content-Security-Policy, in a real browser:
 * the API's Swagger page. The journeys cover both apps (see csp.ts); the build sheet's own CSP is
 * checked in api/test/build-sheet.spec.ts (headless Chromium downloads a PDF instead of showing it).
 */
test('the Swagger page at /api/docs lists the API under the CSP', async ({ page }) => {
  await page.goto('/api/docs');
  await expect(page.getByRole('heading', { name: /Loomwright API/ })).toBeVisible();
  await expect(page.getByText('/api/payments/webhook').first()).toBeVisible();
});

// Proves the watch in csp.ts can fail: an inline script is refused, and the test is reported failed.
test('the CSP watch fails a page that runs an inline script', async ({ page }) => {
  test.fail();
  await page.goto('/');
  await page.evaluate(() => {
    const script = document.createElement('script');
    script.textContent = 'window.__inlineRan = true;';
    document.head.appendChild(script);
  });
  expect(await page.evaluate(() => (window as unknown as { __inlineRan?: boolean }).__inlineRan)).toBeUndefined();
});
