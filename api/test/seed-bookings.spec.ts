import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BenchSuggestResponse } from '@loomwright/shared';
import { seedBookings } from '../src/database/seed/seed-bookings';
import { signIn } from './support/bench-fixtures';
import { createTestApp, type TestApp } from './support/test-app';

describe('demo bookings seed step', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t.close());

  it('seeds a consistent queue once, and a second run changes nothing', async () => {
    await seedBookings(t.db, { evenInTests: true });
    const count = async (table: 'bookings' | 'quotes' | 'bench_allocations' | 'booking_events' | 'payments') =>
      Number(
        (
          await t.db
            .selectFrom(table)
            .select(sql<string>`count(*)`.as('n'))
            .executeTakeFirstOrThrow()
        ).n,
      );
    const before = {
      bookings: await count('bookings'),
      quotes: await count('quotes'),
      slices: await count('bench_allocations'),
      events: await count('booking_events'),
      payments: await count('payments'),
    };
    await seedBookings(t.db, { evenInTests: true });
    expect({
      bookings: await count('bookings'),
      quotes: await count('quotes'),
      slices: await count('bench_allocations'),
      events: await count('booking_events'),
      payments: await count('payments'),
    }).toEqual(before);

    const rows = await t.db
      .selectFrom('bookings')
      .select(['reference', 'state', 'bench_date', 'builder_id'])
      .orderBy('reference')
      .execute();
    expect(rows.map((r) => [r.reference, r.state])).toEqual([
      ['LW-0901', 'requested'],
      ['LW-0902', 'deposit_paid'],
      ['LW-0903', 'deposit_paid'],
      ['LW-0904', 'scheduled'],
      ['LW-0905', 'on_bench'],
      ['LW-0906', 'delivered'],
    ]);
    for (const r of rows.filter((r) => ['scheduled', 'on_bench', 'delivered'].includes(r.state))) expect(r.bench_date).not.toBeNull();
    // Every scheduled build's slices add up to its firm quote's hours.
    const check = await sql<{ reference: string; booked: string; planned: string }>`
      select b.reference, sum(upper(a.hours) - lower(a.hours))::numeric(8,2)::text as booked, q.labor_hours::text as planned
      from bookings b join bench_allocations a on a.booking_id = b.id join quotes q on q.booking_id = b.id and q.kind = 'firm'
      group by b.reference, q.labor_hours order by b.reference`.execute(t.db);
    expect(check.rows).toHaveLength(3);
    for (const r of check.rows) expect(r.booked).toBe(r.planned);

    // The history reads like a real queue: every step in the past, in order, the request first;
    // a build on the bench was requested before its bench date and reached the bench on or after it.
    const events = await t.db
      .selectFrom('booking_events')
      .innerJoin('bookings', 'bookings.id', 'booking_events.booking_id')
      .select([
        'bookings.reference',
        'bookings.created_at as requested_at',
        'bookings.bench_date',
        'booking_events.to_state',
        'booking_events.created_at',
      ])
      .orderBy('booking_events.id')
      .execute();
    const now = Date.now();
    for (const reference of rows.map((r) => r.reference)) {
      const mine = events.filter((e) => e.reference === reference);
      const times = mine.map((e) => e.created_at.getTime());
      expect(times, reference).toEqual([...times].sort((a, b) => a - b));
      expect(Math.max(...times), reference).toBeLessThan(now);
      expect(mine[0]!.created_at.getTime(), reference).toBe(mine[0]!.requested_at.getTime());
      const benchDate = mine[0]!.bench_date;
      if (benchDate) {
        expect(mine[0]!.created_at.toISOString().slice(0, 10) < benchDate, reference).toBe(true);
        const onBench = mine.find((e) => e.to_state === 'on_bench');
        if (onBench) expect(onBench.created_at.toISOString().slice(0, 10) >= benchDate, reference).toBe(true);
      }
    }
  });

  it('leaves a paid request that a builder can accept at the suggested date', async () => {
    const builder = await signIn(t.app, 'builder@shop.example');
    const b = await t.db.selectFrom('bookings').select('id').where('reference', '=', 'LW-0903').executeTakeFirstOrThrow();
    const suggest = (await builder.get(`/api/bench/suggest?bookingId=${b.id}`).expect(200)).body as BenchSuggestResponse;
    const mine = suggest.suggestions.find((s) => s.builder.isMe)!;
    const res = await builder
      .post(`/api/bookings/${b.id}/accept`)
      .send({ builderId: mine.builder.id, benchDate: mine.benchDate })
      .expect(200);
    expect(res.body.expectedCompletion).toBe(mine.expectedCompletion);
    expect(res.body.firmQuote.total).toBe(mine.firmTotal);
  });
});
