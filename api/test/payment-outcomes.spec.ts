import { sql } from 'kysely';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { depositStatusFromPaymentsSql } from '../src/bookings/bookings.repository';
import { eventually, payByBankOnHostedPage, payOnHostedPage, startPaymentHarness, type PaymentHarness } from './support/payment-harness';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';

/**
 * Every outcome the payment provider can report after a checkout, driven through the local fake
 * and checked on the booking, its payments, its mail and its timeline.
 *
 * Outside sources: the provider's API reference (Checkout Session `payment_status` "unpaid" on
 * `checkout.session.completed` for delayed methods, then `checkout.session.async_payment_succeeded`
 * or `_failed`; Refund `status` pending → succeeded | failed | canceled with `refund.updated` and
 * `refund.failed`; Dispute `status` needs_response → won | lost with `charge.dispute.created` and
 * `charge.dispute.closed`; Checkout Sessions expire after 24 hours by default with
 * `checkout.session.expired`). Test numbers: the provider's testing guide: card 4242 4242 4242 4242
 * pays; 4000 0000 0000 0259 pays and is then disputed (fraudulent); 4000 0000 0000 5126 pays and its
 * refund later fails; ACH routing 110000000 with account 000123456789 settles later and
 * 000111111113 fails later (account closed). The dispute, refund-failure and bank numbers are
 * written from memory.
 */
const board = countedBoard(5);
const CARD = '4242 4242 4242 4242';
const DISPUTED_CARD = '4000 0000 0000 0259';
const REFUND_FAILS_CARD = '4000 0000 0000 5126';
const BANK_SETTLES = '000123456789';
const BANK_FAILS = '000111111113';

