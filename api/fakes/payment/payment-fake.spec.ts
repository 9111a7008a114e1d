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

/**
 * The fake refuses what the provider refuses. Sources: the provider's API reference ("Create a
 * Checkout Session": `expires_at` 30 minutes to 24 hours after creation; "Metadata": up to 50 keys,
 * key names up to 40 characters, values up to 500 characters; unknown parameters are refused as
 * `parameter_unknown`), ISO 4217 for currency codes, and the payment method guides (ACH debits in
 * usd only). Error wording is the fake's, close to the provider's as remembered (from memory).
 */
describe('the payment fake is as strict as the provider', () => {
  let fake: PaymentFake;
  let stripe: Stripe;
  const base = {
    mode: 'payment' as const,
    line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 20491, product_data: { name: 'Deposit' } } }],
    success_url: 'http://shop.test/ok',
  };
  const refusal = (p: Promise<unknown>) =>
    p.then(
      () => ({ statusCode: 200, message: 'accepted' }),
      (e: { statusCode: number; message: string; param?: string }) => e,
    );

  afterEach(async () => fake?.close());

  it('refuses unknown parameters, long metadata, expires_at out of bounds, currency xyz and a bank debit in the wrong currency', async () => {
    fake = await startPaymentFake({ port: 0, webhookSecret: 'whsec_strict' });
    stripe = sdkFor(fake);
    const now = Math.floor(Date.now() / 1000);
    const cases: Array<[string, Promise<unknown>, RegExp]> = [
      ['unknown parameter', stripe.checkout.sessions.create({ ...base, colour: 'teal' } as never), /Received unknown parameter: colour/],
      [
        'unknown nested parameter',
        stripe.checkout.sessions.create({
          ...base,
          line_items: [{ quantity: 1, price_data: { currency: 'usd', unit_amount: 1, product_data: { name: 'x' }, flavour: 1 } }],
        } as never),
        /unknown parameter: line_items\[0\]\[price_data\]\[flavour\]/,
      ],
      ['metadata key over 40', stripe.checkout.sessions.create({ ...base, metadata: { ['k'.repeat(41)]: 'v' } }), /up to 40 characters/],
      [
        'metadata value over 500',
        stripe.checkout.sessions.create({ ...base, metadata: { note: 'x'.repeat(501) } }),
        /up to 500 characters/,
      ],
      [
        '51 metadata keys',
        stripe.checkout.sessions.create({ ...base, metadata: Object.fromEntries(Array.from({ length: 51 }, (_, i) => [`k${i}`, 'v'])) }),
        /up to 50 keys/,
      ],
      ['expires_at under 30 min', stripe.checkout.sessions.create({ ...base, expires_at: now + 20 * 60 }), /at least 30 minutes/],
      ['expires_at over 24 h', stripe.checkout.sessions.create({ ...base, expires_at: now + 25 * 3600 }), /less than 24 hours/],
      [
        'currency xyz',
        stripe.checkout.sessions.create({
          ...base,
          line_items: [{ quantity: 1, price_data: { currency: 'xyz', unit_amount: 1, product_data: { name: 'x' } } }],
        }),
        /Invalid currency: xyz/,
      ],
      [
        'ACH in eur',
        stripe.checkout.sessions.create({
          ...base,
          payment_method_types: ['us_bank_account'],
          line_items: [{ quantity: 1, price_data: { currency: 'eur', unit_amount: 100, product_data: { name: 'x' } } }],
        }),
        /does not support the currency "eur"/,
      ],
      ['refund without a target', stripe.refunds.create({ reason: 'requested_by_customer' }), /payment_intent or charge/],
      ['refund of an unknown intent', stripe.refunds.create({ payment_intent: 'pi_test_x' }), /No such payment_intent: 'pi_test_x'/],
    ];
    for (const [what, call, message] of cases) {
      const error = await refusal(call);
      expect(error.statusCode, what).toBe(what === 'refund of an unknown intent' ? 404 : 400);
      expect(error.message, what).toMatch(message);
    }
    expect(fake.store.sessions.size).toBe(0);
    // Within bounds is accepted.
    const ok = await stripe.checkout.sessions.create({
      ...base,
      expires_at: now + 3600,
      payment_method_types: ['card', 'us_bank_account'],
    });
    expect(ok.expires_at).toBe(now + 3600);
  });

  it('answers whole objects: required fields present, and events on the SDK pinned API version', async () => {
    fake = await startPaymentFake({ port: 0, webhookSecret: 'whsec_strict', settleDelayMs: null });
    stripe = sdkFor(fake);
    const session = await stripe.checkout.sessions.create({ ...base, payment_method_types: ['card'] });
    // Fields the contract marks required (not optional) on a Checkout Session.
    expect(session).toMatchObject({
      payment_method_types: ['card'],
      payment_status: 'unpaid',
      status: 'open',
      livemode: false,
      custom_fields: [],
    });
    expect(session).toHaveProperty('total_details');
    const paid = await fetch(session.url!, {
      method: 'POST',
      body: new URLSearchParams({ card: '4242424242424242' }),
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    });
    expect(paid.status).toBe(303);
    const after = await stripe.checkout.sessions.retrieve(session.id);
    const intent = await stripe.paymentIntents.retrieve(after.payment_intent as string);
    expect(intent).toMatchObject({ status: 'succeeded', payment_method_types: ['card'], capture_method: 'automatic' });
    const charge = fake.store.charges.get(intent.latest_charge as string)!;
    expect(charge).toMatchObject({ captured: true, paid: true, status: 'succeeded', amount_captured: 20491 });
    expect(fake.events.map((e) => e.type)).toEqual(['payment_intent.succeeded', 'checkout.session.completed']);
    for (const event of fake.events) expect(event.api_version).toBe(Stripe.API_VERSION);
  });

  it('expires an open session when its time comes, with the event, and a refund can be told to fail', async () => {
    fake = await startPaymentFake({ port: 0, webhookSecret: 'whsec_strict', expirySweepMs: 20 });
    stripe = sdkFor(fake);
    const session = await stripe.checkout.sessions.create({ ...base, expires_at: Math.floor(Date.now() / 1000) + 1800 });
    fake.control.clock.advance(1801);
    await new Promise((r) => setTimeout(r, 100));
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe('expired');
    expect(fake.events.map((e) => e.type)).toEqual(['checkout.session.expired']);
    await expect(stripe.checkout.sessions.expire(session.id)).rejects.toMatchObject({ statusCode: 400 });

    const second = await stripe.checkout.sessions.create(base);
    await fetch(second.url!, {
      method: 'POST',
      body: new URLSearchParams({ card: '4242424242424242' }),
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
    });
    const intentId = (await stripe.checkout.sessions.retrieve(second.id)).payment_intent as string;
    fake.control.nextRefund('fail');
    const refund = await stripe.refunds.create({ payment_intent: intentId });
    expect(refund).toMatchObject({ status: 'failed', failure_reason: 'expired_or_canceled_card' });
    expect(fake.events.map((e) => e.type).slice(-3)).toEqual(['charge.refunded', 'refund.created', 'refund.failed']);
    // The money is still there to refund.
    expect((await stripe.refunds.create({ payment_intent: intentId })).status).toBe('succeeded');
  });
});
