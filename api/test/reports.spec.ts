import { getISOWeek, getISOWeekYear } from 'date-fns';
import Decimal from 'decimal.js';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { HoursReport, OutstandingReport, RevenueReport, UtilisationReport } from '@loomwright/shared';
import { builderId, createBooking, insertFirmQuote, insertPaidBalance, setPaidAt, signIn } from './support/bench-fixtures';
import { fetchCsv, sumOf as total } from './support/csv';
import { createTestApp, type TestApp } from './support/test-app';
import { isoWeekLabel } from '../src/reports/iso-week';

/**
 * Every report figure equals the sum of the matching CSV export, read back with csv-parse; the
 * shop keeps America/Chicago time (IANA tz database: UTC−6 in November and December).
 */
let t: TestApp;
let owner: Awaited<ReturnType<typeof signIn>>;
const csv = async (path: string) => (await fetchCsv(owner, path)).rows;
let a: { id: string; reference: string };
let b: { id: string; reference: string };
let c: { id: string; reference: string };
let master: string;
let junior: string;

/**
 * A booking with its builder and bench date, at a firm price (at the $100.00/h the reports' hours
 * are worked at, with a $150.00 deposit) whose deposit was paid at `depositPaidAt`.
 */
async function benchAtFirmPrice(
  bookingId: string,
  booked: { state: 'scheduled' | 'on_bench'; builderId: string; benchDate: string; total: string; laborHours: string; depositPaidAt: Date },
) {
  await t.db
    .updateTable('bookings')
    .set({ state: booked.state, builder_id: booked.builderId, bench_date: booked.benchDate })
    .where('id', '=', bookingId)
    .execute();
  await insertFirmQuote(t.db, bookingId, { laborHours: booked.laborHours, hourlyRate: '100.00', total: booked.total, deposit: '150.00' });
  await setPaidAt(t.db, bookingId, booked.depositPaidAt);
}

beforeAll(async () => {
  t = await createTestApp();
  owner = await signIn(t.app, 'owner@shop.example');
  master = await builderId(t.db, 'builder@shop.example');
  junior = await builderId(t.db, 'junior@shop.example');
  a = await createBooking(t.db, { laborHours: '8.00', deposit: '150.00' });
  b = await createBooking(t.db, { laborHours: '4.00', deposit: '90.00' });
  c = await createBooking(t.db, { laborHours: '5.00', deposit: '120.00', state: 'requested' });
  await t.db
    .updateTable('bookings')
    .set({ created_at: new Date('2026-11-02T15:00:00Z') })
    .execute();
  // a: scheduled with the master at a firm 1,000.00, deposit paid in November, balance 300 paid in December.
  await benchAtFirmPrice(a.id, {
    state: 'on_bench',
    builderId: master,
    benchDate: '2026-11-23',
    total: '1000.00',
    laborHours: '8.00',
    depositPaidAt: new Date('2026-11-03T17:00:00Z'),
  });
  await insertPaidBalance(t.db, a.id, '300.00', new Date('2026-12-01T18:00:00Z'));
  // b: with the junior at a firm 500.00; deposit paid 30 Nov 23:30 Chicago (1 Dec 05:30 UTC): November on the shop's books.
  await benchAtFirmPrice(b.id, {
    state: 'scheduled',
    builderId: junior,
    benchDate: '2026-11-30',
    total: '500.00',
    laborHours: '4.00',
    depositPaidAt: new Date('2026-12-01T05:30:00Z'),
  });
  // A refund in December of an earlier, cancelled booking's deposit.
  const gone = await createBooking(t.db, { laborHours: '2.00', deposit: '60.00' });
  await t.db
    .updateTable('bookings')
    .set({ state: 'cancelled', created_at: new Date('2026-10-20T15:00:00Z') })
    .where('id', '=', gone.id)
    .execute();
  await t.db
    .updateTable('payments')
    .set({ status: 'refunded', paid_at: new Date('2026-10-20T16:00:00Z'), refunded_at: new Date('2026-12-04T16:00:00Z') })
    .where('booking_id', '=', gone.id)
    .execute();
  // Hours: the master on a in Thanksgiving week and the week after; the junior on b.
  await t.db
    .insertInto('time_entries')
    .values([
      { booking_id: a.id, builder_id: master, worked_on: '2026-11-23', hours: '3.50' },
      { booking_id: a.id, builder_id: master, worked_on: '2026-11-24', hours: '4.25' },
      { booking_id: a.id, builder_id: master, worked_on: '2026-12-01', hours: '2.00' },
      { booking_id: b.id, builder_id: junior, worked_on: '2026-11-30', hours: '1.50' },
      { booking_id: a.id, builder_id: junior, worked_on: '2026-11-25', hours: '0.75' },
    ])
    .execute();
  // Booked bench time for the master: 6 h on Mon 23 Nov and 2 h on Tue 24 Nov.
  for (const [day, to] of [
    ['2026-11-23', 6],
    ['2026-11-24', 2],
  ] as const) {
    await t.db
      .insertInto('bench_allocations')
      .values({ booking_id: a.id, builder_id: master, day, hours: sql<string>`numrange(0, ${to}::numeric, '[)')`, day_capacity: '8.00' })
      .execute();
  }
}, 120_000);

