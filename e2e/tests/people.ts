import { expect, request as playwrightRequest, type APIRequestContext, type Page } from '@playwright/test';

/** The demo shop's sign-ins (ARCHITECTURE.md) and small steps several journeys share. */
export const demoPassword = 'demo-pass-2026';

/** An API context signed in as `email`; dispose it when done. */
export async function apiAs(baseURL: string, email: string, password = demoPassword): Promise<APIRequestContext> {
  const context = await playwrightRequest.newContext({ baseURL });
  const signedIn = await context.post('/api/auth/sign-in', { data: { email, password } });
  expect(signedIn.ok(), await signedIn.text()).toBeTruthy();
  return context;
}

/** Signs in on the storefront's or the backoffice's own sign-in page and waits to leave it. */
export async function signInOnPage(page: Page, app: 'storefront' | 'backoffice', email: string, password = demoPassword, next?: string) {
  const base = app === 'backoffice' ? '/backoffice/sign-in' : '/sign-in';
  await page.goto(next ? `${base}?next=${encodeURIComponent(next)}` : base);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.endsWith('/sign-in'));
}

/** Pays on the payment fake's hosted page with its test card and waits to be sent back to the shop. */
export async function payOnHostedPage(page: Page, url: string, baseURL: string) {
  await page.goto(url);
  await page.getByLabel('Card number').fill('4242 4242 4242 4242');
  await page.getByLabel('Expiry (MM/YY)').fill('12/34');
  await page.getByLabel('Security code').fill('123');
  await page.getByRole('button', { name: /^Pay / }).click();
  await page.waitForURL((target) => target.origin === new URL(baseURL).origin);
}