describe('payment outcomes the provider reports after checkout', () => {
  let h: PaymentHarness;
  let player: Awaited<ReturnType<PaymentHarness['signIn']>>;
  let owner: Awaited<ReturnType<PaymentHarness['signIn']>>;

  beforeAll(async () => {
    h = await startPaymentHarness();
    player = await h.signIn('player@mail.example');
    owner = await h.signIn('owner@shop.example');
  }, 60_000);
  afterAll(async () => h?.close());

  async function request() {
    const res = await player.post('/api/bookings').send({ configuration: board });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body as { id: string; reference: string; deposit: string };
  }
  async function checkout(id: string) {
    const res = await player.post(`/api/bookings/${id}/checkout`).send({});
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return res.body.url as string;
  }
  const detail = async (id: string) => (await owner.get(`/api/bookings/${id}`).expect(200)).body;
  const payments = (id: string) => h.t.db.selectFrom('payments').selectAll().where('booking_id', '=', id).orderBy('created_at').execute();
  const mails = (id: string, template: string) =>
    h.t.db.selectFrom('mail_outbox').select(['to_address', 'data']).where('booking_id', '=', id).where('template', '=', template).execute();
  const notes = async (id: string) =>
    (await h.t.db.selectFrom('booking_events').select('note').where('booking_id', '=', id).orderBy('id').execute()).map((e) => e.note);
  const intentOf = async (id: string) => (await payments(id)).at(-1)!.payment_intent_id!;
  /** Every event the fake sent so far has been answered 2xx by the API. */
  const delivered = async () => expect(await h.fake.webhooks.settled(h.fake.events.map((e) => e.id))).toBe(true);

  async function paidByCard(card = CARD) {
    const booking = await request();
    expect((await payOnHostedPage(await checkout(booking.id), card)).status).toBe(303);
    await eventually(async () => (await payments(booking.id))[0]?.status === 'paid', 'the deposit webhook');
    return booking;
  }

  it('a bank debit that settles later: processing, then deposit paid when the money arrives', async () => {
    const booking = await request();
    const url = await checkout(booking.id);
    const session = [...h.fake.store.sessions.values()].find((s) => s.metadata?.bookingId === booking.id)!;
    // The API names the ways of paying itself instead of leaving them to the dashboard; a bank debit only in its currency (usd).
    expect(session.payment_method_types).toEqual(['card', 'us_bank_account']);
    expect((await payByBankOnHostedPage(url, BANK_SETTLES)).status).toBe(303);
    await eventually(async () => (await payments(booking.id))[0]?.status === 'processing', 'the completed-but-unpaid webhook');
    let b = await detail(booking.id);
    expect(b).toMatchObject({ state: 'requested', depositStatus: 'processing' });
    expect(await mails(booking.id, 'deposit-received')).toHaveLength(0);
    expect((await notes(booking.id)).at(-1)).toMatch(/paid by bank debit; it settles in a few working days/);
    // No second checkout while the first is settling: that could take the money twice.
    const again = await player.post(`/api/bookings/${booking.id}/checkout`).send({}).expect(409);
    expect(again.body.message).toMatch(/still settling/);

    h.fake.control.settle(await intentOf(booking.id));
    b = await eventually(async () => {
      const d = await detail(booking.id);
      return d.state === 'deposit_paid' ? d : undefined;
    }, 'the async success webhook');
    expect(b.depositStatus).toBe('paid');
    expect(b.payments).toHaveLength(1);
    expect(b.payments[0]).toMatchObject({ status: 'paid', failureMessage: null });
    expect(await mails(booking.id, 'deposit-received')).toHaveLength(1);
    expect(await mails(booking.id, 'shop-new-paid-request')).toHaveLength(1);
    expect(b.events.map((e: { toState: string }) => e.toState)).toEqual(['requested', 'requested', 'deposit_paid']);
    await delivered();
  });

  it('a bank debit that fails later: the player is told in words and pays again on a new checkout', async () => {
    const booking = await request();
    const url = await checkout(booking.id);
    expect((await payByBankOnHostedPage(url, BANK_FAILS)).status).toBe(303);
    await eventually(async () => (await payments(booking.id))[0]?.status === 'processing', 'processing');
    h.fake.control.settle(await intentOf(booking.id));
    await eventually(async () => (await payments(booking.id))[0]?.status === 'failed', 'the async failure webhook');
    const b = await detail(booking.id);
    expect(b).toMatchObject({ state: 'requested', depositStatus: 'unpaid' });
    expect(b.payments[0].failureMessage).toBe('The bank account has been closed.');
    const failed = await mails(booking.id, 'payment-failed');
    expect(failed).toHaveLength(1);
    expect(failed[0]).toMatchObject({
      to_address: 'player@mail.example',
      data: expect.objectContaining({ reason: 'The bank account has been closed.' }),
    });
    expect((await notes(booking.id)).at(-1)).toMatch(/bank debit of .* failed: The bank account has been closed\. Nothing was taken/);
    await delivered();
    // payment_intent.payment_failed and checkout.session.async_payment_failed both report it: one line, one mail.
    expect((await notes(booking.id)).filter((n) => n.includes('failed: The bank account'))).toHaveLength(1);

    const retry = await checkout(booking.id);
    expect(retry).not.toBe(url);
    expect((await payOnHostedPage(retry, CARD)).status).toBe(303);
    await eventually(async () => (await detail(booking.id)).state === 'deposit_paid', 'the retried deposit');
    expect((await payments(booking.id)).map((p) => p.status)).toEqual(['failed', 'paid']);
  });

  it('an unpaid checkout expires on its time (24 h), with its event and a history line, and a new one can be opened', async () => {
    const booking = await request();
    const url = await checkout(booking.id);
    h.fake.control.advance(24 * 3600 + 1);
    await eventually(async () => (await payments(booking.id))[0]?.status === 'expired', 'the expiry webhook');
    expect((await notes(booking.id)).at(-1)).toMatch(/checkout of .* closed unpaid when its time ran out/);
    const page = await fetch(url);
    expect(await page.text()).toContain('This checkout has expired');
    const fresh = await checkout(booking.id);
    expect(fresh).not.toBe(url);
    expect((await payments(booking.id)).map((p) => p.status)).toEqual(['expired', 'pending']);
  });

  it('a refund that is pending, then succeeds: the player is mailed only once the money is on its way', async () => {
    const booking = await paidByCard();
    h.fake.control.nextRefund('pending');
    const res = await player.post(`/api/bookings/${booking.id}/cancel`).send({ reason: 'Plans changed.' }).expect(200);
    expect(res.body.state).toBe('cancelled');
    expect(res.body.payments[0]).toMatchObject({ status: 'paid', refundStatus: 'pending' });
    await delivered();
    expect(await mails(booking.id, 'deposit-refunded')).toHaveLength(0);
    expect((await notes(booking.id)).at(-1)).toMatch(/Refund of .* asked of the payment provider; it is pending/);

    const [row] = await payments(booking.id);
    h.fake.control.finishRefund(row.refund_id!, 'succeeded');
    await eventually(async () => (await payments(booking.id))[0]?.status === 'refunded', 'the refund.updated webhook');
    await delivered();
    expect(await mails(booking.id, 'deposit-refunded')).toHaveLength(1);
    const b = await detail(booking.id);
    expect(b.depositStatus).toBe('refunded');
    expect(b.payments[0]).toMatchObject({ refundStatus: 'succeeded' });
    expect((await notes(booking.id)).filter((n) => n.startsWith('Refund of'))).toHaveLength(2);
  });

  it('a refund that fails: the owner is told at once, the money stays paid, and the owner can try again', async () => {
    const booking = await paidByCard();
    h.fake.control.nextRefund('pending');
    await owner.post(`/api/bookings/${booking.id}/refund`).send({ reason: 'Shop closed for a month.' }).expect(200);
    const [row] = await payments(booking.id);
    h.fake.control.finishRefund(row.refund_id!, 'failed');
    await eventually(async () => (await payments(booking.id))[0]?.refund_status === 'failed', 'the refund.failed webhook');
    await delivered();
    const b = await detail(booking.id);
    expect(b.payments[0]).toMatchObject({ status: 'paid', refundStatus: 'failed', refundFailure: 'the card was reported lost or stolen' });
    expect(await mails(booking.id, 'deposit-refunded')).toHaveLength(0);
    const alerts = await mails(booking.id, 'shop-payment-alert');
    expect(alerts).toEqual([
      expect.objectContaining({ to_address: 'owner@shop.example', data: expect.objectContaining({ alert: 'refund-failed' }) }),
    ]);
    // refund.updated and refund.failed both carry the failure: it is recorded once.
    expect((await notes(booking.id)).filter((n) => n.includes('failed: the card was reported lost or stolen'))).toHaveLength(1);

    const retried = await owner.post(`/api/bookings/${booking.id}/refund`).send({ reason: 'Second try.' }).expect(200);
    expect(retried.body.payments[0]).toMatchObject({ status: 'refunded', refundStatus: 'succeeded' });
    expect(h.fake.store.refunds.size).toBeGreaterThanOrEqual(2);
    expect((await payments(booking.id))[0].refund_attempts).toBe(2);
    expect(await mails(booking.id, 'deposit-refunded')).toHaveLength(1);
  });

  it('a refund the provider first reports succeeded and later failed (test card 5126) is put back to paid and the owner told', async () => {
    const booking = await paidByCard(REFUND_FAILS_CARD);
    const res = await player.post(`/api/bookings/${booking.id}/cancel`).send({}).expect(200);
    expect(res.body.depositStatus).toBe('refunded');
    await eventually(async () => (await payments(booking.id))[0]?.refund_status === 'failed', 'the later refund failure');
    await delivered();
    const [row] = await payments(booking.id);
    expect(row).toMatchObject({ status: 'paid', refunded_at: null, refund_failure: 'the card has expired or was cancelled' });
    expect((await mails(booking.id, 'shop-payment-alert')).map((m) => (m.data as { alert: string }).alert)).toEqual(['refund-failed']);
  });

  it('a dispute opened and won: owner told at once, the booking shows it, delivery waits for the owner', async () => {
    const booking = await paidByCard();
    const dispute = h.fake.control.openDispute(await intentOf(booking.id), 'product_not_received');
    await eventually(async () => (await payments(booking.id))[0]?.dispute_id === dispute.id, 'the dispute webhook');
    let b = await detail(booking.id);
    expect(b.depositStatus).toBe('disputed');
    expect(b.payments[0].dispute).toMatchObject({
      status: 'needs_response',
      reason: 'product_not_received',
      amount: booking.deposit,
      releasedAt: null,
    });
    expect(b.deliveryHold).toMatch(/disputed the deposit \(product not received\).*Delivery waits until the owner decides/);
    expect((await mails(booking.id, 'shop-payment-alert')).map((m) => (m.data as { alert: string }).alert)).toEqual(['dispute-opened']);
    // A disputed deposit is not refunded on top of the chargeback.
    const refused = await owner.post(`/api/bookings/${booking.id}/refund`).send({ reason: 'Settle it.' }).expect(409);
    expect(refused.body.message).toMatch(/disputed by the player's bank/);

    // Pretend the build is finished with a firm total equal to the deposit (nothing more owed) and try to deliver.
    const estimate = await h.t.db.selectFrom('quotes').selectAll().where('booking_id', '=', booking.id).executeTakeFirstOrThrow();
    const { id: _id, created_at: _c, ...copy } = estimate;
    await h.t.db
      .insertInto('quotes')
      .values({
        ...copy,
        kind: 'firm',
        configuration: JSON.stringify(copy.configuration),
        estimate: JSON.stringify(copy.estimate),
        total: booking.deposit,
        total_low: booking.deposit,
        total_high: booking.deposit,
      })
      .execute();
    await h.t.db.updateTable('bookings').set({ state: 'ready' }).where('id', '=', booking.id).execute();
    const blocked = await owner.post(`/api/bookings/${booking.id}/state`).send({ to: 'delivered' }).expect(409);
    expect(blocked.body.message).toMatch(/cannot be delivered yet/);

    h.fake.control.closeDispute(dispute.id, 'won');
    await eventually(async () => (await payments(booking.id))[0]?.dispute_status === 'won', 'the dispute closed webhook');
    b = await detail(booking.id);
    expect(b.depositStatus).toBe('paid');
    expect(b.deliveryHold).toMatch(/decided for the shop/);
    expect((await mails(booking.id, 'shop-payment-alert')).map((m) => (m.data as { alert: string }).alert).sort()).toEqual([
      'dispute-opened',
      'dispute-won',
    ]);

    await owner.post(`/api/bookings/${booking.id}/dispute/release`).send({ note: '' }).expect(400);
    await player.post(`/api/bookings/${booking.id}/dispute/release`).send({ note: 'mine' }).expect(403);
    const released = await owner
      .post(`/api/bookings/${booking.id}/dispute/release`)
      .send({ note: 'Won; the player confirmed the order.' })
      .expect(200);
    expect(released.body.deliveryHold).toBeNull();
    expect(released.body.payments[0].dispute.releasedBy).toBeTruthy();
    await owner.post(`/api/bookings/${booking.id}/state`).send({ to: 'delivered' }).expect(200);
    expect(await notes(booking.id)).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/disputed the deposit .* \(product not received\)\. The owner has been told/),
        expect.stringMatching(/decided the dispute over the deposit for the shop/),
        'Delivery released despite the dispute: Won; the player confirmed the order.',
      ]),
    );
  });

  it('a dispute opened by the test card and lost: the money was taken back and the owner decides', async () => {
    const booking = await paidByCard(DISPUTED_CARD);
    await eventually(async () => (await payments(booking.id))[0]?.dispute_id, 'the dispute the test card opens');
    const [row] = await payments(booking.id);
    expect(row.dispute_reason).toBe('fraudulent');
    h.fake.control.closeDispute(row.dispute_id!, 'lost');
    await eventually(async () => (await payments(booking.id))[0]?.dispute_status === 'lost', 'the lost dispute');
    const b = await detail(booking.id);
    expect(b.depositStatus).toBe('disputed');
    expect(b.deliveryHold).toMatch(/decided for the player and the money was taken back/);
    expect((await mails(booking.id, 'shop-payment-alert')).map((m) => (m.data as { alert: string }).alert).sort()).toEqual([
      'dispute-lost',
      'dispute-opened',
    ]);
    expect((await notes(booking.id)).at(-1)).toMatch(/for the player; .* was taken back/);
  });

  it("a dispute whose event overtakes the checkout's own is still put on the right payment", async () => {
    const booking = await request();
    const url = await checkout(booking.id);
    const sentBefore = h.fake.events.length;
    h.fake.webhooks.url = undefined; // hold deliveries: this test sends them in its own order
    try {
      expect((await payOnHostedPage(url, CARD)).status).toBe(303);
      const intentId = [...h.fake.store.sessions.values()].find((s) => s.metadata?.bookingId === booking.id)!.payment_intent as string;
      h.fake.control.openDispute(intentId, 'duplicate');
    } finally {
      h.fake.webhooks.url = `${h.apiUrl}/api/payments/webhook`;
    }
    const held = h.fake.events.slice(sentBefore);
    expect(held.map((e) => e.type)).toEqual(['payment_intent.succeeded', 'checkout.session.completed', 'charge.dispute.created']);
    // The dispute first, answered before the checkout's events are even sent.
    const dispute = held[2];
    const payload = JSON.stringify(dispute);
    const first = await fetch(`${h.apiUrl}/api/payments/webhook`, {
      method: 'POST',
      headers: {
        'content-type': 'application/json',
        'stripe-signature': new Stripe('sk_test_order').webhooks.generateTestHeaderString({
          payload,
          secret: 'whsec_loomwright_test_0123456789',
        }),
      },
      body: payload,
    });
    expect(first.status).toBe(200);
    expect((await payments(booking.id))[0]).toMatchObject({ status: 'pending', dispute_status: 'needs_response' });
    h.fake.resend(held[0].id);
    h.fake.resend(held[1].id);
    h.fake.resend(dispute.id); // the provider would retry it too: a duplicate now
    await eventually(async () => (await detail(booking.id)).state === 'deposit_paid', 'the deposit');
    await eventually(async () => (await payments(booking.id))[0]?.dispute_status === 'needs_response', 'the early dispute');
    const b = await detail(booking.id);
    expect(b.depositStatus).toBe('disputed');
    expect(b.deliveryHold).toMatch(/duplicate/);
  });

  it("a refund made in the provider's dashboard is recorded from its event, with its id, and the player mailed", async () => {
    const booking = await paidByCard();
    const refund = h.fake.control.dashboardRefund(await intentOf(booking.id));
    await eventually(async () => (await payments(booking.id))[0]?.status === 'refunded', 'the dashboard refund');
    await delivered();
    const [row] = await payments(booking.id);
    expect(row.refund_id).toBe(refund.id);
    expect(row.refund_status).toBe('succeeded');
    expect(await mails(booking.id, 'deposit-refunded')).toHaveLength(1);
    expect((await mails(booking.id, 'shop-payment-alert')).map((m) => (m.data as { alert: string }).alert)).toEqual(['outside-refund']);
    expect((await notes(booking.id)).at(-1)).toMatch(/made in the payment provider's dashboard; the money is on its way/);
    expect((await detail(booking.id)).depositStatus).toBe('refunded');
  });

  it('handles each event once: every event sent again changes nothing and adds no line or mail', async () => {
    await delivered();
    const count = async () => ({
      events: Number(
        (
          await h.t.db
            .selectFrom('booking_events')
            .select((eb) => eb.fn.countAll().as('n'))
            .executeTakeFirstOrThrow()
        ).n,
      ),
      mail: Number(
        (
          await h.t.db
            .selectFrom('mail_outbox')
            .select((eb) => eb.fn.countAll().as('n'))
            .executeTakeFirstOrThrow()
        ).n,
      ),
      payments: JSON.stringify(
        await h.t.db.selectFrom('payments').select(['id', 'status', 'refund_status', 'dispute_status']).orderBy('id').execute(),
      ),
    });
    const before = await count();
    const sent = h.fake.events.map((e) => e.id);
    const answers = await Promise.all(
      h.fake.events.map(async (event) => {
        const payload = JSON.stringify(event);
        const signer = new Stripe('sk_test_replay');
        const res = await fetch(`${h.apiUrl}/api/payments/webhook`, {
          method: 'POST',
          headers: {
            'content-type': 'application/json',
            'stripe-signature': signer.webhooks.generateTestHeaderString({ payload, secret: 'whsec_loomwright_test_0123456789' }),
          },
          body: payload,
        });
        return { status: res.status, body: (await res.json()) as { duplicate: boolean } };
      }),
    );
    expect(sent.length).toBeGreaterThan(20);
    expect(answers.every((a) => a.status === 200 && a.body.duplicate)).toBe(true);
    expect(await count()).toEqual(before);
  });

  it('leaves every booking with the deposit word its payment rows give, after all the outcomes above', async () => {
    // The word is kept on the booking by a trigger on payments; the lists filter on it. This is the
    // definition it replaced, worked out again from the payment rows of each booking.
    const drift = await h.t.db
      .selectFrom('bookings')
      .select(['reference', 'deposit_status', depositStatusFromPaymentsSql.as('from_payments')])
      .where(sql<boolean>`bookings.deposit_status is distinct from ${depositStatusFromPaymentsSql}`)
      .execute();
    expect(drift).toEqual([]);
    const words = await h.t.db.selectFrom('bookings').select('deposit_status').distinct().execute();
    // The outcomes above leave paid, refunded and disputed deposits at least.
    expect(words.map((w) => w.deposit_status)).toEqual(expect.arrayContaining(['paid', 'refunded', 'disputed']));
  });
});
