import { Client } from 'pg';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { BenchLeadTime, BenchSuggestResponse } from '@loomwright/shared';
import { BenchCache } from '../src/bench/bench-cache';
import { DatabaseChanges } from '../src/database/change-notifications';
import { ACCEPTANCE_ALLOWANCE_DAYS, BenchService } from '../src/bench/bench.service';
import { addDays, todayIn } from '../src/bench/calendar-days';
import { createBooking, signIn } from './support/bench-fixtures';
import { createTwoReplicas, type TestApp } from './support/test-app';

const LEAD = '/api/bench/lead-time?hours=7.00&level=journeyman';

/**
 * Two API processes on one database, each holding the bench (calendar, team, slices) in memory for
 * the public lead time and the accept suggestions. What one writes, the other must see as soon as
 * PostgreSQL's notification arrives, and the writer on its very next read; a write by hand reaches
 * both as well; and the held bench is read again once the shop's day turns.
 */
describe('the bench held in memory by every replica', () => {
  let first: TestApp;
  let second: TestApp;
  let databaseUrl: string;
  let raw: Client;
  const lead = async (t: TestApp, path = LEAD) => (await request(t.app.getHttpServer()).get(path).expect(200)).body as BenchLeadTime;

  beforeAll(async () => {
    ({ first, second, databaseUrl } = await createTwoReplicas());
    raw = new Client({ connectionString: databaseUrl });
    await raw.connect();
  }, 60_000);
  /** Runs `check` while another connection holds `tables` locked against every reader. */
  async function withLocked(tables: string, check: () => Promise<void>) {
    const locker = new Client({ connectionString: databaseUrl });
    await locker.connect();
    try {
      await locker.query('begin');
      await locker.query(`lock table ${tables} in access exclusive mode`);
      await check();
    } finally {
      await locker.query('rollback');
      await locker.end();
    }
  }

  afterAll(async () => {
    await raw?.end();
    await second?.close();
    await first?.close();
  });

  it('answers from memory: the lead time and a suggestion while the bench tables are locked against every reader', async () => {
    expect(first.app.get(BenchCache).isListening).toBe(true);
    expect(second.app.get(BenchCache).isListening).toBe(true);
    const booking = await createBooking(first.db, { laborHours: '7.00', minimumLevel: 'journeyman', state: 'deposit_paid' });
    const builder = await signIn(first.app, 'builder@shop.example');
    const before = (await builder.get(`/api/bench/suggest?bookingId=${booking.id}`).expect(200)).body as BenchSuggestResponse;
    const answer = await lead(first);
    // A read of any locked table would wait for the lock; the held bench does not.
    await withLocked('bench_allocations, shop_closures, builder_absences, shop_settings, shop_holiday_choices, builders', async () => {
      expect(await lead(first)).toEqual(answer);
    });
    // The suggestion still reads the booking (with its builder, if any) and its quote; the bench it plans on is held.
    await withLocked('bench_allocations, shop_closures, builder_absences, shop_holiday_choices', async () => {
      const during = await builder.get(`/api/bench/suggest?bookingId=${booking.id}`);
      expect(during.status).toBe(200);
      expect(during.body).toEqual(before);
    });
  });

  it('a closure added through one replica moves the lead time there at once, and on the other when the notification comes', async () => {
    const answer = await lead(first);
    expect(await lead(second)).toEqual(answer);
    const owner = await signIn(first.app, 'owner@shop.example');
    const day = answer.earliestBenchDate!;
    const closure = await owner.post('/api/settings/closures').send({ startsOn: day, endsOn: day, reason: 'Stocktaking' }).expect(201);
    // The writing replica: its very next read, no waiting.
    const moved = await lead(first);
    expect(moved.earliestBenchDate! > day).toBe(true);
    await expect.poll(async () => (await lead(second)).earliestBenchDate, { timeout: 5_000 }).toBe(moved.earliestBenchDate);
    // Removed through the other replica (a statement outside a transaction): back on both.
    const other = await signIn(second.app, 'owner@shop.example');
    await other.delete(`/api/settings/closures/${closure.body.id}`).send({}).expect(204);
    expect(await lead(second)).toEqual(answer);
    await expect.poll(async () => (await lead(first)).earliestBenchDate, { timeout: 5_000 }).toBe(day);
  });

  it('this process tells its copies of its own writes when they commit: never before, never on a rollback', async () => {
    const changes = first.app.get(DatabaseChanges);
    const told = vi.spyOn(changes, 'committedHere');
    try {
      const closure = { starts_on: '2031-02-03', ends_on: '2031-02-03', reason: 'Inventory' };
      await first.db.transaction().execute(async (trx) => {
        await trx.insertInto('shop_closures').values(closure).execute();
        expect(told).not.toHaveBeenCalled();
      });
      expect(told).toHaveBeenCalledTimes(1);
      expect([...told.mock.calls[0]![0]]).toEqual(['shop_closures']);
      await expect(
        first.db.transaction().execute(async (trx) => {
          await trx.deleteFrom('shop_closures').where('reason', '=', 'Inventory').execute();
          throw new Error('changed my mind');
        }),
      ).rejects.toThrow('changed my mind');
      expect(told).toHaveBeenCalledTimes(1);
      // Outside a transaction a statement commits on its own: told at once.
      await first.db.deleteFrom('shop_closures').where('reason', '=', 'Inventory').execute();
      expect(told).toHaveBeenCalledTimes(2);
      expect([...told.mock.calls[1]![0]]).toEqual(['shop_closures']);
      // A read tells nothing.
      await first.db.selectFrom('shop_closures').selectAll().execute();
      expect(told).toHaveBeenCalledTimes(2);
    } finally {
      told.mockRestore();
    }
  });

  it('writes by hand (psql, a migration) reach both: days away, builders, bench slices', async () => {
    const answer = await lead(first);
    const day = answer.earliestBenchDate!;
    await raw.query(`insert into builder_absences (builder_id, starts_on, ends_on, reason) select id, $1, $1, 'by hand' from builders`, [
      day,
    ]);
    for (const t of [first, second]) await expect.poll(async () => (await lead(t)).earliestBenchDate! > day, { timeout: 5_000 }).toBe(true);
    await raw.query(`delete from builder_absences where reason = 'by hand'`);
    for (const t of [first, second]) await expect.poll(async () => (await lead(t)).earliestBenchDate, { timeout: 5_000 }).toBe(day);

    await raw.query(`update builders set active = false where level in ('journeyman', 'master')`);
    for (const t of [first, second]) await expect.poll(async () => (await lead(t)).earliestBenchDate, { timeout: 5_000 }).toBeNull();
    expect((await lead(first)).message).toMatch(/^No journeyman builder has bench time free/);
    await raw.query(`update builders set active = true`);
    for (const t of [first, second]) await expect.poll(async () => (await lead(t)).earliestBenchDate, { timeout: 5_000 }).toBe(day);

    // Every builder's whole first day taken by one booking, written by hand in one transaction (the
    // slices already there that day are cleared first, so the day's capacity is free to fill).
    const booking = await createBooking(first.db, { laborHours: '1.00', state: 'deposit_paid' });
    await raw.query('begin');
    await raw.query('delete from bench_allocations where day = $1', [day]);
    const filled = await raw.query(
      `insert into bench_allocations (booking_id, builder_id, day, hours, day_capacity)
       select $1, b.id, $2, numrange(0, c.hours), c.hours
         from builders b, lateral (select (b.weekly_hours ->> extract(isodow from $2::date)::text)::numeric as hours) c
        where c.hours > 0`,
      [booking.id, day],
    );
    await raw.query('commit');
    expect(filled.rowCount).toBeGreaterThan(0);
    for (const t of [first, second]) await expect.poll(async () => (await lead(t)).earliestBenchDate! > day, { timeout: 5_000 }).toBe(true);
    await raw.query(`delete from bench_allocations where booking_id = $1`, [booking.id]);
    for (const t of [first, second]) await expect.poll(async () => (await lead(t)).earliestBenchDate, { timeout: 5_000 }).toBe(day);
  });

  it('reads the bench again when the shop’s day turns: tomorrow’s answer is the one a fresh read gives', async () => {
    const today = (await first.app.get(BenchService).shopCalendar()).today;
    await lead(first);
    vi.useFakeTimers({ toFake: ['Date'], now: Date.now() + 86_400_000 });
    try {
      const { timezone } = await first.app.get(BenchService).shopCalendar();
      const tomorrow = todayIn(timezone);
      expect(tomorrow).toBe(addDays(today, 1));
      const held = await lead(first);
      expect((await first.app.get(BenchService).heldBench()).shop.today).toBe(tomorrow);
      second.app.get(BenchCache).invalidate();
      expect(held).toEqual(await lead(second));
      // The player still has to pay and a builder to accept: shipping never starts before two days after the shop's today.
      expect(held.shipBy! >= addDays(tomorrow, ACCEPTANCE_ALLOWANCE_DAYS)).toBe(true);
    } finally {
      vi.useRealTimers();
    }
  });

  it('holds nothing while it cannot listen: the database is read on every call', async () => {
    const cache = first.app.get(BenchCache);
    let reads = 0;
    const load = async () => {
      reads++;
      return first.app.get(BenchService).heldBench();
    };
    cache.invalidate();
    await cache.get(load);
    await cache.get(load);
    expect(reads).toBe(1);
    // Cut the listening connection from the server's side: this process hears nothing until it is back.
    await raw.query(`select pg_terminate_backend(pid) from pg_stat_activity where datname = current_database() and query ilike 'listen%'`);
    await expect.poll(() => cache.isListening, { timeout: 5_000 }).toBe(false);
    await cache.get(load);
    await cache.get(load);
    expect(reads).toBe(3);
    expect((await lead(first)).earliestBenchDate).toMatch(/^\d{4}-\d{2}-\d{2}$/);
  });
});
