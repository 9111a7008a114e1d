import Decimal from 'decimal.js';
import { sql } from 'kysely';
import request from 'supertest';
import type { INestApplication } from '@nestjs/common';
import type { BuilderLevel } from '@loomwright/shared';
import { addDays } from '../../src/bench/calendar-days';
import { publicHolidaysBetween } from '../../src/bench/public-holidays';
import type { Database } from '../../src/database/database';
import { clearTables, createTestApp, type TestApp, type TestAppOptions } from './test-app';

export const DEMO_PASSWORD = 'demo-pass-2026';

export async function signIn(app: INestApplication, email: string) {
  const agent = request.agent(app.getHttpServer());
  await agent.post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD }).expect(200);
  return agent;
}

export type Agent = Awaited<ReturnType<typeof signIn>>;

/** What a bench test writes: a booking and everything hung on it, plus the shop's closures. */
export const BENCH_TABLES = [
  'bench_allocations',
  'layout_approvals',
  'booking_events',
  'mail_outbox',
  'payments',
  'time_entries',
  'intake_items',
  'booking_extras',
  'quotes',
  'bookings',
  'shop_closures',
];

/** Empties the bench tables (and any `more`) between tests. */
export const clearBench = (db: Database, more: string[] = []) => clearTables(db, [...BENCH_TABLES, ...more]);

/**
 * The demo shop with its cast signed in (the owner, the master builder, the apprentice and two
 * players, each an agent keeping their own cookies), the two builders' ids and a quiet Monday
 * three weeks ahead to schedule on.
 */
export async function openBenchShop(options: TestAppOptions = {}) {
  const t: TestApp = await createTestApp(options);
  const [owner, master, junior, player, cass] = await Promise.all(
    ['owner@shop.example', 'builder@shop.example', 'junior@shop.example', 'player@mail.example', 'cass@mail.example'].map((e) =>
      signIn(t.app, e),
    ),
  );
  const [masterId, juniorId] = await Promise.all([builderId(t.db, 'builder@shop.example'), builderId(t.db, 'junior@shop.example')]);
  return { t, owner, master, junior, player, cass, masterId, juniorId, monday: quietMondayWeeksAhead(3) };
}

/** A price-book version for quotes to point at (the engine's seed owns the real book). */
export async function ensurePriceBook(db: Database) {
  await db
    .insertInto('price_book_versions')
    .values({ version: 1, currency: 'USD', book: JSON.stringify({ currency: 'USD' }) as never, notes: 'test book' })
    .onConflict((oc) => oc.column('version').doNothing())
    .execute();
}

export async function builderId(db: Database, email: string) {
  const row = await db
    .selectFrom('builders')
    .innerJoin('users', 'users.id', 'builders.user_id')
    .select('builders.id')
    .where('users.email', '=', email)
    .executeTakeFirstOrThrow();
  return row.id;
}

/**
 * A request with its estimate quote, in the given state; 'deposit_paid' also gets its paid deposit.
 * The estimate JSON carries the fields the bench reads: laborHours, materialsTotal, minimumLevel.
 */
