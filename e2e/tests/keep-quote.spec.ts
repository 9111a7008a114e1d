import { readFile } from 'node:fs/promises';
import type { APIRequestContext, Page, TestInfo } from '@playwright/test';
// pdf-parse 1.x: a general-purpose PDF text extractor (over Mozilla's pdf.js), the one the API
// tests use; the inner module is imported because the package's index runs a self-test.
import pdfParse from 'pdf-parse/lib/pdf-parse.js';
import { expect, test } from './csp';
import { signUpHere } from './people';

// A player keeps a quote: pins a pedal to a supply output, reads the numbered cable list, saves
// the configuration under a name, reopens it from their saved boards, downloads the quote PDF and
// checks its totals against the API, shares a short link and has the quote e-mailed.

const mailUrl = process.env.E2E_MAIL_URL ?? 'http://127.0.0.1:8125';
/** base64url(JSON), the codec of the storefront's ?c= links (RFC 4648 §5). */
const decode = (c: string) => JSON.parse(Buffer.from(c, 'base64url').toString('utf8'));
const encode = (config: unknown) => Buffer.from(JSON.stringify(config), 'utf8').toString('base64url');
// Dollars as any en-US reader writes them (ECMA-402 Intl.NumberFormat, ISO 4217 minor unit): the PDF's format.
const usd = (amount: string) => new Intl.NumberFormat('en-US', { style: 'currency', currency: 'USD' }).format(Number(amount));

async function configurationInUrl(page: Page) {
  const c = new URL(page.url()).searchParams.get('c');
  expect(c, 'the configuration is in the URL').toBeTruthy();
  return decode(c!);
}

async function shoot(page: Page, testInfo: TestInfo, name: string) {
  await page.waitForTimeout(150);
  await page.screenshot({ path: testInfo.outputPath(`${name}.png`), fullPage: true });
}

async function startingRig(request: APIRequestContext) {
  const catalog = await (await request.get('/api/catalog')).json();
  const surfaces = [...catalog.surfaces].sort((a, b) => b.widthMm * b.depthMm - a.widthMm * a.depthMm);
  const surface = surfaces.find((s) => !s.custom) ?? surfaces[0];
  const kase = catalog.cases.find(
    (c: { notRecommended?: boolean; fitsSurfaceIds: string[] }) =>
      !c.notRecommended && (c.fitsSurfaceIds.length === 0 || c.fitsSurfaceIds.includes(surface.id)),
  );
  return {
    surfaceId: surface.id,
    caseId: kase.id,
    routing: { mode: 'serial' },
    pedals: [
      { name: 'Tuner', kind: 'compact', powered: true, inLoop: false, currentMa: 80 },
      { name: 'Fuzz', kind: 'compact', powered: true, inLoop: false, currentMa: 10 },
      { name: 'Overdrive', kind: 'compact', powered: true, inLoop: false, currentMa: 15 },
      { name: 'Digital delay', kind: 'large_digital', powered: true, inLoop: false, currentMa: 300 },
    ],
    functions: [],
    level: 'journeyman',
    powerSupply: {
      outputs: [
        { voltage: 9, currentMa: 250, isolated: true },
        { voltage: 9, currentMa: 500, isolated: true },
        { voltage: 9, currentMa: 250, isolated: true },
      ],
    },
  };
}

