import path from 'node:path';
import { defineConfig } from '@playwright/test';
import { chromiumLaunchOptions, stackEnv } from './stack-env.mjs';

// The product as `npm start` runs it, on ports the test command picked (or the usual ones).
const port = Number(process.env.E2E_PORT ?? 3100);
const paymentPort = Number(process.env.E2E_PAYMENT_PORT ?? 4342);
const smtpPort = Number(process.env.E2E_SMTP_PORT ?? 2625);
const mailHttpPort = Number(process.env.E2E_MAIL_HTTP_PORT ?? 8125);
const pgPort = Number(process.env.TEST_PG_PORT ?? 54339);
const objectStorePort = Number(process.env.E2E_OBJECT_STORE_PORT ?? 4669);
export const baseURL = `http://localhost:${port}`;

process.env.E2E_BASE_URL = baseURL;
process.env.E2E_PAYMENT_URL = `http://127.0.0.1:${paymentPort}`;
process.env.E2E_MAIL_URL = `http://127.0.0.1:${mailHttpPort}`;

export default defineConfig({
  testDir: './tests',
  outputDir: './test-results',
  timeout: 90_000,
  expect: { timeout: 10_000 },
  fullyParallel: false,
  workers: 1,
  // One retry, as Playwright's own setup suggests for CI: a test that passes only on its retry is
  // reported as "flaky" in the list and the HTML report, and a test that fails twice fails the run.
  retries: 1,
  reporter: [['list'], ['html', { open: 'never', outputFolder: 'playwright-report' }]],
  use: {
    baseURL,
    trace: 'retain-on-failure',
    screenshot: 'only-on-failure',
    // Debian's Chromium; Playwright never downloads a browser of its own here.
    launchOptions: chromiumLaunchOptions,
  },
  webServer: {
    command: `node ${path.resolve(__dirname, '../api/scripts/stack.mjs')}`,
    url: `${baseURL}/api/health`,
    timeout: 180_000,
    reuseExistingServer: false,
    gracefulShutdown: { signal: 'SIGTERM', timeout: 10_000 },
    stdout: 'ignore',
    stderr: 'pipe',
    env: {
      ...stackEnv({
        port,
        pgPort,
        pgData: process.env.E2E_PG_DATA ?? '.data/postgres-test',
        dbName: 'loomwright_e2e',
        paymentPort,
        smtpPort,
        mailHttpPort,
        objectStorePort,
      }),
      // Bank debits settle only when a test tells the fake (POST /_control/payment_intents/settle_processing).
      PAYMENT_FAKE_SETTLE_SECONDS: '0',
      NODE_ENV: 'test',
    },
  },
});
