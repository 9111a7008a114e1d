import { demoPriceBook } from '@loomwright/shared';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eventually, payOnHostedPage, startPaymentHarness, type PaymentHarness } from './support/payment-harness';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';

/**
 * A quote priced and paid end to end in six currencies: estimate → booking → checkout → the card
 * on the fake's hosted page → signed webhook → deposit paid. The charged amount is checked against
 * the published tables, written out here by hand (not read from product code):
 *
 * - ISO 4217 List One, "Minor unit": USD 2, EUR 2, JPY 0, HUF 2, IDR 2, KWD 3.
 * - The payment provider's "Supported currencies" page (docs.stripe.com/currencies):
 *   "Minor units in API amounts" (10 USD is 1000); "Zero-decimal currencies" (JPY: ¥500 is 500);
 *   "Three-decimal currencies" (KWD in thousandths, the last digit 0); "Special cases" (HUF in
 *   two-decimal form, whole units only, so divisible by 100).
 *
 * The rig is the one-pedal apprentice board worked by hand in shared/src/estimate/estimate-rig.spec.ts:
 * high end 548.25 (548 in whole-unit currencies, whose 1.25 plug line rounds to 1), a 33 % deposit of
 * 180.9225 before rounding.
 */
const onePedal = countedBoard(1, 'apprentice', 'slate-46');

const cases: Array<{ currency: string; deposit: string; charged: number; hostedPage: string }> = [
  // 180.9225 → 180.92; × 10^2.
  { currency: 'USD', deposit: '180.92', charged: 18092, hostedPage: '$180.92' },
  { currency: 'EUR', deposit: '180.92', charged: 18092, hostedPage: '€180.92' },
  // Lines in whole yen: 548 × 0.33 = 180.84 → 181; × 10^0.
  { currency: 'JPY', deposit: '181', charged: 181, hostedPage: '¥181' },
  // Whole forints (as yen), sent in two-decimal form: 181 × 100.
  { currency: 'HUF', deposit: '181', charged: 18100, hostedPage: 'HUF\u00a0181' },
  // ISO 2 decimals, and the provider takes them: 180.92 × 100 (the runtime's CLDR would drop them).
  { currency: 'IDR', deposit: '180.92', charged: 18092, hostedPage: 'IDR\u00a0180.92' },
  // Thousandths with a last digit of 0: 180.9225 → 180.92 → 180920.
  { currency: 'KWD', deposit: '180.92', charged: 180920, hostedPage: 'KWD\u00a0180.920' },
];

describe('a quote priced and paid in six currencies, checked against ISO 4217 and the provider’s tables', () => {
  let h: PaymentHarness;
  let owner: Awaited<ReturnType<PaymentHarness['signIn']>>;
  let player: Awaited<ReturnType<PaymentHarness['signIn']>>;

  beforeAll(async () => {
    h = await startPaymentHarness();
    owner = await h.signIn('owner@shop.example');
    player = await h.signIn('player@mail.example');
  }, 60_000);
  afterAll(async () => h?.close());

  it.each(cases)('$currency: deposit $deposit is charged as $charged', async ({ currency, deposit, charged, hostedPage }) => {
    const book = { ...demoPriceBook, currency, depositPolicy: { ...demoPriceBook.depositPolicy, percent: '33', minimum: '10' } };
    await owner
      .post('/api/price-book')
      .send({ book, notes: `Prices in ${currency}` })
      .expect(201);

    const estimate = (await player.post('/api/estimates').send(onePedal).expect(200)).body;
    expect(estimate).toMatchObject({ currency, deposit });

    const booking = (await player.post('/api/bookings').send({ configuration: onePedal }).expect(201)).body;
    expect(booking.deposit).toBe(deposit);

    const url = (await player.post(`/api/bookings/${booking.id}/checkout`).send({}).expect(200)).body.url as string;
    const session = [...h.fake.store.sessions.values()].find((s) => s.metadata?.bookingId === booking.id)!;
    expect(session.currency).toBe(currency.toLowerCase());
    expect(session.amount_total).toBe(charged);
    // The player sees on the provider's page exactly the deposit the shop quoted.
    expect(await (await fetch(url)).text()).toContain(hostedPage);

    expect((await payOnHostedPage(url, '4242 4242 4242 4242')).status).toBe(303);
    const detail = await eventually(async () => {
      const res = await player.get(`/api/bookings/${booking.id}`);
      return res.body.state === 'deposit_paid' ? res.body : undefined;
    }, `the ${currency} deposit webhook`);
    expect(detail.depositStatus).toBe('paid');

    const [payment] = await h.t.db.selectFrom('payments').selectAll().where('booking_id', '=', booking.id).execute();
    expect(payment).toMatchObject({ status: 'paid', kind: 'deposit', amount_minor: String(charged) });
    // What the books say was paid is exactly the quoted deposit: nothing rounded away or added.
    expect(Number(payment.amount)).toBe(Number(deposit));
    expect(detail.money.paid).toBe(deposit);
  });

  it('the fake refuses amounts its tables forbid, so a wrong conversion cannot pass unseen', async () => {
    const stripe = new Stripe('sk_test_loomwright_suite', { host: '127.0.0.1', port: h.fake.port, protocol: 'http' });
    const line = (currency: string, unit_amount: number) => ({
      mode: 'payment' as const,
      success_url: 'http://storefront.test/ok',
      line_items: [{ quantity: 1, price_data: { currency, unit_amount, product_data: { name: 'Deposit' } } }],
    });
    // KWD: the last digit must be 0.
    await expect(stripe.checkout.sessions.create(line('kwd', 180923))).rejects.toThrow(/must end in 0/);
    // HUF: whole units only.
    await expect(stripe.checkout.sessions.create(line('huf', 18092))).rejects.toThrow(/divisible by 100/);
    await expect(stripe.checkout.sessions.create(line('huf', 18100))).resolves.toMatchObject({ amount_total: 18100 });
  });
});