test('a player pins a pedal, reads the cable list, saves and reopens the board, and keeps the quote as a PDF, a short link and an e-mail', async ({
  page,
  request,
}, testInfo) => {
  test.setTimeout(240_000);
  await page.setViewportSize({ width: 1280, height: 1000 });
  const stamp = Date.now();
  const email = `ines.keep.${stamp}@mail.example`;

  // An account of their own (saving needs one).
  await page.goto('/sign-up');
  await signUpHere(page, `Ines Harrow ${stamp % 10000}`, email, 'a-long-player-password');
  await expect(page.getByRole('link', { name: 'Saved boards' })).toBeVisible();

  // 1. Pin the fuzz to the third output of the supply (only the row being edited shows its fields).
  await page.goto(`/configure?step=pedals&c=${encode(await startingRig(request))}`);
  await page.getByRole('button', { name: 'Edit Fuzz' }).click();
  await page.getByRole('combobox', { name: 'Supply output', exact: true }).click();
  await page.getByRole('option', { name: /^Output 3 · 9 V DC, 250 mA, isolated$/ }).click();
  await expect.poll(async () => (await configurationInUrl(page)).pedals[1].powerOutput).toBe(2);
  await page.getByRole('button', { name: 'Done editing Fuzz' }).click();

  // 2. Review: the power plan keeps the choice; the numbered cable list is the API's.
  await page
    .getByRole('navigation', { name: 'Configurator steps' })
    .getByRole('button', { name: /^Review/ })
    .click();
  const configuration = await configurationInUrl(page);
  const estimate = await (await request.post('/api/estimates', { data: configuration })).json();
  await expect(page.getByTestId('review-total')).toBeVisible();
  const third = estimate.checks.powerBudget.outputs[2];
  expect(third.devices).toContain('Fuzz');
  await expect(page.getByText(/^Fuzz 10 mA · your choice$/)).toBeVisible();
  const rows = page.getByTestId('cable-list').locator('tbody tr');
  await expect(rows).toHaveCount(estimate.checks.cableSchedule.patchCount);
  for (const [i, c] of (
    estimate.checks.cableSchedule.patches as Array<{
      number: number;
      from: string;
      fromDevice: number | null;
      to: string;
      toDevice: number | null;
      lengthFeet: string;
    }>
  ).entries()) {
    const end = (text: string, device: number | null) => (device === null ? text : `${device} ${text}`);
    await expect(rows.nth(i).locator('td')).toHaveText([
      String(c.number),
      end(c.from, c.fromDevice),
      end(c.to, c.toDevice),
      `${Number(c.lengthFeet)} ft`,
      /.+/,
    ]);
  }
  await shoot(page, testInfo, 'review-keep');

  // 3. Save under a name.
  await page.getByRole('button', { name: 'Save under a name…' }).click();
  await page.getByRole('dialog').getByLabel('Name').fill('Stage board');
  await page.getByRole('dialog').getByRole('button', { name: 'Save' }).click();
  await expect(page.getByTestId('saved-status')).toHaveText('Saved as “Stage board”.');
  await expect.poll(() => new URL(page.url()).searchParams.get('saved')).toMatch(/^[0-9a-f-]{36}$/);

  // 4. From the saved boards: duplicate, then reopen the original, with the pin intact.
  await page.getByRole('link', { name: 'Saved boards' }).first().click();
  await expect(page.getByRole('heading', { name: 'Saved boards', level: 1 })).toBeVisible();
  await page.getByRole('button', { name: 'Duplicate Stage board' }).click();
  await expect(page.getByRole('button', { name: 'Open Stage board (copy)' })).toBeVisible();
  await shoot(page, testInfo, 'saved-boards');
  await page.getByRole('button', { name: 'Open Stage board', exact: true }).click();
  await expect(page.getByTestId('saved-status')).toHaveText('Saved as “Stage board”.');
  expect(await configurationInUrl(page)).toEqual(configuration);
  await expect(page.getByText(/^Fuzz 10 mA · your choice$/)).toBeVisible();

  // 5. The quote PDF: its totals are the API's (text read by pdf-parse).
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.getByRole('button', { name: 'Download the quote (PDF)' }).click(),
  ]);
  const pdf = await readFile((await download.path())!);
  expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
  const text = (await pdfParse(pdf)).text.replace(/\s+/g, ' ');
  expect(text).toContain(`Estimated total: ${usd(estimate.totalLow)} – ${usd(estimate.totalHigh)}`);
  expect(text).toContain(`Deposit to book bench time: ${usd(estimate.deposit)}`);
  expect(text).toContain(`${estimate.checks.cableSchedule.patchCount} patch cables`);
  expect(text).toMatch(/Output 3 \(9 V DC, isolated\).*Fuzz/);

  // 6. A short link instead of the long address; it opens the same configuration.
  await page.getByRole('button', { name: 'Copy link' }).click();
  const shortLink = page.getByRole('textbox', { name: 'Short link to this configuration' });
  await expect(shortLink).toHaveValue(/\/c\/[A-Za-z0-9]{8}$/);
  const href = await shortLink.inputValue();
  expect(href.length).toBeLessThan(60);
  expect(page.url().length).toBeGreaterThan(href.length * 5);
  await page.goto(href);
  await expect(page.getByTestId('review-total')).toBeVisible();
  expect(await configurationInUrl(page)).toEqual(configuration);

  // 7. E-mailed to the player's own address, with the PDF attached.
  await page.getByRole('button', { name: 'E-mail it to me' }).click();
  await expect(page.getByRole('status').filter({ hasText: `Sent to ${email}` })).toBeVisible();
  await expect
    .poll(
      async () => {
        const res = await request.get(`${mailUrl}/api/messages`, { params: { to: email } });
        const messages = (await res.json()) as Array<{ subject: string; attachments: Array<{ contentType: string }> }>;
        return messages.find((m) => m.subject.includes('your quote from'))?.attachments.map((a) => a.contentType);
      },
      { timeout: 60_000 },
    )
    .toEqual(['application/pdf']);
});