export async function createBooking(
  db: Database,
  opts: {
    customerEmail?: string;
    state?: 'requested' | 'deposit_paid';
    laborHours: string;
    materialsTotal?: string;
    deposit?: string;
    minimumLevel?: BuilderLevel;
  },
) {
  await ensurePriceBook(db);
  const customer = await db
    .selectFrom('users')
    .select('id')
    .where('email', '=', opts.customerEmail ?? 'player@mail.example')
    .executeTakeFirstOrThrow();
  const state = opts.state ?? 'deposit_paid';
  const configuration = {
    surfaceId: 'surface-610',
    caseId: 'case-hard',
    routing: { mode: 'serial' },
    pedals: [
      { name: 'Fuzz', kind: 'compact', powered: true, inLoop: false },
      { name: 'Analog delay', kind: 'compact', powered: true, inLoop: false },
    ],
    functions: [],
    level: opts.minimumLevel ?? 'apprentice',
  };
  const booking = await db
    .insertInto('bookings')
    .values({
      reference: sql<string>`'LW-' || nextval('booking_reference_seq')`,
      customer_id: customer.id,
      state,
      configuration: JSON.stringify(configuration) as never,
    })
    .returning(['id', 'reference'])
    .executeTakeFirstOrThrow();
  const materials = opts.materialsTotal ?? '300.00';
  const deposit = opts.deposit ?? '150.00';
  const estimate = {
    priceBookVersion: 1,
    currency: 'USD',
    level: opts.minimumLevel ?? 'apprentice',
    lines: [],
    laborHours: opts.laborHours,
    materialsTotal: materials,
    laborLow: '0',
    laborHigh: '0',
    totalLow: materials,
    totalHigh: materials,
    deposit,
    rate: { low: '40.00', high: '50.00' },
    minimumLevel: opts.minimumLevel ?? 'apprentice',
    minimumLevelReasons: [],
    notes: [],
  };
  await db
    .insertInto('quotes')
    .values({
      booking_id: booking.id,
      kind: 'estimate',
      price_book_version: 1,
      currency: 'USD',
      configuration: JSON.stringify(configuration) as never,
      estimate: JSON.stringify(estimate) as never,
      labor_hours: opts.laborHours,
      total_low: materials,
      total_high: materials,
      deposit,
      expires_at: new Date(Date.now() + 30 * 86_400_000),
    })
    .execute();
  if (state === 'deposit_paid') {
    await db
      .insertInto('payments')
      .values({
        booking_id: booking.id,
        kind: 'deposit',
        amount: deposit,
        amount_minor: Math.round(Number(deposit) * 100),
        currency: 'USD',
        status: 'paid',
        paid_at: new Date(),
      })
      .execute();
  }
  return booking;
}

/** A Monday at least `weeksAhead` weeks from now; neither its week nor the week before has a US public holiday (date-holidays). */
export function quietMondayWeeksAhead(weeksAhead: number): string {
  const d = new Date();
  d.setUTCDate(d.getUTCDate() + weeksAhead * 7);
  while (d.getUTCDay() !== 1) d.setUTCDate(d.getUTCDate() + 1);
  for (;;) {
    const monday = d.toISOString().slice(0, 10);
    if (publicHolidaysBetween('US', addDays(monday, -7), addDays(monday, 6)).size === 0) return monday;
    d.setUTCDate(d.getUTCDate() + 7);
  }
}

/**
 * A firm quote beside a booking's estimate quote (its configuration and estimate copied), at a firm
 * hourly rate; the labor total is hours × rate.
 */
export async function insertFirmQuote(
  db: Database,
  bookingId: string,
  firm: { laborHours: string; hourlyRate: string; total: string; deposit: string; expiresAt?: Date },
) {
  await db
    .insertInto('quotes')
    .values({
      booking_id: bookingId,
      kind: 'firm',
      price_book_version: 1,
      currency: 'USD',
      configuration: sql`(select configuration from bookings where id = ${bookingId})`,
      estimate: sql`(select estimate from quotes where booking_id = ${bookingId} limit 1)`,
      labor_hours: firm.laborHours,
      total_low: firm.total,
      total_high: firm.total,
      deposit: firm.deposit,
      hourly_rate: firm.hourlyRate,
      labor_total: new Decimal(firm.laborHours).times(firm.hourlyRate).toFixed(2),
      total: firm.total,
      expires_at: firm.expiresAt ?? new Date('2027-01-01T00:00:00Z'),
    })
    .execute();
}

/** A paid balance in dollars (its minor units in cents), paid at the given moment. */
export async function insertPaidBalance(
  db: Database,
  bookingId: string,
  amount: string,
  paidAt: Date,
  method?: 'cash' | 'card_terminal' | 'bank_transfer',
) {
  await db
    .insertInto('payments')
    .values({
      booking_id: bookingId,
      kind: 'balance',
      amount,
      amount_minor: new Decimal(amount).times(100).toNumber(),
      currency: 'USD',
      status: 'paid',
      paid_at: paidAt,
      ...(method ? { method } : {}),
    })
    .execute();
}

/** Moves the moment every payment of a booking was paid (the deposit createBooking wrote, say). */
export async function setPaidAt(db: Database, bookingId: string, paidAt: Date) {
  await db.updateTable('payments').set({ paid_at: paidAt }).where('booking_id', '=', bookingId).execute();
}
