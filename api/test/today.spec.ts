import { sql } from 'kysely';
import { todayResponseSchema, type TodayResponse } from '@loomwright/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { addDays, todayIn } from '../src/bench/calendar-days';
import { builderId, createBooking, insertFirmQuote, signIn } from './support/bench-fixtures';
import { createTestApp, type TestApp } from './support/test-app';

/**
 * GET /api/today: a builder's builds on the bench today and this week, what each waits for and the
 * next action. The order of a build (the player ships the pedals → the shop checks them in → the
 * build → testing → ready, balance due → handed over) and "record the hours you spend each day"
 * are common practice, no published source; the money comes from the shared money facts.
 */
describe('GET /api/today', () => {
  let t: TestApp;
  let today: string;
  const ids: Record<string, string> = {};
  const used = new Map<string, number>();

  async function place(
    name: string,
    opts: {
      builder: string;
      state: 'scheduled' | 'on_bench' | 'ready';
      day: string;
      hours: string;
      tracking?: string;
      recorded?: string;
      firmTotal?: string;
    },
  ) {
    const booking = await createBooking(t.db, { laborHours: '6.00', deposit: '150.00' });
    const builder = await builderId(t.db, opts.builder);
    // A builder's hours on one day never overlap (the bench's exclusion constraint): each build takes the next slice.
    const from = used.get(`${builder}:${opts.day}`) ?? 0;
    used.set(`${builder}:${opts.day}`, from + Number(opts.hours));
    await t.db
      .updateTable('bookings')
      .set({
        state: opts.state,
        builder_id: builder,
        bench_date: opts.day,
        inbound_tracking: opts.tracking ?? null,
        inbound_carrier: opts.tracking ? 'Parcel Co-op' : null,
      })
      .where('id', '=', booking.id)
      .execute();
    await t.db
      .insertInto('bench_allocations')
      .values({
        booking_id: booking.id,
        builder_id: builder,
        day: opts.day,
        hours: sql<string>`numrange(${from}::numeric, ${from + Number(opts.hours)}::numeric)` as never,
        day_capacity: '10',
      })
      .execute();
    if (opts.recorded) {
      await t.db
        .insertInto('time_entries')
        .values({ booking_id: booking.id, builder_id: builder, worked_on: today, hours: opts.recorded })
        .execute();
    }
    if (opts.firmTotal) {
      await insertFirmQuote(t.db, booking.id, {
        laborHours: '6.00',
        hourlyRate: '100.00',
        total: opts.firmTotal,
        deposit: '150.00',
        expiresAt: new Date(Date.now() + 86_400_000),
      });
    }
    ids[name] = booking.id;
  }

  beforeAll(async () => {
    t = await createTestApp();
    const shop = await t.db.selectFrom('shop_settings').select('timezone').executeTakeFirstOrThrow();
    today = todayIn(shop.timezone);
    await place('noParcel', { builder: 'builder@shop.example', state: 'scheduled', day: today, hours: '3' });
    await place('parcelComing', { builder: 'builder@shop.example', state: 'scheduled', day: today, hours: '2', tracking: 'PC123456789' });
    await place('building', { builder: 'builder@shop.example', state: 'on_bench', day: today, hours: '4', recorded: '1.5' });
    // Ready a week ago: its bench days are past, it is listed because the balance is owed (600 − 150 deposit).
    await place('ready', { builder: 'builder@shop.example', state: 'ready', day: addDays(today, -7), hours: '2', firmTotal: '600.00' });
    await place('later', { builder: 'builder@shop.example', state: 'scheduled', day: addDays(today, 21), hours: '3' });
    await place('juniors', { builder: 'junior@shop.example', state: 'on_bench', day: today, hours: '5' });
  }, 60_000);
  afterAll(async () => t?.close());

  const byId = (body: TodayResponse) => new Map(body.builds.map((b) => [b.bookingId, b]));

  it('lists the builder’s own builds with what each waits for and the next action', async () => {
    const builder = await signIn(t.app, 'builder@shop.example');
    const answer = await builder.get('/api/today').expect(200);
    const body = todayResponseSchema.parse(answer.body);
    expect(body.scope).toBe('mine');
    expect(body.today).toBe(today);
    expect(body.hasOwnBench).toBe(true);
    const builds = byId(body);
    expect([...builds.keys()].sort()).toEqual([ids.noParcel, ids.parcelComing, ids.building, ids.ready].sort());

    const noParcel = builds.get(ids.noParcel)!;
    expect(noParcel.when).toBe('today');
    expect(noParcel.hoursToday).toBe('3.00');
    expect(noParcel.waitingFor.map((w) => w.kind)).toEqual(['parcel']);
    expect(noParcel.nextAction).toEqual({ words: 'Ask the player for the parcel’s tracking number', to: `/builds/${ids.noParcel}` });

    const coming = builds.get(ids.parcelComing)!;
    expect(coming.waitingFor).toEqual([{ kind: 'intake', words: expect.stringContaining('PC123456789') }]);
    expect(coming.nextAction.words).toMatch(/Check the parcel in/);

    const building = builds.get(ids.building)!;
    expect(building.waitingFor.map((w) => w.kind)).toEqual(['hours']);
    expect(building.recordedToday).toBe('1.50');
    expect(building.quotedHours).toBe('6.00');
    expect(building.waitingFor[0]!.words).toMatch(/4 hr planned, 1\.5 hr recorded/);

    const ready = builds.get(ids.ready)!;
    expect(ready.when).toBe('ready');
    expect(ready.benchDays).toEqual([]);
    // 600.00 firm total − 150.00 paid deposit = 450.00 owed.
    expect(ready.waitingFor).toEqual([{ kind: 'balance', words: 'The balance of $450.00' }]);
    expect(ready.nextAction.words).toMatch(/Wait for the balance/);
    // Today's builds come first, the ready one last.
    expect(body.builds.at(-1)!.bookingId).toBe(ids.ready);
  });

  it('gives the owner every builder’s builds, or only their own bench with scope=mine', async () => {
    const owner = await signIn(t.app, 'owner@shop.example');
    const all = todayResponseSchema.parse((await owner.get('/api/today').expect(200)).body);
    expect(all.scope).toBe('all');
    const builds = byId(all);
    expect(builds.get(ids.juniors)?.builderName).toBe('Pip Okonkwo-Hale');
    expect(builds.has(ids.later)).toBe(false);
    expect(builds.size).toBe(5);
    const mine = todayResponseSchema.parse((await owner.get('/api/today?scope=mine').expect(200)).body);
    expect(mine.builds.every((b) => b.builderId !== null)).toBe(true);
    if (!mine.hasOwnBench) expect(mine.builds).toEqual([]);
  });

  it('recording the day’s hours clears the hours it waited for', async () => {
    const builder = await signIn(t.app, 'builder@shop.example');
    await t.db
      .insertInto('time_entries')
      .values({ booking_id: ids.building!, builder_id: await builderId(t.db, 'builder@shop.example'), worked_on: today, hours: '2.5' })
      .execute();
    const body = todayResponseSchema.parse((await builder.get('/api/today').expect(200)).body);
    expect(byId(body).get(ids.building)!.waitingFor).toEqual([]);
    expect(byId(body).get(ids.building)!.nextAction.words).toMatch(/Keep building/);
  });

  it('refuses in words: a builder asking for everyone’s, and a scope it does not know', async () => {
    const builder = await signIn(t.app, 'builder@shop.example');
    const refused = await builder.get('/api/today?scope=all').expect(403);
    expect(refused.body).toMatchObject({
      statusCode: 403,
      code: 'forbidden',
      message: 'Only the owner sees every builder’s builds; your today shows your own',
    });
    const bad = await builder.get('/api/today?scope=everyone').expect(400);
    expect(bad.body.code).toBeDefined();
    expect(bad.body.message).toMatch(/"mine" or "all"/);
    expect((await t.http().get('/api/today')).status).toBe(401);
  });
});
