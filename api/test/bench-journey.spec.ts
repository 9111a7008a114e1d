import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BenchSuggestion, BenchSuggestResponse } from '@loomwright/shared';
import type { Agent } from './support/bench-fixtures';
import { eventually, payOnHostedPage, startPaymentHarness, type PaymentHarness } from './support/payment-harness';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';

// A plain serial board from the demo price book.
const serialBoard = countedBoard(6, 'apprentice');
// Stripe testing documentation, "Test card numbers": 4242 4242 4242 4242 succeeds.
const SUCCESS_CARD = '4242 4242 4242 4242';

describe('from a paid request to the bench, and the owner’s refunding decline, through the payment fake', () => {
  let h: PaymentHarness;
  beforeAll(async () => {
    h = await startPaymentHarness();
  }, 60_000);
  afterAll(async () => h?.close());

  async function paidRequest() {
    const player = await h.signIn('player@mail.example');
    const booking = (await player.post('/api/bookings').send({ configuration: serialBoard }).expect(201)).body as {
      id: string;
      reference: string;
      deposit: string;
    };
    const url = (await player.post(`/api/bookings/${booking.id}/checkout`).send({}).expect(200)).body.url as string;
    expect((await payOnHostedPage(url, SUCCESS_CARD)).status).toBe(303);
    await eventually(async () => (await player.get(`/api/bookings/${booking.id}`)).body.state === 'deposit_paid', 'the deposit webhook');
    return { player, booking };
  }

  /** Reads the bench's suggestions for the booking as `agent`, checks the one `pick` chooses, and accepts it. */
  async function acceptSuggested(
    agent: Agent,
    bookingId: string,
    pick: (s: BenchSuggestion) => boolean,
    check: (chosen: BenchSuggestion) => void = (chosen) => expect(chosen).toBeDefined(),
  ) {
    const suggest = (await agent.get(`/api/bench/suggest?bookingId=${bookingId}`).expect(200)).body as BenchSuggestResponse;
    const chosen = suggest.suggestions.find(pick)!;
    check(chosen);
    await agent.post(`/api/bookings/${bookingId}/accept`).send({ builderId: chosen.builder.id, benchDate: chosen.benchDate }).expect(200);
    return chosen;
  }
  const depositOf = (bookingId: string) =>
    h.t.db.selectFrom('payments').selectAll().where('booking_id', '=', bookingId).where('kind', '=', 'deposit').executeTakeFirstOrThrow();
  const mailOf = (bookingId: string, template: string) =>
    h.t.db
      .selectFrom('mail_outbox')
      .selectAll()
      .where('booking_id', '=', bookingId)
      .where('template', '=', template)
      .executeTakeFirstOrThrow();
  const allocationsOf = (bookingId: string) =>
    h.t.db.selectFrom('bench_allocations').select('id').where('booking_id', '=', bookingId).execute();
  /** The refunds the payment fake holds against the deposit's payment: one means refunded once. */
  const refundsAtProvider = (paymentIntent: string | null) =>
    [...h.fake.store.refunds.values()].filter((r) => r.payment_intent === paymentIntent);

  it('a builder accepts at the suggested date; the player sees the firm quote and the bench date', async () => {
    const { player, booking } = await paidRequest();
    const builder = await h.signIn('builder@shop.example');
    const mine = await acceptSuggested(builder, booking.id, (s) => s.builder.isMe);
    const detail = (await player.get(`/api/bookings/${booking.id}`).expect(200)).body;
    expect(detail).toMatchObject({
      state: 'scheduled',
      benchDate: mine.benchDate,
      expectedCompletion: mine.expectedCompletion,
      firmTotal: mine.firmTotal,
    });
    expect(detail.firmQuote).toMatchObject({ kind: 'firm', hourlyRate: '125.00', total: mine.firmTotal });
    const bench = (await builder.get(`/api/bench?from=${mine.benchDate}&to=${mine.benchDate}`).expect(200)).body;
    expect(bench.builders[0].days[0].builds.map((b: { reference: string }) => b.reference)).toContain(booking.reference);
  });

  it('the owner declines a paid request and the deposit goes back through the provider, once', async () => {
    const { booking } = await paidRequest();
    const owner = await h.signIn('owner@shop.example');
    const res = await owner
      .post(`/api/bookings/${booking.id}/decline`)
      .send({ reason: 'We cannot source a case for this surface.' })
      .expect(200);
    expect(res.body.state).toBe('declined');
    const deposit = await depositOf(booking.id);
    expect(deposit.refund_id).toMatch(/^re_/);
    expect(refundsAtProvider(deposit.payment_intent_id)).toHaveLength(1);
    const mail = await mailOf(booking.id, 'booking-declined');
    expect(mail.data).toMatchObject({ depositRefunded: true, refundAmount: booking.deposit });
    expect((await owner.post(`/api/bookings/${booking.id}/decline`).send({ reason: 'twice over' })).status).toBe(409);
  });

  it('the owner cancels a scheduled build the shop cannot do: bench time released and the deposit refunded through the provider, once', async () => {
    const { player, booking } = await paidRequest();
    const builder = await h.signIn('builder@shop.example');
    await acceptSuggested(builder, booking.id, (s) => s.builder.isMe);
    const owner = await h.signIn('owner@shop.example');
    const preview = (await owner.get(`/api/bookings/${booking.id}/cancellation`).expect(200)).body;
    // The master's rate puts the firm total above the apprentice range the player was quoted and they
    // have not agreed to it yet, so even a cancellation they ask for refunds the whole deposit.
    expect(preview).toMatchObject({
      depositPaid: booking.deposit,
      refundIfShopCancels: booking.deposit,
      refundIfPlayerAsked: booking.deposit,
    });
    const res = await owner
      .post(`/api/bookings/${booking.id}/cancel-scheduled`)
      .send({ reason: 'Our only master builder is away for a month.', cause: 'shop' })
      .expect(200);
    expect(res.body.state).toBe('cancelled');
    expect(await allocationsOf(booking.id)).toHaveLength(0);
    const deposit = await depositOf(booking.id);
    expect(deposit.refund_id).toMatch(/^re_/);
    expect((await owner.post(`/api/bookings/${booking.id}/cancel-scheduled`).send({ reason: 'twice over', cause: 'shop' })).status).toBe(
      409,
    );
    expect(refundsAtProvider(deposit.payment_intent_id)).toHaveLength(1);
    const mail = await mailOf(booking.id, 'booking-cancelled');
    expect(mail.data).toMatchObject({ refundAmount: booking.deposit, keptAmount: null, calendarSequence: 1 });
    expect((await player.get(`/api/bookings/${booking.id}`).expect(200)).body.state).toBe('cancelled');
  });

  it('a player who does not agree to a firm total above their estimate gets the whole deposit back', async () => {
    const { player, booking } = await paidRequest();
    const owner = await h.signIn('owner@shop.example');
    // Hand the apprentice-level request to the master ($125/h, above the apprentice range the player was quoted).
    await acceptSuggested(
      owner,
      booking.id,
      (s) => s.builder.level === 'master',
      (chosen) => expect(chosen.aboveQuotedRange).toBe(true),
    );
    expect((await player.get(`/api/bookings/${booking.id}`).expect(200)).body.priceConsent).toBe('pending');
    const res = await player.post(`/api/bookings/${booking.id}/price-consent`).send({ accept: false }).expect(200);
    expect(res.body.state).toBe('cancelled');
    const deposit = await depositOf(booking.id);
    expect(deposit.refund_id).toMatch(/^re_/);
    expect(await allocationsOf(booking.id)).toHaveLength(0);
  });
});
