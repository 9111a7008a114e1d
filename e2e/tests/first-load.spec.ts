import { expect, test } from './csp';

/**
 * `/` and `/configure` arrive prerendered (storefront/scripts/prerender.mjs): their HTML holds the
 * page as the browser's first render draws it, and React takes that markup over with `hydrateRoot`
 * instead of drawing it again. React's documentation of `hydrateRoot` (react.dev/reference/react-dom/client/hydrateRoot)
 * says a mismatch between the two is reported as an error and the markup is redrawn on the client:
 * so here the console stays free of errors and the elements painted first are the ones still on
 * screen once the page is alive (the shop's name, which only the browser knows, is in the header).
 */

declare global {
  interface Window {
    firstPainted?: Element | null;
    firstHeader?: Element | null;
  }
}

test.describe('prerendered first pages', () => {
  test.beforeEach(async ({ page }) => {
    // Before any of the app's scripts has run: the elements the HTML itself drew.
    await page.addInitScript(() => {
      document.addEventListener('DOMContentLoaded', () => {
        window.firstPainted = document.querySelector('main h1') ?? document.querySelector('main [role="status"]');
        window.firstHeader = document.querySelector('header');
      });
    });
  });

  for (const [url, words] of [
    ['/', 'Start configuring your board'],
    ['/configure', 'Loading…'],
  ] as const) {
    test(`${url} is in its HTML and is taken over, not redrawn`, async ({ page, request }) => {
      const html = await (await request.get(url)).text();
      expect(html).toContain(`<div id="root" data-prerendered="${url}">`);
      expect(html).toContain(words);
      expect(html).toMatch(/<style data-emotion="css /);

      const problems: string[] = [];
      page.on('console', (message) => {
        if (message.type() === 'error' || message.type() === 'warning') problems.push(message.text());
      });
      page.on('pageerror', (error) => problems.push(error.message));

      const shop = await (await request.get('/api/shop')).json();
      await page.goto(url);
      await expect(page.getByRole('banner').getByText(shop.name)).toBeAttached();
      expect(await page.evaluate(() => window.firstHeader === document.querySelector('header'))).toBe(true);
      if (url === '/') {
        expect(await page.evaluate(() => window.firstPainted === document.querySelector('main h1'))).toBe(true);
        // Alive: the link is React Router's, so the configurator opens without a new page load.
        await page.evaluate(() => ((window as Window & { sameDocument?: boolean }).sameDocument = true));
        await page.getByRole('link', { name: 'Start configuring your board' }).click();
        await expect(page.getByRole('heading', { name: 'Configure your board' })).toBeVisible();
        expect(await page.evaluate(() => (window as Window & { sameDocument?: boolean }).sameDocument)).toBe(true);
      } else {
        await expect(page.getByRole('heading', { name: 'Configure your board' })).toBeVisible();
      }
      expect(problems).toEqual([]);
    });
  }

  test('any other page gets the layout at once and is drawn by the browser', async ({ page, request }) => {
    const html = await (await request.get('/sign-in')).text();
    expect(html).toContain('<div id="root"><');
    expect(html).not.toContain('data-prerendered');
    await page.goto('/sign-in');
    await expect(page.getByRole('button', { name: 'Sign in' })).toBeVisible();
  });
});
