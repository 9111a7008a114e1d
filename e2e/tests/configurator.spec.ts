import AxeBuilder from '@axe-core/playwright';
import type { APIRequestContext, Locator, Page, TestInfo } from '@playwright/test';
import { expect, test } from './csp';

// The configurator, walked the way a player walks it. Figures on screen are compared with what
// POST /api/estimates answers for the configuration the page holds in its URL, so a panel that
// shows stale, rounded or invented numbers fails.

const steps = ['Surface', 'Case', 'Pedals', 'Routing', 'Extras', 'Builder', 'Review'] as const;

/** base64url(JSON), the codec the storefront and the request page share (RFC 4648 §5). */
const decode = (c: string) => JSON.parse(Buffer.from(c, 'base64url').toString('utf8'));
const encode = (config: unknown) => Buffer.from(JSON.stringify(config), 'utf8').toString('base64url');

/**
 * Money as the page prints it for the demo shop (en-US, USD), by ECMA-402 Intl.NumberFormat with
 * CLDR en data: "¤#,##0.00" always with the cents, a range as "{0} – {1}", hours in CLDR's short unit "hr".
 */
function money(amount: string, currency: string) {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(amount as unknown as number);
}
function range(low: string, high: string, currency: string) {
  const a = money(low, currency);
  const b = money(high, currency);
  return a === b ? a : `${a} – ${b}`;
}
const hours = (h: string) => `${Number(h)} hr`;

async function configurationInUrl(page: Page) {
  const c = new URL(page.url()).searchParams.get('c');
  expect(c, 'the configuration is in the URL').toBeTruthy();
  return decode(c!);
}

/** The panel shows exactly what the API answers for the configuration in the URL. */
async function expectPanelMatchesApi(page: Page, request: APIRequestContext) {
  const configuration = await configurationInUrl(page);
  const response = await request.post('/api/estimates', { data: configuration });
  expect(response.status()).toBe(200);
  const e = await response.json();
  const panel = page.getByRole('complementary', { name: 'Estimate' });
  await expect(panel.getByTestId('estimate-total')).toHaveText(range(e.totalLow, e.totalHigh, e.currency));
  await expect(panel.getByTestId('estimate-labor')).toHaveText(
    `${range(e.laborLow, e.laborHigh, e.currency)} labor (${hours(e.laborHours)})`,
    { useInnerText: false },
  );
  await expect(panel.getByTestId('estimate-materials')).toHaveText(money(e.materialsTotal, e.currency));
  await expect(panel.getByTestId('estimate-deposit')).toHaveText(money(e.deposit, e.currency));
  return { configuration, estimate: e };
}

/**
 * WCAG 2.2 A/AA rules of axe-core (Deque's rule set for WCAG 2.0, 2.1 and 2.2); the build fails on
 * any serious or critical violation, e.g. color-contrast (SC 1.4.3), label (SC 1.3.1 / 4.1.2),
 * button-name (SC 4.1.2), aria-allowed-attr, nested-interactive.
 */
async function expectNoSeriousAxeViolations(page: Page, where: string) {
  const results = await new AxeBuilder({ page: page as never })
    .withTags(['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'])
    .analyze();
  const serious = results.violations
    .filter((v) => v.impact === 'serious' || v.impact === 'critical')
    .map(
      (v) =>
        `${v.id} (${v.impact}): ${v.nodes
          .map((n) => n.target.join(' '))
          .slice(0, 3)
          .join(' | ')}`,
    );
  expect(serious, `axe-core on ${where}`).toEqual([]);
}

async function shoot(page: Page, testInfo: TestInfo, name: string) {
  await page.waitForTimeout(150);
  await page.screenshot({ path: testInfo.outputPath(`${name}.png`) });
  await page.screenshot({ path: testInfo.outputPath(`${name}-full.png`), fullPage: true });
}

