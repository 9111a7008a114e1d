import { sql } from 'kysely';
import Stripe from 'stripe';
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { addDays } from '../src/bench/calendar-days';
import { renderStoredMail } from '../src/mail/templates/render';
import { ReminderClock } from '../src/reminders/reminder-clock';
import { RemindersService } from '../src/reminders/reminders.service';
import { builderId, createBooking, insertFirmQuote, quietMondayWeeksAhead } from './support/bench-fixtures';
import { startPaymentHarness, type PaymentHarness } from './support/payment-harness';
import { sessionCookieFor } from './support/sessions';
import { clearTables, createTestApp, type TestApp } from './support/test-app';

const DAY = 86_400_000;
const HOUR = 3_600_000;

/**
 * Reminders and request expiry, run as two API processes would run them: two Nest applications on
 * one database, each with its own pool and its own RemindersService, sweeping at the same moment.
 * The time is set through the injected ReminderClock, never by waiting. Each reminder must reach
 * the outbox (which is the Mail log) exactly once, and a payment or tracking number that arrives
 * before the due time must mean no reminder at all.
 */
describe('reminders and request expiry, with a controlled clock and two workers', () => {
  let h: PaymentHarness;
  let first: TestApp;
  let second: TestApp;
  let owner: string;
  let player: string;
  let stripe: Stripe;

  beforeAll(async () => {
    h = await startPaymentHarness();
    first = h.t;
    const sharedUrl = process.env.DATABASE_URL!;
    second = await createTestApp({ seed: false, databaseUrlOverride: () => sharedUrl });
    owner = await sessionCookieFor(first, 'owner');
    player = await sessionCookieFor(first, 'customerA');
    stripe = new Stripe('sk_test_loomwright_suite', { host: '127.0.0.1', port: h.fake.port, protocol: 'http' });
  }, 90_000);
  afterAll(async () => {
    await second?.close();
    await h?.close();
  });
  beforeEach(async () => {
    await clearTables(first.db, ['reminders', 'mail_outbox', 'bench_allocations', 'bookings']);
    vi.restoreAllMocks();
  });

  /** Both workers sweep at the same instant, as two replicas whose jobs fire together. */
  async function sweepBoth(at: Date) {
    for (const t of [first, second]) vi.spyOn(t.app.get(ReminderClock), 'now').mockReturnValue(at);
    return Promise.all([first.app.get(RemindersService).runDue(), second.app.get(RemindersService).runDue()]);
  }

  const mails = (bookingId: string, template: string) =>
    first.db
      .selectFrom('mail_outbox')
      .select(['to_address', 'data', 'template'])
      .where('booking_id', '=', bookingId)
      .where('template', '=', template)
      .execute();

  const reminderRows = (bookingId: string) =>
    first.db.selectFrom('reminders').select(['kind', 'event_key']).where('booking_id', '=', bookingId).execute();

  /** A paid request accepted by the demo master builder through the API, so its bench time is real. */
  async function scheduled(benchDate: string) {
    const booking = await createBooking(first.db, { state: 'deposit_paid', laborHours: '4.00' });
    const builder = await builderId(first.db, 'builder@shop.example');
    await first.http().post(`/api/bookings/${booking.id}/accept`).set('Cookie', owner).send({ builderId: builder, benchDate }).expect(200);
    return booking;
  }

  /** The instant it is noon in the demo shop's zone (America/Chicago, UTC−6 in winter) on `day`. */
  const noonInShop = (day: string) => new Date(`${day}T18:00:00Z`);

  it('ship-by day near without tracking: the player and the builder are reminded once; a parcel with tracking is not', async () => {
    const benchDate = quietMondayWeeksAhead(4);
    // Three shop working days before a Monday with no holiday that week or the week before is the
    // Wednesday before it (Fri, Thu, Wed): common practice, no published source; the shop's rule.
    const shipBy = addDays(benchDate, -5);
    const untracked = await scheduled(benchDate);
    const tracked = await scheduled(benchDate);

    // Four days out: the default setting is three days, so nothing yet.
    await sweepBoth(noonInShop(addDays(shipBy, -4)));
    expect(await mails(untracked.id, 'ship-by-reminder')).toHaveLength(0);

    // The player records tracking for one of them before it falls due.
    await first
      .http()
      .post(`/api/bookings/${tracked.id}/shipment`)
      .set('Cookie', player)
      .send({ carrier: 'Parcel Post', tracking: 'PP-0042-77' })
      .expect(201);

    const [a, b] = await sweepBoth(noonInShop(addDays(shipBy, -3)));
    expect(a.shipBy + b.shipBy).toBe(1);
    const toPlayer = await mails(untracked.id, 'ship-by-reminder');
    const toShop = await mails(untracked.id, 'shop-ship-by-reminder');
    expect(toPlayer).toHaveLength(1);
    expect(toPlayer[0]!.to_address).toBe('player@mail.example');
    expect(toPlayer[0]!.data).toMatchObject({ shipBy, benchDate, daysLeft: 3 });
    expect(toShop).toHaveLength(1);
    expect(toShop[0]!.to_address).toBe('builder@shop.example');
    expect(await mails(tracked.id, 'ship-by-reminder')).toHaveLength(0);
    expect(await mails(tracked.id, 'shop-ship-by-reminder')).toHaveLength(0);

    // The next days' sweeps find it sent.
    await sweepBoth(noonInShop(addDays(shipBy, -2)));
    await sweepBoth(noonInShop(shipBy));
    expect(await mails(untracked.id, 'ship-by-reminder')).toHaveLength(1);
    expect(await reminderRows(untracked.id)).toEqual([{ kind: 'shipBy', event_key: `ship-by:${shipBy}` }]);

    // The letter names the day as the shop writes it (en-US, CLDR through Intl: "Wed, Jan 13, 2027").
    const dayWords = new Intl.DateTimeFormat('en-US', {
      weekday: 'short',
      month: 'short',
      day: 'numeric',
      year: 'numeric',
      timeZone: 'UTC',
    }).format(new Date(`${shipBy}T12:00:00Z`));
    const letter = renderStoredMail('ship-by-reminder', toPlayer[0]!.data, {
      name: 'Shop',
      contactEmail: 'bench@shop.example',
      timezone: 'America/Chicago',
      locale: 'en-US',
      currency: 'USD',
    });
    expect(letter.subject).toContain(dayWords);
    expect(letter.subject).toContain('in 3 days');

    // Staff read one history line per recipient; the player's timeline does not carry them.
    const lines = await first.db
      .selectFrom('booking_events')
      .select(['note', 'visibility'])
      .where('booking_id', '=', untracked.id)
      .where('actor_label', '=', 'Loomwright reminders')
      .execute();
    expect(lines).toHaveLength(2);
    expect(lines.every((l) => l.visibility === 'internal')).toBe(true);
  });

  /** A ready build with a firm total of 900.00, its deposit of 150.00 paid, ready since `readyAt`. */
  async function readyBuild(readyAt: Date) {
    const booking = await createBooking(first.db, { state: 'deposit_paid', laborHours: '6.00', deposit: '150.00' });
    await insertFirmQuote(first.db, booking.id, {
      laborHours: '6.00',
      hourlyRate: '100.00',
      total: '900.00',
      deposit: '150.00',
      expiresAt: new Date(readyAt.getTime() + 30 * DAY),
    });
    await first.db.updateTable('bookings').set({ state: 'ready' }).where('id', '=', booking.id).execute();
    await first.db
      .insertInto('booking_events')
      .values({
        booking_id: booking.id,
        from_state: 'testing',
        to_state: 'ready',
        actor_id: null,
        actor_label: 'Test bench',
        created_at: readyAt,
      })
      .execute();
    return booking;
  }

  it('balance unpaid N days after ready: reminded once with the pay link; a balance paid before the due time means no reminder', async () => {
    const readyAt = new Date('2026-11-02T18:00:00Z');
    const unpaid = await readyBuild(readyAt);
    const paidInTime = await readyBuild(readyAt);

    await sweepBoth(new Date(readyAt.getTime() + 6 * DAY));
    expect(await mails(unpaid.id, 'balance-reminder')).toHaveLength(0);

    // The shop takes the whole balance at the counter for one of them before day 7.
    await first
      .http()
      .post(`/api/bookings/${paidInTime.id}/balance/record`)
      .set('Cookie', owner)
      .send({ amount: '750.00', method: 'cash' })
      .expect(200);

    const [a, b] = await sweepBoth(new Date(readyAt.getTime() + 7 * DAY + HOUR));
    expect(a.balanceUnpaid + b.balanceUnpaid).toBe(1);
    const sent = await mails(unpaid.id, 'balance-reminder');
    expect(sent).toHaveLength(1);
    // 900.00 firm − 150.00 deposit = 750.00, worked by hand in whole cents.
    expect(sent[0]!.data).toMatchObject({
      balanceDue: '750.00',
      currency: 'USD',
      readySince: '2026-11-02',
      payUrl: `http://storefront.test/builds/${unpaid.id}`,
    });
    expect(await mails(paidInTime.id, 'balance-reminder')).toHaveLength(0);

    await sweepBoth(new Date(readyAt.getTime() + 9 * DAY));
    expect(await mails(unpaid.id, 'balance-reminder')).toHaveLength(1);
  });

  it('checkout left unfinished for 24 h: the player is reminded once, and not after paying', async () => {
    const openedAt = new Date('2026-11-10T15:00:00Z');
    const left = await createBooking(first.db, { state: 'requested', laborHours: '3.00' });
    const paid = await createBooking(first.db, { state: 'requested', laborHours: '3.00' });
    for (const booking of [left, paid]) {
      await first.db
        .insertInto('payments')
        .values({
          booking_id: booking.id,
          kind: 'deposit',
          amount: '150.00',
          amount_minor: 15000,
          currency: 'USD',
          status: 'pending',
          checkout_session_id: `cs_test_left_${booking.reference}`,
          created_at: openedAt,
        })
        .execute();
    }
    await sweepBoth(new Date(openedAt.getTime() + 23 * HOUR));
    expect(await mails(left.id, 'checkout-reminder')).toHaveLength(0);

    // The other player finishes paying within the day (the webhook's own moves, written directly).
    await first.db
      .updateTable('payments')
      .set({ status: 'paid', paid_at: new Date(openedAt.getTime() + 2 * HOUR) })
      .where('booking_id', '=', paid.id)
      .execute();
    await first.db.updateTable('bookings').set({ state: 'deposit_paid' }).where('id', '=', paid.id).execute();

    const [a, b] = await sweepBoth(new Date(openedAt.getTime() + 25 * HOUR));
    expect(a.checkoutAbandoned + b.checkoutAbandoned).toBe(1);
    const sent = await mails(left.id, 'checkout-reminder');
    expect(sent).toHaveLength(1);
    expect(sent[0]!.data).toMatchObject({ kind: 'deposit', amount: '150.00', currency: 'USD' });
    expect(await mails(paid.id, 'checkout-reminder')).toHaveLength(0);

    await sweepBoth(new Date(openedAt.getTime() + 49 * HOUR));
    expect(await mails(left.id, 'checkout-reminder')).toHaveLength(1);
  });

  it('an unpaid request expires once through the transition path: history, one mail, its checkout closed, bench untouched', async () => {
    const requestedAt = new Date('2026-10-01T18:00:00Z');
    const stale = await createBooking(first.db, { state: 'requested', laborHours: '3.00' });
    const settling = await createBooking(first.db, { state: 'requested', laborHours: '3.00' });
    await first.db.updateTable('bookings').set({ created_at: requestedAt }).where('id', 'in', [stale.id, settling.id]).execute();
    // The player opened the deposit checkout (the payment fake holds the session) and left it open.
    const checkout = await first.http().post(`/api/bookings/${stale.id}/checkout`).set('Cookie', player).send({}).expect(200);
    const sessionId = (
      await first.db.selectFrom('payments').select('checkout_session_id').where('booking_id', '=', stale.id).executeTakeFirstOrThrow()
    ).checkout_session_id!;
    expect(checkout.body.url).toBeTruthy();
    // A bank debit for the other one is still settling: money on its way keeps it open.
    await first.db
      .insertInto('payments')
      .values({
        booking_id: settling.id,
        kind: 'deposit',
        amount: '150.00',
        amount_minor: 15000,
        currency: 'USD',
        status: 'processing',
        checkout_session_id: 'cs_test_settling',
        created_at: requestedAt,
      })
      .execute();
    // Another build holds bench time; expiry must neither take nor give any.
    const holding = await scheduled(quietMondayWeeksAhead(4));
    const benchBefore = await first.db.selectFrom('bench_allocations').select(['booking_id', 'day', 'hours']).orderBy('day').execute();
    expect(benchBefore.length).toBeGreaterThan(0);

    await sweepBoth(new Date(requestedAt.getTime() + 29 * DAY));
    expect((await first.db.selectFrom('bookings').select('state').where('id', '=', stale.id).executeTakeFirstOrThrow()).state).toBe(
      'requested',
    );

    const [a, b] = await sweepBoth(new Date(requestedAt.getTime() + 30 * DAY + HOUR));
    expect(a.requestExpiry + b.requestExpiry).toBe(1);
    const row = await first.db
      .selectFrom('bookings')
      .select(['state', 'cancel_reason'])
      .where('id', '=', stale.id)
      .executeTakeFirstOrThrow();
    expect(row.state).toBe('cancelled');
    expect(row.cancel_reason).toMatch(/not paid within 30 days/);
    const moves = await first.db
      .selectFrom('booking_events')
      .select(['from_state', 'to_state', 'visibility', 'actor_label'])
      .where('booking_id', '=', stale.id)
      .where('to_state', '=', 'cancelled')
      .execute();
    expect(moves).toEqual([{ from_state: 'requested', to_state: 'cancelled', visibility: 'player', actor_label: 'Loomwright reminders' }]);
    expect(await mails(stale.id, 'request-expired')).toHaveLength(1);
    // Expired before its unfinished-checkout reminder: the player gets one letter, not two.
    expect(await mails(stale.id, 'checkout-reminder')).toHaveLength(0);
    // The provider's session is closed, so nothing can be paid on the expired request.
    expect((await stripe.checkout.sessions.retrieve(sessionId)).status).toBe('expired');
    expect(
      (await first.db.selectFrom('payments').select('status').where('booking_id', '=', stale.id).executeTakeFirstOrThrow()).status,
    ).toBe('expired');

    expect((await first.db.selectFrom('bookings').select('state').where('id', '=', settling.id).executeTakeFirstOrThrow()).state).toBe(
      'requested',
    );
    expect(await mails(settling.id, 'request-expired')).toHaveLength(0);
    expect(await first.db.selectFrom('bench_allocations').select(['booking_id', 'day', 'hours']).orderBy('day').execute()).toEqual(
      benchBefore,
    );
    expect((await first.db.selectFrom('bookings').select('state').where('id', '=', holding.id).executeTakeFirstOrThrow()).state).toBe(
      'scheduled',
    );

    await sweepBoth(new Date(requestedAt.getTime() + 40 * DAY));
    expect(await mails(stale.id, 'request-expired')).toHaveLength(1);
    expect(
      await first.db
        .selectFrom('booking_events')
        .select('id')
        .where('booking_id', '=', stale.id)
        .where('to_state', '=', 'cancelled')
        .execute(),
    ).toHaveLength(1);

    // Every reminder mail is in the Mail log the owner reads.
    const log = await first.http().get('/api/mail').query({ q: 'player@mail.example', pageSize: 100 }).set('Cookie', owner).expect(200);
    expect(log.body.items.map((m: { template: string }) => m.template)).toContain('request-expired');
  });

  it('settings: read by staff, changed by the owner, refused in words, and followed by the next sweep', async () => {
    const read = await first.http().get('/api/settings/reminders').set('Cookie', owner).expect(200);
    expect(read.body).toEqual({
      shipBy: { enabled: true, daysBefore: 3 },
      balanceUnpaid: { enabled: true, daysAfterReady: 7 },
      checkoutAbandoned: { enabled: true, hoursAfter: 24 },
      requestExpiry: { enabled: true, daysUnpaid: 30 },
    });
    const bad = await first
      .http()
      .patch('/api/settings/reminders')
      .set('Cookie', owner)
      .send({ shipBy: { daysBefore: 0 } })
      .expect(400);
    expect(bad.body.code).toBe('validation_failed');
    expect(bad.body.message).toBe('Days before the ship-by day must be a whole number from 1 to 30 days');
    const empty = await first.http().patch('/api/settings/reminders').set('Cookie', owner).send({ balanceUnpaid: {} }).expect(400);
    expect(empty.body.message).toMatch(/Say what to change for the balance reminder/);
    const builder = await sessionCookieFor(first, 'builder');
    await first
      .http()
      .patch('/api/settings/reminders')
      .set('Cookie', builder)
      .send({ requestExpiry: { enabled: false } })
      .expect(403);

    const changed = await first
      .http()
      .patch('/api/settings/reminders')
      .set('Cookie', owner)
      .send({ requestExpiry: { enabled: false }, balanceUnpaid: { daysAfterReady: 2 } })
      .expect(200);
    expect(changed.body.requestExpiry).toEqual({ enabled: false, daysUnpaid: 30 });
    expect(changed.body.balanceUnpaid).toEqual({ enabled: true, daysAfterReady: 2 });

    // Off means off: a request 60 days old stays open; the balance reminder follows its new two days.
    const requestedAt = new Date('2026-09-01T18:00:00Z');
    const old = await createBooking(first.db, { state: 'requested', laborHours: '3.00' });
    await first.db.updateTable('bookings').set({ created_at: requestedAt }).where('id', '=', old.id).execute();
    const readyAt = new Date('2026-11-02T18:00:00Z');
    const ready = await readyBuild(readyAt);
    await sweepBoth(new Date(readyAt.getTime() + 2 * DAY + HOUR));
    expect((await first.db.selectFrom('bookings').select('state').where('id', '=', old.id).executeTakeFirstOrThrow()).state).toBe(
      'requested',
    );
    expect(await mails(ready.id, 'balance-reminder')).toHaveLength(1);

    await first
      .http()
      .patch('/api/settings/reminders')
      .set('Cookie', owner)
      .send({ requestExpiry: { enabled: true }, balanceUnpaid: { daysAfterReady: 7 } })
      .expect(200);
  });

  it('runs from the pg-boss queue: a sweep job sent through the queue is worked by a worker and sends once', async () => {
    const { RemindersWorker, REMINDERS_QUEUE } = await import('../src/reminders/reminders-worker.service');
    const openedAt = new Date(Date.now() - 30 * HOUR);
    const left = await createBooking(first.db, { state: 'requested', laborHours: '3.00' });
    await first.db
      .insertInto('payments')
      .values({
        booking_id: left.id,
        kind: 'deposit',
        amount: '150.00',
        amount_minor: 15000,
        currency: 'USD',
        status: 'pending',
        checkout_session_id: 'cs_test_queue',
        created_at: openedAt,
      })
      .execute();
    const workers = [first.app.get(RemindersWorker), second.app.get(RemindersWorker)];
    try {
      await Promise.all(workers.map((w) => w.start()));
      expect(REMINDERS_QUEUE).toBe('reminders-sweep');
      await Promise.all(workers.map((w) => w.sweepSoon()));
      const end = Date.now() + 20_000;
      while ((await mails(left.id, 'checkout-reminder')).length === 0 && Date.now() < end) await new Promise((r) => setTimeout(r, 200));
      // Give any second job time to run as well, then count.
      await new Promise((r) => setTimeout(r, 1500));
      expect(await mails(left.id, 'checkout-reminder')).toHaveLength(1);
      const jobs = await sql<{
        n: string;
      }>`select count(*)::text as n from pgboss.job where name = ${REMINDERS_QUEUE} and state = 'completed'`.execute(first.db);
      expect(Number(jobs.rows[0]!.n)).toBeGreaterThanOrEqual(1);
    } finally {
      await Promise.all(workers.map((w) => w.stop()));
    }
  }, 60_000);
});
