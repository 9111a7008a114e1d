import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BookingSummary, DepositStatus, Page } from '@loomwright/shared';
import { depositStatuses } from '@loomwright/shared';
import { depositStatusFromPaymentsSql } from '../src/bookings/bookings.repository';
import { seedYearOfData } from '../src/database/seed/year-of-data';
import { sessionCookieFor } from './support/sessions';
import { createTestApp, type TestApp } from './support/test-app';

// The benchmark's data generator at a small scale, and the bookings list's rewritten filters checked
// against the plain definitions they replace (the deposit word worked out from the payment rows,
// ILIKE over the joins, ORDER BY … OFFSET).
describe('a year of data (benchmark seed, small scale) and the lists over it', () => {
  let t: TestApp;
  let owner: string;
  let counts: Record<string, number>;
  const scale = { bookings: 2_000, customers: 120, builders: 4, mails: 3_000, fullEstimates: 50 };

  beforeAll(async () => {
    t = await createTestApp();
    owner = await sessionCookieFor(t, 'owner');
    counts = await seedYearOfData(t.db, scale);
  });
  afterAll(async () => t.close());

  it('makes the rows it promises, bench slices inside each day and matching the firm hours', async () => {
    expect(counts.bookings).toBe(scale.bookings);
    expect(counts.mail_outbox).toBe(scale.mails);
    // One estimate each, and a firm quote for every accepted build.
    const firm = await t.db
      .selectFrom('quotes')
      .select(sql<string>`count(*)`.as('n'))
      .where('kind', '=', 'firm')
      .executeTakeFirstOrThrow();
    const accepted = await t.db
      .selectFrom('bookings')
      .select(sql<string>`count(*)`.as('n'))
      .where('state', 'in', ['scheduled', 'pedals_received', 'on_bench', 'delivered'])
      .executeTakeFirstOrThrow();
    expect(counts.quotes).toBe(scale.bookings + Number(firm.n));
    expect(firm.n).toBe(accepted.n);
    const slices = await sql<{ reference: string; booked: string; planned: string }>`
      select b.reference, sum(upper(a.hours) - lower(a.hours))::numeric(8,2)::text as booked, q.labor_hours::text as planned
      from bookings b join bench_allocations a on a.booking_id = b.id join quotes q on q.booking_id = b.id and q.kind = 'firm'
      group by b.reference, q.labor_hours`.execute(t.db);
    expect(slices.rows.length).toBeGreaterThan(100);
    for (const r of slices.rows) expect(r.booked).toBe(r.planned);
  });

  const list = async (query: string) => {
    const res = await t.http().get(`/api/bookings?${query}`).set('Cookie', owner).expect(200);
    if (process.env.DEBUG_LIST) console.log(query, JSON.stringify(res.body).slice(0, 300));
    return res.body as Page<BookingSummary>;
  };

  /** Bookings whose kept deposit word differs from the one their payment rows give. */
  const drift = async () =>
    (
      await t.db
        .selectFrom('bookings')
        .select(['reference', 'deposit_status', depositStatusFromPaymentsSql.as('from_payments')])
        .where(sql<boolean>`bookings.deposit_status is distinct from ${depositStatusFromPaymentsSql}`)
        .execute()
    ).map((r) => `${r.reference}: kept ${r.deposit_status}, payments say ${r.from_payments}`);

  it("keeps each booking's deposit word equal to what its payment rows say, through inserts, updates and deletes", async () => {
    expect(await drift()).toEqual([]);
    const paid = await sql<{ id: string; booking_id: string }>`
      select id, booking_id from payments where kind = 'deposit' and status = 'paid' order by created_at limit 1`.execute(t.db);
    const { id, booking_id: bookingId } = paid.rows[0]!;
    const word = async () =>
      (await t.db.selectFrom('bookings').select('deposit_status').where('id', '=', bookingId).executeTakeFirstOrThrow()).deposit_status;
    await sql`update payments set dispute_id = 'dp_drift', dispute_status = 'needs_response' where id = ${id}`.execute(t.db);
    expect(await word()).toBe('disputed');
    // A dispute the shop won leaves the money where it was.
    await sql`update payments set dispute_status = 'won' where id = ${id}`.execute(t.db);
    expect(await word()).toBe('paid');
    await sql`update payments set status = 'refunded' where id = ${id}`.execute(t.db);
    expect(await word()).toBe('refunded');
    // An open checkout beside a refunded deposit: refunded still names it (the CASE's order).
    await sql`insert into payments (booking_id, kind, amount, amount_minor, currency, status)
      values (${bookingId}, 'deposit', 10, 1000, 'USD', 'pending')`.execute(t.db);
    expect(await word()).toBe('refunded');
    await sql`delete from payments where booking_id = ${bookingId} and kind = 'deposit' and status = 'refunded'`.execute(t.db);
    expect(await word()).toBe('pending');
    await sql`delete from payments where booking_id = ${bookingId} and kind = 'deposit'`.execute(t.db);
    expect(await word()).toBe('unpaid');
    // A balance payment says nothing about the deposit.
    await sql`insert into payments (booking_id, kind, amount, amount_minor, currency, status)
      values (${bookingId}, 'balance', 10, 1000, 'USD', 'pending')`.execute(t.db);
    expect(await word()).toBe('unpaid');
    expect(await drift()).toEqual([]);
  });

  it('filters by deposit exactly as each row names its deposit', async () => {
    // One open dispute, so every status the CASE knows is present.
    await sql`update payments set dispute_id = 'dp_bench', dispute_status = 'needs_response'
      where id = (select id from payments where kind = 'deposit' and status = 'paid' limit 1)`.execute(t.db);
    expect(await drift()).toEqual([]);
    const everything = [];
    for (let page = 1; ; page++) {
      const res = await list(`pageSize=100&page=${page}`);
      everything.push(...res.items);
      if (everything.length >= res.total) break;
    }
    expect(everything).toHaveLength(scale.bookings);
    const byStatus = new Map<DepositStatus, number>();
    for (const item of everything) byStatus.set(item.depositStatus, (byStatus.get(item.depositStatus) ?? 0) + 1);
    expect([...byStatus.keys()].sort()).toEqual(['disputed', 'paid', 'pending', 'refunded', 'unpaid']);
    for (const status of depositStatuses) {
      const res = await list(`deposit=${status}&pageSize=5`);
      expect(res.total, status).toBe(byStatus.get(status) ?? 0);
      for (const item of res.items) expect(item.depositStatus).toBe(status);
    }
  });

  it('walks the list by cursor in the order PostgreSQL sorts it, nulls included, and refuses a damaged cursor in words', async () => {
    // Reference: PostgreSQL's own ORDER BY (nulls last going up, first going down), id breaking ties the same way.
    const walks = [
      ['bench_date', 'asc'],
      ['bench_date', 'desc'],
      ['created_at', 'desc'],
      ['state', 'asc'],
    ] as const;
    for (const [sort, order] of walks) {
      const expected = await sql<{
        id: string;
      }>`select id from bookings order by ${sql.ref(sort)} ${sql.raw(order)}, id ${sql.raw(order)}`.execute(t.db);
      const seen: string[] = [];
      let cursor: string | null | undefined;
      for (let guard = 0; guard < 100; guard++) {
        const res = await list(`sort=${sort}&order=${order}&pageSize=100${cursor ? `&cursor=${cursor}` : ''}`);
        expect(res.total).toBe(expected.rows.length);
        seen.push(...res.items.map((b) => b.id));
        cursor = res.nextCursor;
        if (!cursor) break;
      }
      expect(seen.length, `${sort} ${order}`).toBe(expected.rows.length);
      expect(seen, `${sort} ${order}`).toEqual(expected.rows.map((r) => r.id));
    }
    const first = await list('pageSize=5');
    expect(first.nextCursor).toEqual(expect.any(String));
    const damaged = await t.http().get('/api/bookings?cursor=not-a-cursor').set('Cookie', owner).expect(400);
    expect(damaged.body).toMatchObject({ statusCode: 400, code: 'validation_failed' });
    expect(JSON.stringify(damaged.body)).toContain('That page link is damaged or out of date');
    const otherOrder = await t.http().get(`/api/bookings?sort=reference&cursor=${first.nextCursor}`).set('Cookie', owner).expect(400);
    expect(JSON.stringify(otherOrder.body)).toContain('That page link belongs to another order of the list');
  });

  it('searches references, names and e-mails as ILIKE over the joined rows would', async () => {
    for (const q of ['LW-Y00012', 'ashgrove', 'PLAYER1', 'Nell Brack', '%', 'nobody-at-all']) {
      const expected = await sql<{ n: string }>`
        select count(*) as n from bookings b join users u on u.id = b.customer_id
        where b.reference ilike ${`%${q.replace(/[\\%_]/g, '\\$&')}%`} or u.name ilike ${`%${q.replace(/[\\%_]/g, '\\$&')}%`}
           or u.email::text ilike ${`%${q.replace(/[\\%_]/g, '\\$&')}%`}`.execute(t.db);
      const res = await list(`q=${encodeURIComponent(q)}&pageSize=10`);
      expect(res.total, q).toBe(Number(expected.rows[0]!.n));
    }
  });

  it('pages through a sort without a gap or a repeat, both ways, and shows figures without the quote JSON', async () => {
    for (const order of ['desc', 'asc']) {
      for (const sort of ['created_at', 'bench_date', 'state']) {
        const first = await list(`sort=${sort}&order=${order}&pageSize=50&page=1`);
        const second = await list(`sort=${sort}&order=${order}&pageSize=50&page=2`);
        const both = await list(`sort=${sort}&order=${order}&pageSize=100&page=1`);
        expect([...first.items, ...second.items].map((i) => i.id)).toEqual(both.items.map((i) => i.id));
      }
    }
    // Pages past the middle are read from the far end in the reverse order: the same rows as
    // PostgreSQL's own ORDER BY … OFFSET (nulls of bench_date included), a short last page too.
    for (const [sort, order] of [
      ['bench_date', 'asc'],
      ['bench_date', 'desc'],
      ['created_at', 'desc'],
      ['state', 'asc'],
    ] as const) {
      for (const page of [40, 41, 66, 67, 68]) {
        const expected = await sql<{ id: string }>`select id from bookings
          order by ${sql.ref(sort)} ${sql.raw(order)}, id ${sql.raw(order)} limit 30 offset ${(page - 1) * 30}`.execute(t.db);
        const res = await list(`sort=${sort}&order=${order}&pageSize=30&page=${page}`);
        expect(
          res.items.map((i) => i.id),
          `${sort} ${order} page ${page}`,
        ).toEqual(expected.rows.map((r) => r.id));
      }
    }
    const deliveredTotal = (await list('state=delivered&pageSize=7')).total;
    const lastDelivered = Math.ceil(deliveredTotal / 7);
    const expectedLast = await sql<{ id: string }>`select id from bookings where state = 'delivered'
      order by created_at asc, id asc limit 7 offset ${(lastDelivered - 1) * 7}`.execute(t.db);
    const gotLast = await list(`state=delivered&sort=created_at&order=asc&pageSize=7&page=${lastDelivered}`);
    expect(gotLast.items.map((i) => i.id)).toEqual(expectedLast.rows.map((r) => r.id));
    expect((await list(`state=delivered&pageSize=7&page=${lastDelivered + 1}`)).items).toEqual([]);

    const last = await list(`pageSize=25&page=${scale.bookings / 25}`);
    expect(last.items).toHaveLength(25);
    expect(last.items.at(-1)!.reference).toBe('LW-Y000001');
    const newest = (await list('pageSize=1')).items[0]!;
    expect(newest.reference).toBe(`LW-Y00${scale.bookings}`);
    expect(Number(newest.totalHigh)).toBeGreaterThan(Number(newest.totalLow));
    expect(newest.pedalCount).toBe(13);
  });

  it('pages the mail log by cursor and from the far end exactly as ORDER BY … OFFSET does, and refuses a damaged cursor in words', async () => {
    const log = async (query: string) =>
      (await t.http().get(`/api/mail?${query}`).set('Cookie', owner).expect(200)).body as Page<{ id: string }>;
    const expected = await sql<{ id: string }>`select id from mail_outbox order by created_at desc, id desc`.execute(t.db);
    const ids = expected.rows.map((r) => r.id);
    expect(ids.length).toBeGreaterThanOrEqual(scale.mails);
    const seen: string[] = [];
    let cursor: string | null | undefined;
    for (let guard = 0; guard < 100; guard++) {
      const res = await log(`pageSize=100${cursor ? `&cursor=${cursor}` : ''}`);
      expect(res.total).toBe(ids.length);
      seen.push(...res.items.map((m) => m.id));
      cursor = res.nextCursor;
      if (!cursor) break;
    }
    expect(seen).toEqual(ids);
    // Pages past the middle (and the short last page) are read from the oldest end.
    const pages = Math.ceil(ids.length / 40);
    for (const page of [2, Math.floor(pages / 2) + 1, pages - 1, pages]) {
      const res = await log(`pageSize=40&page=${page}`);
      expect(
        res.items.map((m) => m.id),
        `page ${page}`,
      ).toEqual(ids.slice((page - 1) * 40, page * 40));
    }
    expect((await log(`pageSize=40&page=${pages + 1}`)).items).toEqual([]);
    const damaged = await t.http().get('/api/mail?cursor=not-a-cursor').set('Cookie', owner).expect(400);
    expect(JSON.stringify(damaged.body)).toContain('That page link is damaged or out of date');
    const bookingCursor = (await list('pageSize=5')).nextCursor!;
    const wrongList = await t.http().get(`/api/mail?cursor=${bookingCursor}`).set('Cookie', owner).expect(400);
    expect(JSON.stringify(wrongList.body)).toContain('That page link is damaged or out of date');
  });
});
