// How the browser journeys and the benchmark bring the product up and look at it, written once
// (read by playwright.config.ts, bench/run.mjs and bench/estimate-latency.mjs): the settings
// api/scripts/stack.mjs reads for a stack on ports of its own, and Debian's Chromium with the
// flags ARCHITECTURE.md gives (Playwright never downloads a browser of its own here).

/** Playwright's `launchOptions` (or `chromium.launch()`'s) for Debian's Chromium. */
export const chromiumLaunchOptions = {
  executablePath: process.env.CHROMIUM_PATH ?? '/usr/lib/chromium/chromium',
  args: [
    '--no-sandbox',
    '--disable-gpu',
    '--disable-background-networking',
    '--disable-component-update',
    '--disable-sync',
    '--no-first-run',
  ],
};

/** chrome-launcher's options (Lighthouse's way of starting a browser) for the same Chromium, headless. */
export const lighthouseChromeOptions = {
  chromePath: chromiumLaunchOptions.executablePath,
  chromeFlags: ['--headless=new', ...chromiumLaunchOptions.args],
};

/**
 * The environment api/scripts/stack.mjs reads for the whole product on the given ports, on a
 * database made afresh and seeded with the demo shop (both the journeys and the benchmark sign in
 * as its people).
 * @param {{ port: number, pgPort: number, pgData: string, dbName: string, paymentPort: number, smtpPort: number, mailHttpPort: number, objectStorePort: number }} stack
 * @returns {Record<string, string>}
 */
export function stackEnv(stack) {
  return {
    PORT: String(stack.port),
    PUBLIC_URL: `http://localhost:${stack.port}`,
    PG_PORT: String(stack.pgPort),
    PG_DATA: stack.pgData,
    DB_NAME: stack.dbName,
    PAYMENT_FAKE_PORT: String(stack.paymentPort),
    MAIL_FAKE_SMTP_PORT: String(stack.smtpPort),
    MAIL_FAKE_HTTP_PORT: String(stack.mailHttpPort),
    OBJECT_STORE_PORT: String(stack.objectStorePort),
    FRESH_DATABASE: 'true',
    SEED_DEMO: 'true',
  };
}
