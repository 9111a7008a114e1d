import { sql } from 'kysely';
import type { AddressInfo } from 'node:net';
import { Client } from 'pg';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { addDays } from '../src/bench/calendar-days';
import { builderId, createBooking, quietMondayWeeksAhead, signIn } from './support/bench-fixtures';
import { clearTables, createTestApp, type TestApp } from './support/test-app';

/**
 * Overbooking must be impossible in the database, not only in the planner: these tests fire many
 * acceptances at once for one builder and check the bench through SQL afterwards.
 */
describe('concurrent acceptances for one builder', () => {
  let t: TestApp;
  let master: string;
  let monday: string;
  let baseUrl: string;

  /** Fires every acceptance at once over its own fetch, with the signed-in person's cookie. */
  function acceptAllAtOnce(email: string, items: Array<{ bookingId: string; benchDate: string }>) {
    return postAllAtOnce(
      email,
      items.map(({ bookingId, benchDate }) => ({ path: `/api/bookings/${bookingId}/accept`, body: { builderId: master, benchDate } })),
    );
  }

  /** Fires every POST at once over its own fetch, with the signed-in person's cookie. */
  async function postAllAtOnce(email: string, items: Array<{ path: string; body: object }>) {
    const signIn = await fetch(`${baseUrl}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email, password: 'demo-pass-2026' }),
    });
    const cookie = signIn.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    // A barrier: while this transaction holds shop_closures, every acceptance stops at its first
    // read of the shop calendar, so all of them are in flight together when it lets go. Without
    // it one Node process tends to run them one after another and the race never happens.
    const barrier = new Client({ connectionString: process.env.DATABASE_URL });
    await barrier.connect();
    await barrier.query('begin');
    await barrier.query('lock table shop_closures in access exclusive mode');
    const inFlight = Promise.all(
      items.map(async ({ path, body }) => {
        const res = await fetch(`${baseUrl}${path}`, {
          method: 'POST',
          headers: { 'content-type': 'application/json', cookie },
          body: JSON.stringify(body),
        });
        return { status: res.status, body: (await res.json()) as { message?: string } };
      }),
    );
    await new Promise((resolve) => setTimeout(resolve, 1500));
    await barrier.query('commit');
    await barrier.end();
    return inFlight;
  }

  beforeAll(async () => {
    t = await createTestApp({ env: { DATABASE_POOL_MAX: '30' } });
    // A real port, so the acceptances below arrive on separate connections at the same moment.
    await t.app.listen(0, '127.0.0.1');
    baseUrl = `http://127.0.0.1:${(t.app.getHttpServer().address() as AddressInfo).port}`;
    master = await builderId(t.db, 'builder@shop.example');
    monday = quietMondayWeeksAhead(3);
  });
  afterAll(async () => t.close());
  beforeEach(async () => clearTables(t.db, ['bench_allocations', 'booking_events', 'mail_outbox', 'payments', 'quotes', 'bookings']));

  /** Per day: the hours booked, the capacity recorded, and whether any two slices overlap. */
  async function benchThroughSql() {
    const days = await sql<{ day: string; booked: string; capacity: string }>`
      select day::text, sum(upper(hours) - lower(hours))::text as booked, max(day_capacity)::text as capacity
      from bench_allocations where builder_id = ${master} group by day order by day`.execute(t.db);
    const overlaps = await sql<{ n: string }>`
      select count(*)::text as n from bench_allocations a join bench_allocations b
        on a.id < b.id and a.builder_id = b.builder_id and a.day = b.day and a.hours && b.hours`.execute(t.db);
    return { days: days.rows, overlaps: Number(overlaps.rows[0].n) };
  }

  it('20 acceptances of 2.5 h builds on one Monday: exactly the three that can start that day succeed', async () => {
    const bookings = await Promise.all(Array.from({ length: 20 }, () => createBooking(t.db, { laborHours: '2.50' })));
    const results = await acceptAllAtOnce(
      'builder@shop.example',
      bookings.map((b) => ({ bookingId: b.id, benchDate: monday })),
    );
    const ok = results.filter((r) => r.status === 200);
    const refused = results.filter((r) => r.status === 409);
    // The master works 7 h on a Monday: 2.5 + 2.5 + 2 h fit (the third spills 0.5 h into Tuesday); the rest find Monday full.
    expect(ok).toHaveLength(3);
    expect(refused).toHaveLength(17);
    for (const r of refused) expect(r.body.message).toMatch(/bench time/i);

    const bench = await benchThroughSql();
    expect(bench.overlaps).toBe(0);
    expect(bench.days).toEqual([
      { day: monday, booked: '7.00', capacity: '7.00' },
      { day: addDays(monday, 1), booked: '0.50', capacity: '7.00' },
    ]);
    const scheduled = await t.db.selectFrom('bookings').select(['id']).where('state', '=', 'scheduled').execute();
    expect(scheduled).toHaveLength(3);
    // Each success has its firm quote and its one e-mail; the refused ones left nothing behind.
    expect(await t.db.selectFrom('quotes').select('id').where('kind', '=', 'firm').execute()).toHaveLength(3);
    expect(await t.db.selectFrom('mail_outbox').select('id').where('template', '=', 'booking-scheduled').execute()).toHaveLength(3);
  });

  it('24 acceptances of full-day builds spread over four days: one per day, never more than capacity', async () => {
    const bookings = await Promise.all(Array.from({ length: 24 }, () => createBooking(t.db, { laborHours: '7.00' })));
    const results = await acceptAllAtOnce(
      'owner@shop.example',
      bookings.map((b, i) => ({ bookingId: b.id, benchDate: addDays(monday, i % 4) })),
    );
    expect(results.filter((r) => r.status === 200)).toHaveLength(4);
    expect(results.filter((r) => r.status === 409)).toHaveLength(20);
    expect(results.every((r) => r.status === 200 || r.status === 409)).toBe(true);
    const bench = await benchThroughSql();
    expect(bench.overlaps).toBe(0);
    expect(bench.days.map((d) => d.day)).toEqual([0, 1, 2, 3].map((i) => addDays(monday, i)));
    for (const d of bench.days) expect(Number(d.booked)).toBeLessThanOrEqual(Number(d.capacity));
  });

  it('the same booking accepted twice at once is scheduled once', async () => {
    const booking = await createBooking(t.db, { laborHours: '3.00' });
    const results = await acceptAllAtOnce(
      'builder@shop.example',
      Array.from({ length: 20 }, (_, i) => ({ bookingId: booking.id, benchDate: addDays(monday, i % 3) })),
    );
    expect(results.filter((r) => r.status === 200)).toHaveLength(1);
    expect(
      results.filter((r) => r.status === 409).every((r) => /deposit is paid and before it is scheduled/.test(r.body.message ?? '')),
    ).toBe(true);
    const slices = await t.db.selectFrom('bench_allocations').select('id').where('booking_id', '=', booking.id).execute();
    expect(slices).toHaveLength(1);
  });

  it('moves and acceptances racing for the same Monday never overbook it, and a refused move keeps its old time', async () => {
    // Six 2.5 h builds already scheduled later in the week (two a day, Wednesday to Friday) …
    const agent = await signIn(t.app, 'owner@shop.example');
    const scheduled = await Promise.all(Array.from({ length: 6 }, () => createBooking(t.db, { laborHours: '2.50' })));
    for (const [i, b] of scheduled.entries()) {
      await agent
        .post(`/api/bookings/${b.id}/accept`)
        .send({ builderId: master, benchDate: addDays(monday, 2 + Math.floor(i / 2)) })
        .expect(200);
    }
    const before = new Map(
      (
        await t.db
          .selectFrom('bookings')
          .select(['id', 'bench_date'])
          .where(
            'id',
            'in',
            scheduled.map((b) => b.id),
          )
          .execute()
      ).map((r) => [r.id, r.bench_date]),
    );
    // … race ten new acceptances and the six moves for Monday, all at once.
    const fresh = await Promise.all(Array.from({ length: 10 }, () => createBooking(t.db, { laborHours: '2.50' })));
    const results = await postAllAtOnce('owner@shop.example', [
      ...fresh.map((b) => ({ path: `/api/bookings/${b.id}/accept`, body: { builderId: master, benchDate: monday } })),
      ...scheduled.map((b) => ({
        path: `/api/bookings/${b.id}/reschedule`,
        body: { builderId: master, benchDate: monday, reason: 'Earlier slot freed up.' },
      })),
    ]);
    expect(results.every((r) => r.status === 200 || r.status === 409)).toBe(true);
    // Monday holds 7 h: 2.5 + 2.5 + 2 can start there (the third spills 0.5 h into Tuesday), whatever the mix.
    expect(results.filter((r) => r.status === 200)).toHaveLength(3);
    for (const r of results.filter((x) => x.status === 409)) expect(r.body.message).toMatch(/bench time/i);

    const bench = await benchThroughSql();
    expect(bench.overlaps).toBe(0);
    for (const d of bench.days) expect(Number(d.booked)).toBeLessThanOrEqual(Number(d.capacity));
    expect(bench.days.find((d) => d.day === monday)).toEqual({ day: monday, booked: '7.00', capacity: '7.00' });
    // No hours lost or doubled: every scheduled build holds exactly its 2.5 h, and a refused move is where it was.
    const held = await sql<{ booking_id: string; hours: string }>`
      select booking_id, sum(upper(hours) - lower(hours))::text as hours from bench_allocations group by booking_id`.execute(t.db);
    const scheduledNow = await t.db.selectFrom('bookings').select(['id', 'bench_date']).where('state', '=', 'scheduled').execute();
    expect(scheduledNow).toHaveLength(6 + results.slice(0, 10).filter((r) => r.status === 200).length);
    expect(held.rows).toHaveLength(scheduledNow.length);
    for (const row of held.rows) expect(row.hours).toBe('2.50');
    for (const [i, b] of scheduled.entries()) {
      const now = scheduledNow.find((r) => r.id === b.id)!.bench_date;
      expect(now === monday || now === before.get(b.id)).toBe(true);
      if (results[10 + i].status === 409) expect(now).toBe(before.get(b.id));
    }
  });

  it('the exclusion constraint is the last guard: time taken behind the planner’s back gives 409 in words', async () => {
    const mine = await createBooking(t.db, { laborHours: '2.00' });
    const other = await createBooking(t.db, { laborHours: '7.00' });
    const agent = await signIn(t.app, 'builder@shop.example');
    // A writer that skips the builder lock holds Monday's hours in an open transaction …
    const raw = new Client({ connectionString: process.env.DATABASE_URL });
    await raw.connect();
    await raw.query('begin');
    await raw.query(
      `insert into bench_allocations (booking_id, builder_id, day, hours, day_capacity) values ($1, $2, $3, numrange(0, 7), 7)`,
      [other.id, master, monday],
    );
    // … the acceptance plans on the committed bench, [0, 2) looks free, and its insert waits on the constraint.
    const pending = agent
      .post(`/api/bookings/${mine.id}/accept`)
      .send({ builderId: master, benchDate: monday })
      .then((r) => r);
    await new Promise((resolve) => setTimeout(resolve, 500));
    await raw.query('commit');
    await raw.end();
    const res = await pending;
    expect(res.status).toBe(409);
    expect(res.body.message).toBe('That bench time was just taken; pick another date.');
    const booking = await t.db.selectFrom('bookings').select('state').where('id', '=', mine.id).executeTakeFirstOrThrow();
    expect(booking.state).toBe('deposit_paid');
  });

  it('the database itself refuses overlapping slices and slices past the day’s capacity', async () => {
    const b = await createBooking(t.db, { laborHours: '1.00' });
    const insert = (from: number, to: number, cap: number) =>
      sql`insert into bench_allocations (booking_id, builder_id, day, hours, day_capacity) values (${b.id}, ${master}, ${monday}, numrange(${from}, ${to}), ${cap})`.execute(
        t.db,
      );
    await insert(0, 3, 7);
    await expect(insert(2, 4, 7)).rejects.toMatchObject({ code: '23P01' });
    await expect(insert(3, 8, 7)).rejects.toMatchObject({ code: '23514' });
    await expect(insert(3, 7, 7)).resolves.toBeDefined();
  });
});
