import { mkdtemp, rm } from 'node:fs/promises';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { expect } from 'vitest';
import { startPaymentFake, type PaymentFake } from '../../fakes/payment/payment-fake';
import type { Visitor } from './api-process';
import { createTestApp, type TestApp } from './test-app';
import { paymentFakeEnv } from './fakes-env';
import { signIn } from './bench-fixtures';

export const WEBHOOK_SECRET = 'whsec_loomwright_test_0123456789';

export interface PaymentHarness {
  t: TestApp;
  fake: PaymentFake;
  apiUrl: string;
  uploadsDir: string;
  signIn: (email: string) => Promise<ReturnType<typeof request.agent>>;
  close: () => Promise<void>;
}

/**
 * The API listening on a real port with the payment fake running in-process beside it: the fake
 * answers the SDK and posts signed webhooks back to the API over HTTP, as it does under npm start.
 */
export async function startPaymentHarness(): Promise<PaymentHarness> {
  // Bank debits settle only when a test says so (control.settle), so the "processing" state can be looked at first.
  const fake = await startPaymentFake({
    port: 0,
    webhookSecret: WEBHOOK_SECRET,
    retryDelaysMs: [50, 100, 200, 400],
    settleDelayMs: null,
    laterDelayMs: 100,
  });
  const uploadsDir = await mkdtemp(path.join(tmpdir(), 'lw-uploads-'));
  const t = await createTestApp({
    env: {
      ...paymentFakeEnv(fake, { secretKey: 'sk_test_loomwright_suite', webhookSecret: WEBHOOK_SECRET }),
      PUBLIC_URL: 'http://storefront.test',
      UPLOADS_DIR: uploadsDir,
    },
  });
  await t.app.listen(0, '127.0.0.1');
  const apiUrl = `http://127.0.0.1:${(t.app.getHttpServer().address() as AddressInfo).port}`;
  fake.webhooks.url = `${apiUrl}/api/payments/webhook`;
  return {
    t,
    fake,
    apiUrl,
    uploadsDir,
    signIn: (email) => signIn(t.app, email),
    close: async () => {
      await fake.close();
      await t.close();
      await rm(uploadsDir, { recursive: true, force: true });
    },
  };
}

/**
 * Polls until `check` answers. The wait is long enough for the fake's webhook retries (0.5, 1, 2 and 4 s after a
 * delivery the API answered slowly or not at all) on a machine busy with other suites; a passing check returns at once.
 */
export async function eventually<T>(check: () => Promise<T | undefined | null | false>, what: string, timeoutMs = 20_000): Promise<T> {
  const end = Date.now() + timeoutMs;
  for (;;) {
    const value = await check();
    if (value) return value;
    if (Date.now() > end) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** Types a card into the fake's hosted page, as the player's browser would post the form. */
export function payOnHostedPage(checkoutUrl: string, card: string) {
  return fetch(checkoutUrl, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ card, expiry: '12/34', cvc: '123' }),
    redirect: 'manual',
  });
}

/**
 * A player of a built API process pays a booking's deposit by card on the hosted page; resolves once the
 * deposit webhook has reached the API and the booking reads `deposit_paid`.
 */
export async function payDepositAs(player: Visitor, bookingId: string, card: string): Promise<void> {
  const checkout = await player.call('POST', `/api/bookings/${bookingId}/checkout`, {});
  expect(checkout.status, checkout.text).toBe(200);
  expect((await payOnHostedPage(checkout.body.url, card)).status).toBe(303);
  await eventually(
    async () => (await player.call('GET', `/api/bookings/${bookingId}`)).body?.state === 'deposit_paid',
    'the deposit webhook',
  );
}

/** Pays from a bank account on the hosted page (ACH test routing number 110000000, from the provider's testing guide, from memory). */
export function payByBankOnHostedPage(checkoutUrl: string, account: string, routing = '110000000') {
  return fetch(checkoutUrl, {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ method: 'us_bank_account', routing, account }),
    redirect: 'manual',
  });
}
