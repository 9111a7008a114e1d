import { test as base, expect, type Page } from '@playwright/test';

/**
 * The journeys' `test`, failing any test whose pages report a Content-Security-Policy violation
 * in the browser console (Chromium writes "Refused to … because it violates the following Content
 * Security Policy directive"). The apps must run entirely under the API's CSP: a blocked script or
 * style would otherwise pass unnoticed until something on screen went missing.
 * Pages of contexts a test opens itself with `browser.newContext()` are not watched.
 */
export const test = base.extend<{ cspViolations: string[] }>({
  cspViolations: [
    async ({ context }, use) => {
      const violations: string[] = [];
      const watch = (page: Page) =>
        page.on('console', (message) => {
          if (/Content.Security.Policy/i.test(message.text())) violations.push(`${page.url()}: ${message.text()}`);
        });
      context.pages().forEach(watch);
      context.on('page', watch);
      await use(violations);
      expect(violations, 'the browser reported Content-Security-Policy violations').toEqual([]);
    },
    { auto: true },
  ],
});

export { expect };