afterAll(async () => {
  await t?.close();
});

describe('GET /api/reports/revenue', () => {
  it('equals payments.csv summed by month, with an empty month as zeros', async () => {
    const report = (await owner.get('/api/reports/revenue?from=2026-09-01&to=2026-12-31').expect(200)).body as RevenueReport;
    const rows = await csv('/api/exports/payments.csv?from=2026-09-01&to=2026-12-31');
    expect(report.months.map((m) => m.month)).toEqual(['2026-09', '2026-10', '2026-11', '2026-12']);
    for (const m of report.months) {
      const mine = rows.filter((r) => r.at.startsWith(m.month));
      expect(m.deposits, m.month).toBe(
        total(mine.filter((r) => r.entry === 'payment' && r.payment_kind === 'deposit').map((r) => r.amount)),
      );
      expect(m.balances, m.month).toBe(
        total(mine.filter((r) => r.entry === 'payment' && r.payment_kind === 'balance').map((r) => r.amount)),
      );
      expect(m.refunds, m.month).toBe(new Decimal(total(mine.filter((r) => r.entry === 'refund').map((r) => r.amount))).neg().toFixed(2));
      expect(m.net, m.month).toBe(total(mine.map((r) => r.amount)));
    }
    // By hand: November 150 + 90 (b's deposit is 30 Nov on the shop's clock); December 300 in, 60 back.
    expect(report.months[2]).toMatchObject({ deposits: '240.00', balances: '0.00', refunds: '0.00', net: '240.00' });
    expect(report.months[3]).toMatchObject({ deposits: '0.00', balances: '300.00', refunds: '60.00', net: '240.00' });
    expect(report.months[0]).toMatchObject({ net: '0.00' });
    expect(report.totals).toEqual([{ currency: 'USD', deposits: '300.00', balances: '300.00', refunds: '60.00', net: '540.00' }]);
  });
});

describe('GET /api/reports/outstanding', () => {
  it('equals the deposit and balance_due columns of bookings.csv for the open bookings', async () => {
    const report = (await owner.get('/api/reports/outstanding').expect(200)).body as OutstandingReport;
    const rows = await csv('/api/exports/bookings.csv?from=2026-01-01&to=2026-12-31');
    const open = ['scheduled', 'pedals_received', 'on_bench', 'testing', 'ready', 'delivered'];
    const balances = rows.filter((r) => open.includes(r.state) && new Decimal(r.balance_due || 0).gt(0));
    const deposits = rows.filter((r) => r.state === 'requested' && new Decimal(r.paid).isZero());
    expect(report.items.filter((i) => i.kind === 'balance').map((i) => [i.reference, i.amount])).toEqual(
      balances.map((r) => [r.reference, r.balance_due]),
    );
    expect(report.items.filter((i) => i.kind === 'deposit').map((i) => [i.reference, i.amount])).toEqual(
      deposits.map((r) => [r.reference, r.deposit]),
    );
    // a owes 1,000 − 150 − 300 = 550; b owes 500 − 90 = 410; c's deposit of 120 is unpaid; the cancelled one owes nothing.
    expect(report.totals).toEqual(
      expect.arrayContaining([
        { kind: 'balance', currency: 'USD', amount: '960.00', count: 2 },
        { kind: 'deposit', currency: 'USD', amount: '120.00', count: 1 },
      ]),
    );
    expect(report.items.find((i) => i.reference === c.reference)).toMatchObject({ kind: 'deposit', since: '2026-11-02' });
  });
});

