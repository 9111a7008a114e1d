import { readdir } from 'node:fs/promises';
import { crc32, deflateSync } from 'node:zlib';
import Decimal from 'decimal.js';
import sharp from 'sharp';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eventually, payOnHostedPage, startPaymentHarness, WEBHOOK_SECRET, type PaymentHarness } from './support/payment-harness';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';

// A plain serial board from the demo price book: 8 compact pedals, journeyman rate.
const serialBoard = countedBoard(8);

/**
 * Test card numbers and their outcomes: Stripe testing documentation, "Test card numbers"
 * (4242 4242 4242 4242 succeeds) and "Declined payments" (4000 0000 0000 0002 generic decline,
 * 4000 0000 0000 9995 insufficient funds). The decline messages are the provider's wording as
 * remembered (from memory), which the fake repeats.
 */
const SUCCESS_CARD = '4242 4242 4242 4242';
const GENERIC_DECLINE = '4000 0000 0000 0002';
const INSUFFICIENT_FUNDS = '4000 0000 0000 9995';

/** A 1×1 PNG built from the PNG specification (W3C PNG, 2nd ed., §5.2 signature, §11.2 IHDR/IDAT/IEND). */
function tinyPng(): Buffer {
  const chunk = (type: string, data: Buffer) => {
    const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const crc = Buffer.alloc(4);
    crc.writeUInt32BE(crc32(body));
    return Buffer.concat([len, body, crc]);
  };
  const ihdr = Buffer.from([0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0]);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', deflateSync(Buffer.from([0, 200, 120, 60]))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

describe('booking requests, deposit checkout and webhooks against the local payment fake', () => {
  let h: PaymentHarness;
  let player: Awaited<ReturnType<PaymentHarness['signIn']>>;
  let other: Awaited<ReturnType<PaymentHarness['signIn']>>;
  const stripe = new Stripe('sk_test_signer');

  beforeAll(async () => {
    h = await startPaymentHarness();
    player = await h.signIn('player@mail.example');
    other = await h.signIn('cass@mail.example');
  }, 60_000);
  afterAll(async () => h?.close());

  async function requestBuild(agent = player) {
    const res = await agent.post('/api/bookings').send({ configuration: serialBoard, notes: 'Tuner first, please.' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body as { id: string; reference: string; deposit: string; state: string; quote: { priceBookVersion: number } };
  }

  async function checkoutUrl(bookingId: string, agent = player) {
    const res = await agent.post(`/api/bookings/${bookingId}/checkout`).send({});
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return res.body.url as string;
  }

  const paymentsOf = (bookingId: string) => h.t.db.selectFrom('payments').selectAll().where('booking_id', '=', bookingId).execute();

  it('re-prices the request on the server and keeps a quote snapshot with its price-book version', async () => {
    const estimate = await player.post('/api/estimates').send(serialBoard).expect(200);
    const booking = await requestBuild();
    expect(booking.reference).toMatch(/^LW-\d{4,}$/);
    expect(booking.state).toBe('requested');
    expect(booking.deposit).toBe(estimate.body.deposit);
    expect(booking.quote.priceBookVersion).toBe(estimate.body.priceBookVersion);
    const quote = await h.t.db.selectFrom('quotes').selectAll().where('booking_id', '=', booking.id).executeTakeFirstOrThrow();
    expect(quote.kind).toBe('estimate');
    expect(quote.total_high).toBe(estimate.body.totalHigh);
    expect(quote.expires_at.getTime()).toBeGreaterThan(Date.now() + 29 * 24 * 3600 * 1000);
    const mail = await h.t.db.selectFrom('mail_outbox').selectAll().where('booking_id', '=', booking.id).execute();
    expect(mail.map((m) => m.template)).toEqual(['booking-requested']);
  });

  it('refuses a bad configuration with a 400 naming the field, and staff cannot request builds', async () => {
    const bad = await player
      .post('/api/bookings')
      .send({ configuration: { ...serialBoard, level: 'wizard' } })
      .expect(400);
    expect(JSON.stringify(bad.body.message)).toContain('level');
    const builder = await h.signIn('builder@shop.example');
    await builder.post('/api/bookings').send({ configuration: serialBoard }).expect(403);
  });

  it('takes a paid deposit end to end: checkout, card on the hosted page, signed webhook, deposit_paid', async () => {
    const booking = await requestBuild();
    const url = await checkoutUrl(booking.id);
    expect(url.startsWith(h.fake.url)).toBe(true);
    const session = [...h.fake.store.sessions.values()].find((s) => s.metadata?.bookingId === booking.id)!;
    // ISO 4217: USD has a minor unit of 2 decimal places, so $X.YZ is XYZ cents.
    expect(session.amount_total).toBe(new Decimal(booking.deposit).times(100).toNumber());
    expect(session.success_url).toBe(`http://storefront.test/checkout/return?booking=${booking.id}&result=paid`);
    expect(session.cancel_url).toBe(`http://storefront.test/checkout/return?booking=${booking.id}&result=cancelled`);

    const page = await fetch(url);
    expect(await page.text()).toContain('Card number');
    // Until the provider says so, nothing is paid, whatever the browser does.
    expect((await player.get(`/api/bookings/${booking.id}`).expect(200)).body.depositStatus).toBe('pending');

    const paid = await payOnHostedPage(url, SUCCESS_CARD);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(session.success_url);

    const detail = await eventually(async () => {
      const res = await player.get(`/api/bookings/${booking.id}`);
      return res.body.state === 'deposit_paid' ? res.body : undefined;
    }, 'the deposit webhook');
    expect(detail.depositStatus).toBe('paid');
    expect(detail.events.map((e: { toState: string }) => e.toState)).toEqual(['requested', 'deposit_paid']);
    expect(detail.events[1].actor).toBe('Payment provider');
    const rows = await paymentsOf(booking.id);
    expect(rows).toHaveLength(1);
    expect(rows[0]).toMatchObject({ status: 'paid', kind: 'deposit', amount: booking.deposit, amount_minor: String(session.amount_total) });
    expect(rows[0].payment_intent_id).toBe(h.fake.store.sessions.get(session.id)!.payment_intent);
    const mail = await h.t.db
      .selectFrom('mail_outbox')
      .select(['template', 'to_address'])
      .where('booking_id', '=', booking.id)
      .orderBy('created_at')
      .execute();
    expect(mail).toEqual(
      expect.arrayContaining([
        { template: 'deposit-received', to_address: 'player@mail.example' },
        { template: 'shop-new-paid-request', to_address: expect.stringMatching(/@shop\.example$/) },
      ]),
    );
    // A second checkout for a paid deposit is refused in words.
    const again = await player.post(`/api/bookings/${booking.id}/checkout`).send({}).expect(409);
    expect(again.body.message).toMatch(/nothing is due|already paid/);
  });

  it('leaves a declined card unpaid with the reason, lets the player try again on the same session', async () => {
    const booking = await requestBuild();
    const url = await checkoutUrl(booking.id);
    const declined = await payOnHostedPage(url, GENERIC_DECLINE);
    expect(declined.status).toBe(402);
    expect(await declined.text()).toContain('Your card was declined.');
    await eventually(async () => (await paymentsOf(booking.id))[0]?.status === 'failed', 'the failure webhook');
    let detail = (await player.get(`/api/bookings/${booking.id}`).expect(200)).body;
    expect(detail.state).toBe('requested');
    expect(detail.depositStatus).toBe('unpaid');
    expect(detail.payments[0]).toMatchObject({ status: 'failed', failureMessage: 'Your card was declined.' });

    const poor = await payOnHostedPage(url, INSUFFICIENT_FUNDS);
    expect(await poor.text()).toContain('Your card has insufficient funds.');
    await eventually(
      async () => (await paymentsOf(booking.id))[0]?.failure_message === 'Your card has insufficient funds.',
      'the second failure webhook',
    );
    // Asking again returns the same open session: one checkout, never two chances to pay twice.
    expect(await checkoutUrl(booking.id)).toBe(url);
    expect((await payOnHostedPage(url, SUCCESS_CARD)).status).toBe(303);
    detail = await eventually(async () => {
      const res = await player.get(`/api/bookings/${booking.id}`);
      return res.body.state === 'deposit_paid' ? res.body : undefined;
    }, 'the deposit webhook after retrying');
    expect(await paymentsOf(booking.id)).toHaveLength(1);
    expect(detail.payments[0]).toMatchObject({ status: 'paid', failureMessage: null });
  });

  it('creates one session for 20 concurrent checkout calls', async () => {
    const booking = await requestBuild();
    const answers = await Promise.all(Array.from({ length: 20 }, () => player.post(`/api/bookings/${booking.id}/checkout`).send({})));
    expect(answers.map((a) => a.status)).toEqual(Array(20).fill(200));
    expect(new Set(answers.map((a) => a.body.url)).size).toBe(1);
    expect([...h.fake.store.sessions.values()].filter((s) => s.metadata?.bookingId === booking.id)).toHaveLength(1);
    expect(await paymentsOf(booking.id)).toHaveLength(1);
  });

  it('records one payment when the same webhook arrives 20 times at once', async () => {
    const booking = await requestBuild();
    const url = await checkoutUrl(booking.id);
    const sentBefore = h.fake.events.length;
    h.fake.webhooks.url = undefined; // hold the fake's own delivery: this test delivers by hand
    try {
      expect((await payOnHostedPage(url, SUCCESS_CARD)).status).toBe(303);
    } finally {
      h.fake.webhooks.url = `${h.apiUrl}/api/payments/webhook`;
    }
    const event = h.fake.events.slice(sentBefore).find((e) => e.type === 'checkout.session.completed')!;
    const payload = JSON.stringify(event);
    const deliveries = await Promise.all(
      Array.from({ length: 20 }, () =>
        fetch(`${h.apiUrl}/api/payments/webhook`, {
          method: 'POST',
          headers: {
            'content-type': 'application/json',
            'stripe-signature': stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET }),
          },
          body: payload,
        }).then(async (r) => ({ status: r.status, body: (await r.json()) as { duplicate: boolean } })),
      ),
    );
    expect(deliveries.map((d) => d.status)).toEqual(Array(20).fill(200));
    expect(deliveries.filter((d) => !d.body.duplicate)).toHaveLength(1);
    const rows = await paymentsOf(booking.id);
    expect(rows.filter((r) => r.status === 'paid')).toHaveLength(1);
    const events = await h.t.db
      .selectFrom('booking_events')
      .selectAll()
      .where('booking_id', '=', booking.id)
      .where('to_state', '=', 'deposit_paid')
      .execute();
    expect(events).toHaveLength(1);
    const mails = await h.t.db
      .selectFrom('mail_outbox')
      .selectAll()
      .where('booking_id', '=', booking.id)
      .where('template', '=', 'deposit-received')
      .execute();
    expect(mails).toHaveLength(1);
    const recorded = await h.t.db.selectFrom('payment_events').selectAll().where('event_id', '=', event.id).execute();
    expect(recorded).toHaveLength(1);
  });

  it('refuses tampered, wrongly keyed, stale and unsigned webhooks with 400 and changes nothing', async () => {
    const booking = await requestBuild();
    const url = await checkoutUrl(booking.id);
    const sentBefore = h.fake.events.length;
    h.fake.webhooks.url = undefined;
    try {
      await payOnHostedPage(url, SUCCESS_CARD);
    } finally {
      h.fake.webhooks.url = `${h.apiUrl}/api/payments/webhook`;
    }
    const event = h.fake.events.slice(sentBefore).find((e) => e.type === 'checkout.session.completed')!;
    const payload = JSON.stringify(event);
    const post = (body: string, signature?: string) =>
      h.t
        .http()
        .post('/api/payments/webhook')
        .set('content-type', 'application/json')
        .set(signature ? { 'stripe-signature': signature } : {})
        .send(body);

    const signed = stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET });
    const tampered = payload.replace(`"amount_total":${event.data.object.amount_total}`, '"amount_total":1');
    expect(tampered).not.toBe(payload);
    const answers = [
      await post(tampered, signed),
      await post(payload, stripe.webhooks.generateTestHeaderString({ payload, secret: 'whsec_someone_else' })),
      // The SDK's default tolerance is 300 s (Stripe webhooks documentation, "replay attacks").
      await post(
        payload,
        stripe.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET, timestamp: Math.floor(Date.now() / 1000) - 3600 }),
      ),
      await post(payload),
    ];
    expect(answers.map((a) => a.status)).toEqual([400, 400, 400, 400]);
    expect(answers[0].body.message).toMatch(/signature/i);
    expect(answers[3].body.message).toMatch(/Stripe-Signature header is missing/);
    expect(await h.t.db.selectFrom('payment_events').selectAll().where('event_id', '=', event.id).execute()).toHaveLength(0);
    expect((await paymentsOf(booking.id))[0].status).toBe('pending');
    expect((await player.get(`/api/bookings/${booking.id}`)).body.state).toBe('requested');
  });

  it("keeps one player's bookings, photos and payments from another", async () => {
    const booking = await requestBuild();
    const photo = await player
      .post(`/api/bookings/${booking.id}/photos`)
      .attach('file', tinyPng(), { filename: 'board.png', contentType: 'image/png' });
    expect(photo.status, JSON.stringify(photo.body)).toBe(201);
    await checkoutUrl(booking.id);

    await other.get(`/api/bookings/${booking.id}`).expect(404);
    await other.get(`/api/bookings/${booking.id}/photos/${photo.body.id}`).expect(404);
    await other.post(`/api/bookings/${booking.id}/photos`).attach('file', tinyPng(), 'mine.png').expect(404);
    await other.post(`/api/bookings/${booking.id}/checkout`).send({}).expect(404);
    await other.post(`/api/bookings/${booking.id}/cancel`).send({}).expect(404);
    await other.post(`/api/bookings/${booking.id}/refund`).send({ reason: 'mine now' }).expect(403);
    const list = await other.get('/api/bookings?pageSize=100').expect(200);
    expect(list.body.items.map((b: { id: string }) => b.id)).not.toContain(booking.id);
    await h.t.http().get(`/api/bookings/${booking.id}`).expect(401);

    const own = await player.get(`/api/bookings/${booking.id}/photos/${photo.body.id}`).expect(200);
    expect(own.headers['content-type']).toBe('image/png');
    // Re-encoded on upload (photo-privacy.spec.ts), so the same pixel rather than the same bytes.
    const { data, info } = await sharp(own.body as Buffer)
      .raw()
      .toBuffer({ resolveWithObject: true });
    expect([info.width, info.height, ...data.subarray(0, 3)]).toEqual([1, 1, 200, 120, 60]);
    const owner = await h.signIn('owner@shop.example');
    await owner.get(`/api/bookings/${booking.id}/photos/${photo.body.id}`).expect(200);
    const staffList = await owner.get(`/api/bookings?q=${booking.reference}`).expect(200);
    expect(staffList.body.items.map((b: { id: string }) => b.id)).toEqual([booking.id]);
  });

  it('refuses a non-image or too-large upload in words and stores nothing', async () => {
    const booking = await requestBuild();
    const filesBefore = await readdir(h.uploadsDir, { recursive: true });
    // A text file that claims to be a JPEG by name and header: judged by its bytes, it is not.
    const fake = await player
      .post(`/api/bookings/${booking.id}/photos`)
      .attach('file', Buffer.from('just some words, not a photo'), { filename: 'pedals.jpg', contentType: 'image/jpeg' });
    expect(fake.status).toBe(400);
    expect(fake.body.message).toMatch(/JPEG, PNG or WebP/);
    // A PDF is a known type, but not an image.
    const pdf = await player
      .post(`/api/bookings/${booking.id}/photos`)
      .attach('file', Buffer.from('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n1 0 obj\n<<>>\nendobj\n', 'latin1'), 'scan.jpg');
    expect(pdf.status).toBe(400);
    expect(pdf.body.message).toMatch(/application\/pdf/);
    const big = Buffer.concat([tinyPng(), Buffer.alloc(8 * 1024 * 1024)]);
    const tooLarge = await player.post(`/api/bookings/${booking.id}/photos`).attach('file', big, 'huge.png');
    expect(tooLarge.status).toBe(413);
    expect(tooLarge.body.message).toMatch(/larger than 8 MB/);
    const missing = await player.post(`/api/bookings/${booking.id}/photos`).field('caption', 'no file').expect(400);
    expect(missing.body.message).toMatch(/file/);
    expect(await h.t.db.selectFrom('photos').selectAll().where('booking_id', '=', booking.id).execute()).toHaveLength(0);
    expect(await readdir(h.uploadsDir, { recursive: true })).toEqual(filesBefore);
  });

  it('holds at most 8 photos per booking', async () => {
    const booking = await requestBuild();
    const answers = await Promise.all(
      Array.from({ length: 10 }, (_, i) => player.post(`/api/bookings/${booking.id}/photos`).attach('file', tinyPng(), `p${i}.png`)),
    );
    expect(answers.filter((a) => a.status === 201)).toHaveLength(8);
    expect(answers.filter((a) => a.status === 409).map((a) => a.body.message)[0]).toMatch(/8 photos/);
    expect(await h.t.db.selectFrom('photos').selectAll().where('booking_id', '=', booking.id).execute()).toHaveLength(8);
    // Each photo is kept re-encoded, with its list-sized copy beside it.
    expect((await readdir(`${h.uploadsDir}/${booking.id}`)).length).toBe(16);
  });

  it('cancels a paid request with a refund through the provider, once', async () => {
    const booking = await requestBuild();
    await payOnHostedPage(await checkoutUrl(booking.id), SUCCESS_CARD);
    await eventually(async () => (await paymentsOf(booking.id))[0]?.status === 'paid', 'the deposit');
    const res = await player.post(`/api/bookings/${booking.id}/cancel`).send({ reason: 'Touring plans changed.' }).expect(200);
    expect(res.body).toMatchObject({ state: 'cancelled', cancelReason: 'Touring plans changed.', depositStatus: 'refunded' });
    const [row] = await paymentsOf(booking.id);
    expect(row.status).toBe('refunded');
    const charge = [...h.fake.store.charges.values()].find((c) => c.payment_intent === row.payment_intent_id)!;
    expect(charge).toMatchObject({ refunded: true, amount_refunded: Number(row.amount_minor) });
    await eventually(
      async () => (await h.t.db.selectFrom('payment_events').select('event_id').where('type', '=', 'charge.refunded').execute()).length > 0,
      'the refund webhook',
    );
    const mails = await h.t.db
      .selectFrom('mail_outbox')
      .select('template')
      .where('booking_id', '=', booking.id)
      .where('template', '=', 'deposit-refunded')
      .execute();
    expect(mails).toHaveLength(1);
    // Cancelling twice is a conflict in words, and nothing is refunded again.
    const again = await player.post(`/api/bookings/${booking.id}/cancel`).send({}).expect(409);
    expect(again.body.message).toMatch(/cannot become/);
    expect(h.fake.store.refunds.size).toBeGreaterThan(0);
    expect([...h.fake.store.refunds.values()].filter((r) => r.payment_intent === row.payment_intent_id)).toHaveLength(1);
  });

  it('lets the owner refund a paid deposit, and records the shipment a player sends', async () => {
    const booking = await requestBuild();
    await payOnHostedPage(await checkoutUrl(booking.id), SUCCESS_CARD);
    await eventually(async () => (await paymentsOf(booking.id))[0]?.status === 'paid', 'the deposit');
    const shipped = await player
      .post(`/api/bookings/${booking.id}/shipment`)
      .send({ carrier: 'Parcel post', tracking: 'PX-4417-0093' })
      .expect(201);
    expect(shipped.body.inbound).toEqual({ carrier: 'Parcel post', tracking: 'PX-4417-0093' });
    const blank = await player.post(`/api/bookings/${booking.id}/shipment`).send({ carrier: '', tracking: 'x' }).expect(400);
    expect(blank.body.details).toEqual(['Say who carries the parcel']);
    expect(blank.body.issues).toEqual([{ path: 'carrier', message: 'Say who carries the parcel' }]);
    const owner = await h.signIn('owner@shop.example');
    await owner.post(`/api/bookings/${booking.id}/refund`).send({}).expect(400);
    const res = await owner.post(`/api/bookings/${booking.id}/refund`).send({ reason: 'Shop closed for a month.' }).expect(200);
    expect(res.body.state).toBe('refunded');
    expect(res.body.payments[0].status).toBe('refunded');
    const twice = await owner.post(`/api/bookings/${booking.id}/refund`).send({ reason: 'again' }).expect(409);
    expect(twice.body.message).toMatch(/cannot become|no paid deposit/);
  });

  it('lists with server-side filters and pagination, and answers bad filters with 400 in words', async () => {
    const list = await player.get('/api/bookings?page=1&pageSize=2&sort=reference&order=asc').expect(200);
    expect(list.body.items).toHaveLength(2);
    expect(list.body.total).toBeGreaterThan(2);
    expect(list.body.items[0].reference < list.body.items[1].reference).toBe(true);
    const paid = await player.get('/api/bookings?deposit=paid&pageSize=100').expect(200);
    expect(paid.body.items.length).toBeGreaterThan(0);
    expect(paid.body.items.every((b: { depositStatus: string }) => b.depositStatus === 'paid')).toBe(true);
    const bad = await player.get('/api/bookings?pageSize=1000&state=lost').expect(400);
    expect(JSON.stringify(bad.body.message)).toMatch(/Rows per page can be at most 100|Status must be one of/);
    await player.get('/api/bookings/not-a-uuid').expect(400);
  });
});