async function expectStep(page: Page, title: string) {
  await expect(
    page.getByRole('navigation', { name: 'Configurator steps' }).getByText(new RegExp(`^Step \\d of 7: ${title}$`)),
  ).toBeVisible();
  await expect(page.getByRole('heading', { level: 2 }).first()).toBeVisible();
}

/** One click, and the choice holds: the configuration is React state, mirrored to the URL. */
async function choose(control: Locator) {
  await control.click();
  await expect(control).toBeChecked();
}

const next = (page: Page) => page.getByRole('navigation', { name: 'Step navigation' }).getByRole('button', { name: /^Next:/ });

test.describe('configurator', () => {
  test('a player walks every step, changes the pedal count and the routing, and the panel shows the API’s figures', async ({
    page,
    request,
  }, testInfo) => {
    test.setTimeout(240_000);
    await page.setViewportSize({ width: 1440, height: 1000 });
    await page.goto('/configure');
    await expectStep(page, 'Surface');
    // Nothing is chosen for the player and nothing is priced before their first choice.
    await expect(page.getByTestId('estimate-total')).toHaveText('Not priced yet');
    await expect(page.getByTestId('estimate-missing')).toContainText(
      'Still to choose: a board surface, a case and your pedals (a count is enough).',
    );
    await expect(page.getByRole('radio', { checked: true })).toHaveCount(0);
    await expect(page.getByText(/Pedal \d/)).toHaveCount(0);

    // Surface: pick the biggest prefab board.
    await choose(page.getByRole('radio', { name: /Ridge 100/ }));
    await expect(page.getByRole('radio', { name: /Ridge 100/ })).toBeChecked();
    await expect(page.getByTestId('estimate-missing')).toContainText('Still to choose: a case and your pedals');
    await expectNoSeriousAxeViolations(page, 'Surface (desktop)');
    await shoot(page, testInfo, 'desktop-1-surface');

    await next(page).click();
    await expectStep(page, 'Case');
    await choose(page.getByRole('radio', { name: /Padded gig bag/ }));
    await expect(page.getByText('The shop’s caution on a soft bag')).toBeVisible();
    await choose(page.getByRole('radio', { name: /Tour road case/ }));
    await expect(page.getByTestId('estimate-missing')).toContainText('Still to choose: your pedals');
    await expectNoSeriousAxeViolations(page, 'Case (desktop)');
    await shoot(page, testInfo, 'desktop-2-case');

    await next(page).click();
    await expectStep(page, 'Pedals');
    // The count starts blank: the player's own number is the first one priced.
    await expect(page.getByRole('spinbutton', { name: 'Number of pedals' })).toHaveValue('');
    await page.getByRole('spinbutton', { name: 'Number of pedals' }).fill('6');
    await expect.poll(async () => (await configurationInUrl(page)).pedalCount).toBe(6);
    const before = await expectPanelMatchesApi(page, request);
    expect(before.configuration.pedalCount).toBe(6);
    await page.getByRole('button', { name: 'One pedal more' }).click();
    await page.getByRole('button', { name: 'One pedal more' }).click();
    await expect.poll(async () => (await configurationInUrl(page)).pedalCount).toBe(8);
    const after = await expectPanelMatchesApi(page, request);
    // Two more plain serial pedals: two more bench hours (1 h per device, common practice, no published source).
    expect(Number(after.estimate.laborHours) - Number(before.estimate.laborHours)).toBe(2);
    await expect(page.getByRole('heading', { name: 'Power plan' })).toBeVisible();
    await expect(page.getByRole('note', { name: 'Power safety' })).toContainText('local electrical codes');
    await expect(page.getByRole('img', { name: /Top view of the/ })).toBeVisible();
    await expectNoSeriousAxeViolations(page, 'Pedals (desktop)');
    await shoot(page, testInfo, 'desktop-3-pedals');

    await next(page).click();
    await expectStep(page, 'Routing');
    await choose(page.getByRole('radio', { name: /Loop switcher/ }));
    await expect.poll(async () => (await configurationInUrl(page)).routing.mode).toBe('switcher');
    await choose(page.getByRole('checkbox', { name: '3. Pedal 3' }));
    await choose(page.getByRole('checkbox', { name: '4. Pedal 4' }));
    await expect.poll(async () => (await configurationInUrl(page)).pedals.filter((p: { inLoop: boolean }) => p.inLoop).length).toBe(2);
    const switched = await expectPanelMatchesApi(page, request);
    expect(switched.configuration.pedals).toHaveLength(8);
    expect(Number(switched.estimate.laborHours)).toBeGreaterThan(Number(after.estimate.laborHours));
    await expectNoSeriousAxeViolations(page, 'Routing (desktop)');
    await shoot(page, testInfo, 'desktop-4-routing');

    await next(page).click();
    await expectStep(page, 'Extras');
    await choose(page.getByRole('checkbox', { name: 'Stereo output' }));
    await expect.poll(async () => (await configurationInUrl(page)).functions).toEqual(['stereo_output']);
    await expectPanelMatchesApi(page, request);
    await expectNoSeriousAxeViolations(page, 'Extras (desktop)');
    await shoot(page, testInfo, 'desktop-5-extras');

    await next(page).click();
    await expectStep(page, 'Builder');
    const { estimate } = await expectPanelMatchesApi(page, request);
    expect(estimate.minimumLevel).not.toBe('apprentice');
    await expect(page.getByText(/This rig needs at least a/)).toBeVisible();
    await expect(page.getByRole('radio', { name: /Apprentice/ })).toBeDisabled();
    await choose(page.getByRole('radio', { name: /Master/ }));
    await expect.poll(async () => (await configurationInUrl(page)).level).toBe('master');
    await expectPanelMatchesApi(page, request);
    await expectNoSeriousAxeViolations(page, 'Builder (desktop)');
    await shoot(page, testInfo, 'desktop-6-builder');

    await next(page).click();
    await expectStep(page, 'Review');
    const review = await expectPanelMatchesApi(page, request);
    await expect(page.getByTestId('review-total')).toHaveText(
      range(review.estimate.totalLow, review.estimate.totalHigh, review.estimate.currency),
    );
    await expect(page.getByTestId('review-hours')).toHaveText(hours(review.estimate.laborHours));
    await expect(page.getByTestId('review-deposit')).toHaveText(money(review.estimate.deposit, review.estimate.currency));
    for (const line of review.estimate.lines.filter((l: { kind: string }) => l.kind === 'materials')) {
      await expect(
        page.getByRole('row', { name: new RegExp(`^${line.label.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}`) }).first(),
      ).toContainText(money(line.amount, review.estimate.currency));
    }
    await expect(page.getByText('Your loop switcher, with its own power lead.')).toBeVisible();
    await expect(page.getByText(/25% of the high end of the estimate/)).toBeVisible();
    await expectNoSeriousAxeViolations(page, 'Review (desktop)');
    await shoot(page, testInfo, 'desktop-7-review');

    // Every step stays reachable, and going back loses nothing.
    await page
      .getByRole('navigation', { name: 'Configurator steps' })
      .getByRole('button', { name: /^Pedals/ })
      .click();
    await expectStep(page, 'Pedals');
    await expect(page.getByRole('heading', { name: 'Pedal 3', level: 3 })).toBeVisible();
    expect((await configurationInUrl(page)).pedals.filter((p: { inLoop: boolean }) => p.inLoop)).toHaveLength(2);

    await page
      .getByRole('navigation', { name: 'Configurator steps' })
      .getByRole('button', { name: /^Review/ })
      .click();
    await page.getByRole('button', { name: 'Request this build' }).click();
    // The request page sends a visitor who is not signed in on to sign in, carrying the same link.
    await expect(page).toHaveURL(/\/request\?c=|\/sign-in\?next=%2Frequest%3Fc%3D/);
    const landed = new URL(page.url());
    const requestUrl = landed.pathname === '/sign-in' ? new URL(landed.searchParams.get('next')!, landed.origin) : landed;
    expect(requestUrl.pathname).toBe('/request');
    expect(decode(requestUrl.searchParams.get('c')!)).toEqual(review.configuration);
  });

  test('the itemized pedal list: add, edit, reorder with buttons and remove', async ({ page, request }) => {
    await page.goto(
      `/configure?step=pedals&c=${encode({ surfaceId: 'slate-61', caseId: 'shell-hard', routing: { mode: 'serial' }, pedalCount: 6, functions: [], level: 'apprentice' })}`,
    );
    await choose(page.getByRole('radio', { name: 'List each pedal' }));
    await expect(page.getByRole('heading', { name: 'Pedal 6', level: 3 })).toBeVisible();
    await page.getByRole('button', { name: 'Add a pedal' }).click();
    await expect(page.getByLabel('Name or type').last()).toBeFocused();
    await page.keyboard.type('Analog delay');
    await page.getByRole('spinbutton', { name: 'Current draw (mA)' }).fill('120');
    await expect.poll(async () => (await configurationInUrl(page)).pedals.at(-1)).toMatchObject({ name: 'Analog delay', currentMa: 120 });
    await expectNoSeriousAxeViolations(page, 'Pedals with an open pedal row');
    await page.getByRole('button', { name: 'Move Analog delay up' }).click();
    await expect
      .poll(async () => (await configurationInUrl(page)).pedals.map((p: { name: string }) => p.name).slice(-2))
      .toEqual(['Analog delay', 'Pedal 6']);
    await page.getByRole('button', { name: 'Remove Pedal 1' }).click();
    await expect.poll(async () => (await configurationInUrl(page)).pedals).toHaveLength(6);
    // A bad figure is refused in the API's own words, and never reaches the configuration.
    await page.getByRole('spinbutton', { name: 'Current draw (mA)' }).fill('-5');
    await expect(page.getByText('Current draw must be a number from 0 to 5000 mA')).toBeVisible();
    await next(page).click();
    await expectStep(page, 'Pedals');
    await page.getByRole('spinbutton', { name: 'Current draw (mA)' }).fill('15');
    await expectPanelMatchesApi(page, request);
  });

  test('keyboard alone walks the stepper and changes a choice', async ({ page }) => {
    await page.setViewportSize({ width: 1440, height: 1000 });
    await page.goto(
      `/configure?c=${encode({ surfaceId: 'slate-61', caseId: 'shell-hard', routing: { mode: 'serial' }, pedalCount: 6, functions: [], level: 'apprentice' })}`,
    );
    await expect(page.getByTestId('estimate-total')).toHaveText(/^\$/);
    const tabTo = async (matches: (el: { text: string; role: string | null; checked: boolean }) => boolean, limit = 80) => {
      for (let i = 0; i < limit; i++) {
        await page.keyboard.press('Tab');
        const el = await page.evaluate(() => {
          const a = document.activeElement as HTMLInputElement | null;
          return {
            text: (a?.getAttribute('aria-label') ?? a?.textContent ?? '').trim(),
            role: a?.getAttribute('type') ?? a?.tagName ?? null,
            checked: !!a?.checked,
          };
        });
        if (matches(el)) return;
      }
      throw new Error('focus never reached the control');
    };
    // Into the surface cards (a radio group), then arrow to another surface.
    await tabTo((el) => el.role === 'radio' && el.checked);
    const before = new URL(page.url()).searchParams.get('c');
    await page.keyboard.press('ArrowRight');
    await expect.poll(() => new URL(page.url()).searchParams.get('c')).not.toBe(before);
    for (const title of steps.slice(1)) {
      await tabTo((el) => el.text.startsWith('Next:'));
      await page.keyboard.press('Enter');
      await expectStep(page, title);
    }
  });

  test('a shared link restores the configuration, in a browser that has never seen it', async ({ browser, request }) => {
    const shared = {
      surfaceId: 'ridge-81',
      caseId: 'shell-hard',
      routing: { mode: 'switcher' },
      pedals: [
        { name: 'Tuner', kind: 'tuner', powered: true, inLoop: false, currentMa: 60 },
        { name: 'Fuzz', kind: 'compact', powered: true, inLoop: true, currentMa: 10 },
        { name: 'Plate reverb', kind: 'large_digital', powered: true, inLoop: true, currentMa: 300 },
      ],
      functions: ['four_cable'],
      level: 'journeyman',
      powerSupply: {
        outputs: [
          { voltage: 9, currentMa: 500, isolated: true },
          { voltage: 9, currentMa: 100, isolated: true },
        ],
      },
    };
    const context = await browser.newContext();
    const page = await context.newPage();
    await page.goto(`/configure?step=review&c=${encode(shared)}`);
    await expectStep(page, 'Review');
    expect(await configurationInUrl(page)).toEqual(shared);
    await expectPanelMatchesApi(page, request);
    await page
      .getByRole('navigation', { name: 'Configurator steps' })
      .getByRole('button', { name: /^Pedals/ })
      .click();
    await expect(page.getByRole('heading', { name: 'Plate reverb', level: 3 })).toBeVisible();
    await expect(page.getByText(/Output 1: 9 V DC, isolated/)).toBeVisible();
    await context.close();
  });

  test('a draft survives a closed tab', async ({ browser }) => {
    const context = await browser.newContext();
    const first = await context.newPage();
    await first.goto('/configure?step=extras');
    await choose(first.getByRole('checkbox', { name: 'Dedicated tuner output' }));
    await expect.poll(async () => (await configurationInUrl(first)).functions).toEqual(['tuner_out']);
    await first.close();
    const second = await context.newPage();
    await second.goto('/configure');
    await expect(second.getByText(/We restored the board you were configuring/)).toBeVisible();
    await expect.poll(async () => (await configurationInUrl(second)).functions).toEqual(['tuner_out']);
    await context.close();
  });

  test('at phone width every step holds 375 px, passes axe and shows the estimate as a bottom sheet', async ({
    page,
    request,
  }, testInfo) => {
    test.setTimeout(240_000);
    await page.setViewportSize({ width: 375, height: 812 });
    const config = {
      surfaceId: 'slate-61',
      caseId: 'gig-bag',
      routing: { mode: 'switcher' },
      functions: ['wet_dry_wet'],
      level: 'master',
      pedals: [
        { name: 'Compressor', kind: 'compact', powered: true, inLoop: false },
        { name: 'Overdrive', kind: 'compact', powered: true, inLoop: true, currentMa: 20 },
        { name: 'Analog delay', kind: 'compact', powered: true, inLoop: true, currentMa: 40, widthMm: 70, depthMm: 125 },
      ],
      powerSupply: { outputs: [{ voltage: 9, currentMa: 100, isolated: true }] },
    };
    await page.goto(`/configure?c=${encode(config)}`);
    for (const [i, title] of steps.entries()) {
      await page.goto(`/configure?step=${title.toLowerCase()}&c=${encode(config)}`);
      await expectStep(page, title);
      await expectPanelMatchesApi(page, request);
      const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
      expect(overflow, `${title} fits 375 px without sideways scrolling`).toBeLessThanOrEqual(0);
      await expectNoSeriousAxeViolations(page, `${title} (phone)`);
      await shoot(page, testInfo, `phone-${i + 1}-${title.toLowerCase()}`);
    }
    const panel = page.getByRole('complementary', { name: 'Estimate' });
    await panel.getByRole('button', { name: 'Details' }).click();
    await expect(panel.getByTestId('estimate-labor')).toBeVisible();
    await shoot(page, testInfo, 'phone-8-estimate-sheet-open');
  });
});