describe('GET /api/reports/hours', () => {
  it('per build and per builder equals hours.csv, quoted hours equal bookings.csv', async () => {
    const report = (await owner.get('/api/reports/hours?from=2026-11-23&to=2026-11-30').expect(200)).body as HoursReport;
    const hours = await csv('/api/exports/hours.csv?from=2026-11-23&to=2026-11-30');
    const bookings = await csv('/api/exports/bookings.csv?from=2026-01-01&to=2026-12-31');
    expect(report.builds.map((r) => r.reference).sort()).toEqual([...new Set(hours.map((h) => h.reference))].sort());
    for (const r of report.builds) {
      expect(r.hoursInRange, r.reference).toBe(total(hours.filter((h) => h.reference === r.reference).map((h) => h.hours)));
      expect(r.quotedHours, r.reference).toBe(bookings.find((x) => x.reference === r.reference)!.quoted_hours);
    }
    for (const r of report.builders) {
      expect(r.hoursInRange, r.builderName).toBe(total(hours.filter((h) => h.builder_name === r.builderName).map((h) => h.hours)));
    }
    // a: quoted 8; 3.5 + 4.25 + 0.75 in the range; 10.5 to date (2 more on 1 Dec): 2.5 h over.
    expect(report.builds.find((r) => r.reference === a.reference)).toMatchObject({
      quotedHours: '8.00',
      hoursInRange: '8.50',
      hoursToDate: '10.50',
      overQuote: '2.50',
    });
    expect(report.builds.find((r) => r.reference === b.reference)).toMatchObject({
      quotedHours: '4.00',
      hoursInRange: '1.50',
      overQuote: '-2.50',
    });
  });
});

describe('GET /api/reports/utilisation', () => {
  it('counts capacity without the Thanksgiving holiday, booked bench slices, and the hours recorded (hours.csv by week)', async () => {
    const report = (await owner.get('/api/reports/utilisation?from=2026-11-25&to=2026-12-02').expect(200)).body as UtilisationReport;
    expect(report.from).toBe('2026-11-23');
    expect(report.to).toBe('2026-12-06');
    const weekly = await t.db.selectFrom('builders').select('weekly_hours').where('id', '=', master).executeTakeFirstOrThrow();
    const week = weekly.weekly_hours as unknown as Record<string, number>;
    const fullWeek = new Decimal(Object.values(week).reduce((s, h) => s + Number(h ?? 0), 0));
    const row = report.builders.find((x) => x.builderId === master)!;
    // 26 Nov 2026 is the fourth Thursday of November, Thanksgiving Day (5 U.S.C. §6103(a)): no bench that day.
    expect(row.weeks[0]).toMatchObject({ weekStart: '2026-11-23', isoWeek: '2026-W48', bookedHours: '8.00' });
    expect(row.weeks[0].capacityHours).toBe(fullWeek.minus(week['4'] ?? 0).toFixed(2));
    expect(row.weeks[1].capacityHours).toBe(fullWeek.toFixed(2));
    expect(row.weeks[0].bookedPercent).toBe(new Decimal(8).div(row.weeks[0].capacityHours).times(100).toFixed(1));
    const hours = await csv('/api/exports/hours.csv?from=2026-11-23&to=2026-12-06');
    for (const builder of report.builders) {
      for (const w of builder.weeks) {
        const mine = hours.filter(
          (h) => h.builder_name === builder.builderName && h.worked_on >= w.weekStart && h.worked_on <= addDays(w.weekStart, 6),
        );
        expect(w.recordedHours, `${builder.builderName} ${w.isoWeek}`).toBe(total(mine.map((h) => h.hours)));
      }
    }
  });

  it('refuses more than 400 days in words', async () => {
    const res = await owner.get('/api/reports/utilisation?from=2025-01-01&to=2026-12-31');
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/at most 400 days/);
  });

  it('labels ISO weeks as date-fns does (getISOWeek, getISOWeekYear), across year ends', () => {
    for (const day of ['2026-11-23', '2026-12-28', '2027-01-03', '2027-01-04', '2020-12-31', '2021-01-03', '2024-12-30', '2026-01-01']) {
      const d = new Date(`${day}T12:00:00`);
      expect(isoWeekLabel(day), day).toBe(`${getISOWeekYear(d)}-W${String(getISOWeek(d)).padStart(2, '0')}`);
    }
  });
});

describe('refusals and roles', () => {
  it('answers 400 in words for a bad range and 403 to a builder', async () => {
    const bad = await owner.get('/api/reports/revenue?from=2026-12-01&to=2026-11-01');
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body.message)).toMatch(/Last day must be on or after the first day/);
    const builder = await signIn(t.app, 'builder@shop.example');
    for (const path of [
      '/api/reports/revenue?from=2026-01-01&to=2026-01-31',
      '/api/reports/outstanding',
      '/api/reports/hours?from=2026-01-01&to=2026-01-31',
      '/api/reports/utilisation?from=2026-01-01&to=2026-01-31',
    ]) {
      expect((await builder.get(path)).status, path).toBe(403);
    }
  });
});

function addDays(day: string, n: number) {
  return new Date(Date.parse(`${day}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
}
