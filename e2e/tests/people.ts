import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { expect, request as playwrightRequest, type APIRequestContext, type Locator, type Page, type TestInfo } from '@playwright/test';

/** A board priced by its pedal count: the same fixture the API and engine tests use. */
export { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';

/** The demo shop's sign-ins (ARCHITECTURE.md) and small steps several journeys share. */
export const demoPassword = 'demo-pass-2026';

/** An API context signed in as `email`; dispose it when done. */
export async function apiAs(baseURL: string, email: string, password = demoPassword): Promise<APIRequestContext> {
  const context = await playwrightRequest.newContext({ baseURL });
  const signedIn = await context.post('/api/auth/sign-in', { data: { email, password } });
  expect(signedIn.ok(), await signedIn.text()).toBeTruthy();
  return context;
}

/** Fills and sends the sign-in form the page shows now (either app's; a redirect may have led here). */
export async function signInHere(page: Page, email: string, password = demoPassword) {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

/** Signs in on the storefront's or the backoffice's own sign-in page and waits to leave it. */
export async function signInOnPage(page: Page, app: 'storefront' | 'backoffice', email: string, password = demoPassword, next?: string) {
  const base = app === 'backoffice' ? '/backoffice/sign-in' : '/sign-in';
  await page.goto(next ? `${base}?next=${encodeURIComponent(next)}` : base);
  await signInHere(page, email, password);
  await page.waitForURL((url) => !url.pathname.endsWith('/sign-in'));
}

/** Creates a player account on the storefront's sign-up page (the page shows now). */
export async function signUpHere(page: Page, name: string, email: string, password: string) {
  await page.getByLabel('Your name').fill(name);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Create account' }).click();
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

/** A pedal of a request's configuration, as POST /api/bookings takes it. */
export interface RequestPedal {
  name: string;
  kind: string;
  powered: boolean;
  inLoop: boolean;
  currentMa: number;
  voltage: number;
}

/** Two pedals for a small master-level board (a tuner first, then a reverb). */
export const tunerAndReverb: RequestPedal[] = [
  { name: 'Tuner', kind: 'tuner', powered: true, inLoop: false, currentMa: 80, voltage: 9 },
  { name: 'Plate reverb', kind: 'compact', powered: true, inLoop: false, currentMa: 100, voltage: 9 },
];

/**
 * The signed-in player asks for a plain serial build on the catalog's first surface and its first
 * case (or the first recommended one), with these pedals (or a pedal count), and gets the booking back.
 */
export async function requestBuild(
  player: APIRequestContext,
  options: { pedals?: RequestPedal[]; pedalCount?: number; level: string; recommendedCase?: boolean; notes?: string },
) {
  const catalog = await (await player.get('/api/catalog')).json();
  const cases: { id: string; notRecommended: boolean }[] = catalog.cases;
  const chosenCase = options.recommendedCase ? cases.find((c) => !c.notRecommended)! : cases[0]!;
  const created = await player.post('/api/bookings', {
    data: {
      configuration: {
        surfaceId: catalog.surfaces[0].id,
        caseId: chosenCase.id,
        routing: { mode: 'serial' },
        ...(options.pedals ? { pedals: options.pedals } : { pedalCount: options.pedalCount }),
        functions: [],
        level: options.level,
      },
      ...(options.notes ? { notes: options.notes } : {}),
    },
  });
  expect(created.status(), await created.text()).toBe(201);
  return (await created.json()) as { id: string; reference: string };
}

/** Pays a booking's deposit on the hosted page (in `page`) and waits until the webhook has marked it paid. */
export async function payDeposit(page: Page, player: APIRequestContext, bookingId: string, baseURL: string) {
  const checkout = await player.post(`/api/bookings/${bookingId}/checkout`, { data: {} });
  expect(checkout.ok(), await checkout.text()).toBeTruthy();
  await payOnHostedPage(page, (await checkout.json()).url, baseURL);
  // The deposit counts as paid once the provider's signed webhook reaches the API.
  await expect
    .poll(async () => (await (await player.get(`/api/bookings/${bookingId}`)).json()).depositStatus, { timeout: 20_000 })
    .toBe('paid');
}

/** A signed-in builder accepts a paid request at their own earliest bench date; returns that suggestion. */
export async function acceptAtEarliest(builder: APIRequestContext, bookingId: string) {
  const suggest = await (await builder.get('/api/bench/suggest', { params: { bookingId } })).json();
  const mine: { builder: { id: string; isMe: boolean }; benchDate: string } = suggest.suggestions.find(
    (s: { builder: { isMe: boolean } }) => s.builder.isMe,
  );
  const accepted = await builder.post(`/api/bookings/${bookingId}/accept`, {
    data: { builderId: mine.builder.id, benchDate: mine.benchDate },
  });
  expect(accepted.ok(), await accepted.text()).toBeTruthy();
  return mine;
}

const docsDir = path.resolve(__dirname, '../../docs/screenshots');

/** Saves the whole page as a test artifact; with UPDATE_DOCS_SCREENSHOTS=1 also for the README (docs/screenshots). */
export async function shoot(page: Page, testInfo: TestInfo, name: string) {
  await page.waitForTimeout(200);
  await page.screenshot({ path: testInfo.outputPath(`${name}.png`), fullPage: true });
  if (process.env.UPDATE_DOCS_SCREENSHOTS === '1') {
    mkdirSync(docsDir, { recursive: true });
    await page.screenshot({ path: path.join(docsDir, `${name}.png`) });
  }
}

/** The signed-in builder's row of the bench table ("… (you)") and, on it, the link to one booking by its reference. */
export function ownBenchBooking(page: Page, builderName: string, reference: string): Locator {
  return page
    .getByRole('table', { name: 'Bench time per builder and day' })
    .getByRole('row')
    .filter({ hasText: `${builderName} (you)` })
    .getByRole('link', { name: new RegExp(reference) })
    .first();
}
