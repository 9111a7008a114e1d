import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app';

const SECRET = 'whsec_clock_window_0123456789abcdef';

/**
 * The webhook's clock window. The signed header is made by the payment SDK itself
 * (`webhooks.generateTestHeaderString`, the reference implementation of the provider's
 * `t=…,v1=…` scheme), so only the timestamp differs between the accepted and refused calls.
 * The 300 s window is the SDK's own tolerance (`Stripe.webhooks.DEFAULT_TOLERANCE`; the provider's
 * webhook documentation, "Prevent replay attacks", names five minutes), applied to both sides.
 */
describe('POST /api/payments/webhook: the signed timestamp must be within 300 s of our clock', () => {
  let t: TestApp;
  const signer = new Stripe('sk_test_clock_signer');
  let sequence = 0;

  beforeAll(async () => {
    t = await createTestApp({ seed: false, env: { STRIPE_WEBHOOK_SECRET: SECRET } });
  });
  afterAll(async () => t?.close());

  /** An event with nothing to do (it is only recorded), signed `offsetSeconds` from now. */
  async function deliver(offsetSeconds: number) {
    const id = `evt_clock_${++sequence}_${offsetSeconds}`;
    const payload = JSON.stringify({
      id,
      object: 'event',
      type: 'payment_intent.succeeded',
      data: { object: { id: 'pi_clock', object: 'payment_intent' } },
    });
    const timestamp = Math.floor(Date.now() / 1000) + offsetSeconds;
    const res = await t
      .http()
      .post('/api/payments/webhook')
      .set('content-type', 'application/json')
      .set('stripe-signature', signer.webhooks.generateTestHeaderString({ payload, secret: SECRET, timestamp }))
      .send(payload);
    const recorded = await t.db.selectFrom('payment_events').select('event_id').where('event_id', '=', id).execute();
    return { status: res.status, message: res.body.message as string | undefined, recorded: recorded.length };
  }

  it('accepts events signed a little before or after now (a few seconds of clock drift either way)', async () => {
    for (const offset of [0, -5, 5, -290, 290]) {
      expect(await deliver(offset), `offset ${offset}`).toMatchObject({ status: 200, recorded: 1 });
    }
  });

  it('refuses an event signed more than 300 s ago, in words, and records nothing', async () => {
    for (const offset of [-310, -3600]) {
      const answer = await deliver(offset);
      expect(answer, `offset ${offset}`).toMatchObject({ status: 400, recorded: 0 });
      expect(answer.message).toMatch(/signed \d+ seconds behind this server's clock; events more than 300 seconds either side are refused/);
    }
  });

  it('refuses an event signed more than 300 s in the future, in words, and records nothing', async () => {
    for (const offset of [310, 3600]) {
      const answer = await deliver(offset);
      expect(answer, `offset ${offset}`).toMatchObject({ status: 400, recorded: 0 });
      expect(answer.message).toMatch(
        /signed \d+ seconds ahead of this server's clock; events more than 300 seconds either side are refused/,
      );
    }
  });

  it('still refuses a wrong signature made at the right time', async () => {
    const payload = JSON.stringify({ id: 'evt_clock_forged', object: 'event', type: 'payment_intent.succeeded', data: { object: {} } });
    const res = await t
      .http()
      .post('/api/payments/webhook')
      .set('content-type', 'application/json')
      .set('stripe-signature', signer.webhooks.generateTestHeaderString({ payload, secret: 'whsec_someone_else_entirely_000000' }))
      .send(payload);
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/signature does not verify/);
  });
});
