import Decimal from 'decimal.js';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { exportColumns } from '@loomwright/shared';
import { builderId, createBooking, insertFirmQuote, insertPaidBalance, setPaidAt, signIn } from './support/bench-fixtures';
import { fetchCsv, sumOf as total } from './support/csv';
import { createTestApp, type TestApp } from './support/test-app';
import { isoInTimeZone } from '../src/exports/csv-cells';

/**
 * The bookkeeper's CSV files, read back with an independent parser (csv-parse, RFC 4180) and
 * summed against the database with SQL of the test's own. The demo shop keeps its books in
 * America/Chicago: UTC−6 in winter and UTC−5 in summer (IANA time zone database; US daylight
 * saving time from the second Sunday of March to the first Sunday of November, Energy Policy
 * Act of 2005 §110).
 */
let t: TestApp;
let owner: Awaited<ReturnType<typeof signIn>>;

const csv = (path: string) => fetchCsv(owner, path);

let playerBooking: { id: string; reference: string };
let secondBooking: { id: string; reference: string };

beforeAll(async () => {
  t = await createTestApp();
  owner = await signIn(t.app, 'owner@shop.example');
  // A name and a note in letters beyond ASCII, and a note a spreadsheet would run as a formula.
  await t.db.updateTable('users').set({ name: 'Zoë Ñandú-Łukasz' }).where('email', '=', 'player@mail.example').execute();
  playerBooking = await createBooking(t.db, { laborHours: '6.50', deposit: '150.00' });
  secondBooking = await createBooking(t.db, { laborHours: '3.00', deposit: '80.00' });
  await t.db
    .updateTable('bookings')
    .set({ created_at: new Date('2026-11-10T15:00:00Z') })
    .where('id', '=', playerBooking.id)
    .execute();
  await t.db
    .updateTable('bookings')
    .set({ created_at: new Date('2026-12-01T03:00:00Z') })
    .where('id', '=', secondBooking.id)
    .execute();
  // Deposits: the first paid 2026-11-10 10:00 in Chicago; the second at 05:30 UTC on 15 Nov, which is
  // still 14 Nov (23:30) on the shop's clock.
  await setPaidAt(t.db, playerBooking.id, new Date('2026-11-10T16:00:00Z'));
  await setPaidAt(t.db, secondBooking.id, new Date('2026-11-15T05:30:00Z'));
  // A firm quote and a balance for the first, and the second's deposit refunded on 2 Dec.
  // 6.5 h × $100.00 = $650.00 labor (hand-worked).
  await insertFirmQuote(t.db, playerBooking.id, { laborHours: '6.50', hourlyRate: '100.00', total: '950.00', deposit: '150.00' });
  await insertPaidBalance(t.db, playerBooking.id, '600.00', new Date('2026-12-03T18:45:10Z'), 'cash');
  await t.db
    .updateTable('payments')
    .set({ status: 'refunded', refunded_at: new Date('2026-12-02T20:00:00Z'), refund_id: 're_test_1' })
    .where('booking_id', '=', secondBooking.id)
    .execute();
  const master = await builderId(t.db, 'builder@shop.example');
  const ownerUser = await t.db.selectFrom('users').select('id').where('email', '=', 'owner@shop.example').executeTakeFirstOrThrow();
  await t.db
    .insertInto('time_entries')
    .values([
      {
        booking_id: playerBooking.id,
        builder_id: master,
        worked_on: '2026-12-01',
        hours: '2.50',
        note: 'Loom and patch cables',
        created_by: ownerUser.id,
      },
      {
        booking_id: playerBooking.id,
        builder_id: master,
        worked_on: '2026-12-02',
        hours: '3.25',
        note: '=SUM(A1:A9) checked twice',
        created_by: ownerUser.id,
      },
      {
        booking_id: secondBooking.id,
        builder_id: master,
        worked_on: '2026-12-05',
        hours: '1.00',
        note: 'Power leads',
        created_by: ownerUser.id,
      },
    ])
    .execute();
}, 120_000);

afterAll(async () => {
  await t?.close();
});

