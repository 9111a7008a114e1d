import { chromiumLaunchOptions } from '../stack-env.mjs';

/**
 * The board both latency measurements open: a configuration link (base64url JSON, the storefront's
 * codec) with a surface, a case and six counted pedals. Nothing is priced until all three are chosen.
 */
export function latencyBoardLink() {
  const configuration = {
    surfaceId: 'ridge-100',
    caseId: 'shell-hard',
    routing: { mode: 'serial' },
    pedalCount: 6,
    functions: [],
    level: 'apprentice',
  };
  return Buffer.from(JSON.stringify(configuration), 'utf8').toString('base64url');
}

/**
 * Time from the estimate debounce firing to the new figures on screen, in Debian's Chromium: the
 * storefront marks both moments (measure 'lw:estimate-latency'). Opens the latency board at the
 * Pedals step and adds a pedal `changes` times, each a count not priced before (no cached answer);
 * the page stops at 60 pedals, so at most 54 changes. Answers each change's duration in ms.
 */
export async function measureEstimateLatency(baseUrl, changes) {
  const { chromium } = await import('@playwright/test');
  const browser = await chromium.launch(chromiumLaunchOptions);
  try {
    const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
    // The configurator prices nothing the player has not chosen (surface, case, pedals), so the
    // page opens on a link that has all three, counted rather than listed.
    await page.goto(`${baseUrl}/configure?step=pedals&c=${latencyBoardLink()}`);
    await page.getByTestId('estimate-total').filter({ hasText: '$' }).waitFor();
    const more = page.getByRole('button', { name: 'One pedal more' });
    const durations = [];
    for (let i = 0; i < Math.min(changes, 54); i++) {
      const seen = await page.evaluate(() => performance.getEntriesByName('lw:estimate-latency').length);
      await more.click();
      await page.waitForFunction((n) => performance.getEntriesByName('lw:estimate-latency').length > n, seen, { timeout: 10_000 });
      durations.push(await page.evaluate(() => performance.getEntriesByName('lw:estimate-latency').at(-1).duration));
    }
    return durations;
  } finally {
    await browser.close();
  }
}
