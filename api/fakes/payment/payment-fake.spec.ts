import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import Stripe from 'stripe';
import { afterEach, describe, expect, it } from 'vitest';
import { startPaymentFake, type PaymentFake } from './payment-fake';

// The fake answers the official `stripe` SDK; these calls are the ones the API makes
// (Checkout Sessions in payment mode, Stripe API reference "Create a Checkout Session").
const sdkFor = (fake: PaymentFake) =>
  new Stripe('sk_test_fake_state', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });

const openSession = (stripe: Stripe) =>
  stripe.checkout.sessions.create(
    {
      mode: 'payment',
      line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 20491, product_data: { name: 'Deposit' } } }],
      success_url: 'http://shop.test/checkout/return?session_id={CHECKOUT_SESSION_ID}',
      cancel_url: 'http://shop.test/checkout/return?result=cancelled',
      metadata: { bookingId: 'b-1' },
    },
    { idempotencyKey: 'deposit:b-1:1' },
  );

describe('the payment fake keeps its state in a file when given one', () => {
  let dir: string;
  let fake: PaymentFake | undefined;
  afterEach(async () => {
    await fake?.close();
    fake = undefined;
    if (dir) await rm(dir, { recursive: true, force: true });
  });

  it('still knows an open checkout, and its idempotency key, after a restart', async () => {
    dir = await mkdtemp(path.join(tmpdir(), 'lw-fake-'));
    const stateFile = path.join(dir, 'payment-fake.json');
    fake = await startPaymentFake({ port: 0, webhookSecret: 'whsec_state_test', stateFile });
    const created = await openSession(sdkFor(fake));
    const port = fake.port;
    await fake.close();

    fake = await startPaymentFake({ port, webhookSecret: 'whsec_state_test', stateFile });
    const stripe = sdkFor(fake);
    const again = await stripe.checkout.sessions.retrieve(created.id);
    expect(again).toMatchObject({ id: created.id, status: 'open', amount_total: 20491, metadata: { bookingId: 'b-1' } });
    // A retry with the same key after the restart is answered from memory: no second session.
    const retried = await openSession(stripe);
    expect(retried.id).toBe(created.id);
    expect(fake.store.sessions.size).toBe(1);
  });

  it('starts empty without a file, as the tests use it', async () => {
    fake = await startPaymentFake({ port: 0, webhookSecret: 'whsec_state_test' });
    await expect(sdkFor(fake).checkout.sessions.retrieve('cs_test_unknown')).rejects.toMatchObject({ statusCode: 404 });
  });
});