describe('GET /api/exports/payments.csv', () => {
  it('lists each payment on its shop day and each refund as a negative amount; the sums equal the database', async () => {
    const { rows, raw, headers } = await csv('/api/exports/payments.csv?from=2026-11-01&to=2026-12-31');
    expect(headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
    expect(headers['content-disposition']).toBe('attachment; filename="payments-2026-11-01-to-2026-12-31.csv"');
    // Streamed: no length known up front.
    expect(headers['transfer-encoding']).toBe('chunked');
    // UTF-8 with a byte order mark, then the header row (RFC 4180 §2.3), records ending in CRLF (§2.1).
    expect([...raw.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    expect(raw.toString('utf8').slice(1).split('\r\n')[0]).toBe(exportColumns.payments.join(','));
    expect(rows).toHaveLength(4);

    const { rows: sums } = await sql<{ kind: string; paid: string; refunded: string }>`
      select kind, sum(amount)::text as paid, coalesce(sum(amount) filter (where status = 'refunded'), 0)::text as refunded
      from payments where status in ('paid', 'refunded') group by kind order by kind`.execute(t.db);
    const byKind = Object.fromEntries(sums.map((s) => [s.kind, s]));
    expect(total(rows.filter((r) => r.entry === 'payment' && r.payment_kind === 'deposit').map((r) => r.amount))).toBe(byKind.deposit.paid);
    expect(total(rows.filter((r) => r.entry === 'payment' && r.payment_kind === 'balance').map((r) => r.amount))).toBe(byKind.balance.paid);
    expect(total(rows.filter((r) => r.entry === 'refund').map((r) => r.amount))).toBe(
      new Decimal(byKind.deposit.refunded).neg().toFixed(2),
    );
    expect(total(rows.map((r) => r.amount))).toBe('750.00'); // 150 + 80 + 600 − 80

    // 05:30 UTC on 15 Nov is 23:30 on 14 Nov in Chicago (CST, UTC−6).
    const late = rows.find((r) => r.reference === secondBooking.reference && r.entry === 'payment')!;
    expect(late.at).toBe('2026-11-14T23:30:00-06:00');
    expect(rows.find((r) => r.entry === 'refund')).toMatchObject({
      at: '2026-12-02T14:00:00-06:00',
      amount: '-80.00',
      provider_refund: 're_test_1',
    });
    expect(rows.find((r) => r.payment_kind === 'balance')).toMatchObject({
      method: 'cash',
      amount: '600.00',
      currency: 'USD',
      customer_name: 'Zoë Ñandú-Łukasz',
    });
  });

  it('draws the range on the shop’s calendar days, both ends included', async () => {
    const upTo14 = await csv('/api/exports/payments.csv?from=2026-11-14&to=2026-11-14');
    expect(upTo14.rows.map((r) => r.reference)).toEqual([secondBooking.reference]);
    const from15 = await csv('/api/exports/payments.csv?from=2026-11-15&to=2026-12-02');
    expect(from15.rows.map((r) => `${r.reference} ${r.entry}`)).toEqual([`${secondBooking.reference} refund`]);
    const empty = await csv('/api/exports/payments.csv?from=2025-01-01&to=2025-01-31');
    expect(empty.rows).toEqual([]);
    expect(empty.raw.toString('utf8').slice(1)).toBe(`${exportColumns.payments.join(',')}\r\n`);
  });
});

describe('GET /api/exports/bookings.csv', () => {
  it('has one row per booking requested in the range, with money facts that add up to the payments', async () => {
    const { rows } = await csv('/api/exports/bookings.csv?from=2026-11-01&to=2026-11-30');
    // The second was requested at 03:00 UTC on 1 Dec: 30 Nov, 21:00, in Chicago.
    expect(rows.map((r) => r.reference)).toEqual([playerBooking.reference, secondBooking.reference]);
    const first = rows[0];
    expect(first).toMatchObject({
      requested_at: '2026-11-10T09:00:00-06:00',
      customer_name: 'Zoë Ñandú-Łukasz',
      currency: 'USD',
      firm_total: '950.00',
      approved_extras: '0.00',
      total_owed: '950.00',
      paid: '750.00',
      refunded: '0.00',
      net_paid: '750.00',
      balance_due: '200.00',
      quoted_hours: '6.50',
      recorded_hours: '5.75',
    });
    expect(rows[1]).toMatchObject({
      requested_at: '2026-11-30T21:00:00-06:00',
      firm_total: '',
      paid: '80.00',
      refunded: '80.00',
      net_paid: '0.00',
      balance_due: '',
    });
    const { rows: db } = await sql<{ paid: string; refunded: string }>`
      select sum(amount)::text as paid, coalesce(sum(amount) filter (where status = 'refunded'), 0)::text as refunded
      from payments where status in ('paid', 'refunded')`.execute(t.db);
    expect(total(rows.map((r) => r.paid))).toBe(db[0].paid);
    expect(total(rows.map((r) => r.refunded))).toBe(db[0].refunded);
  });
});

describe('GET /api/exports/hours.csv', () => {
  it('sums to the hour entries of the range, and writes a typed formula as text', async () => {
    const { rows } = await csv('/api/exports/hours.csv?from=2026-12-01&to=2026-12-02');
    const { rows: db } = await sql<{
      hours: string;
    }>`select sum(hours)::text as hours from time_entries where worked_on between '2026-12-01' and '2026-12-02'`.execute(t.db);
    expect(total(rows.map((r) => r.hours))).toBe(new Decimal(db[0].hours).toFixed(2));
    expect(rows.map((r) => r.worked_on)).toEqual(['2026-12-01', '2026-12-02']);
    expect(rows[0]).toMatchObject({
      reference: playerBooking.reference,
      builder_level: 'master',
      hours: '2.50',
      recorded_by: expect.any(String),
    });
    // OWASP "CSV Injection": a cell opening with = is written with a leading apostrophe.
    expect(rows[1].note).toBe("'=SUM(A1:A9) checked twice");
  });

  it('streams thousands of rows across several cursor chunks, each one once', async () => {
    const master = await builderId(t.db, 'builder@shop.example');
    await sql`insert into time_entries (booking_id, builder_id, worked_on, hours, note)
              select ${secondBooking.id}, ${master}, date '2025-06-01' + (n % 28), 0.25, 'bulk ' || n
              from generate_series(1, 4500) as n`.execute(t.db);
    const { rows } = await csv('/api/exports/hours.csv?from=2025-06-01&to=2025-06-30');
    expect(rows).toHaveLength(4500);
    expect(new Set(rows.map((r) => r.note)).size).toBe(4500);
    expect(total(rows.map((r) => r.hours))).toBe('1125.00');
  });
});

describe('refusals', () => {
  it.each([
    ['/api/exports/hours.csv', /First day must be a real calendar day/],
    ['/api/exports/hours.csv?from=2026-12-01', /Last day must be a real calendar day/],
    ['/api/exports/hours.csv?from=2026-02-30&to=2026-03-01', /First day must be a real calendar day/],
    ['/api/exports/payments.csv?from=2026-12-31&to=2026-12-01', /Last day must be on or after the first day/],
    ['/api/exports/bookings.csv?from=2000-01-01&to=2026-12-01', /at most 3660 days/],
    ['/api/exports/bookings.csv?from=2026-01-01&to=2026-02-01&format=xlsx', /format\W+ is not a field/],
  ])('%s is a 400 in words', async (path, words) => {
    const res = await owner.get(path);
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body.message)).toMatch(words);
  });

  it('is for the owner only', async () => {
    const builder = await signIn(t.app, 'builder@shop.example');
    expect((await builder.get('/api/exports/payments.csv?from=2026-01-01&to=2026-12-31')).status).toBe(403);
    expect((await t.http().get('/api/exports/payments.csv?from=2026-01-01&to=2026-12-31')).status).toBe(401);
  });
});

describe('isoInTimeZone', () => {
  it('writes the offset in force at the instant, across the daylight saving change (IANA tz, America/Chicago, 8 Mar 2026)', () => {
    expect(isoInTimeZone(new Date('2026-03-08T07:59:59Z'), 'America/Chicago')).toBe('2026-03-08T01:59:59-06:00');
    expect(isoInTimeZone(new Date('2026-03-08T08:00:00Z'), 'America/Chicago')).toBe('2026-03-08T03:00:00-05:00');
    expect(isoInTimeZone(new Date('2026-07-01T12:00:00Z'), 'Asia/Kolkata')).toBe('2026-07-01T17:30:00+05:30');
    expect(isoInTimeZone(new Date('2026-07-01T12:00:00Z'), 'UTC')).toBe('2026-07-01T12:00:00+00:00');
  });
});
