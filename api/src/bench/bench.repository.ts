import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { Database, Executor } from '../database/database';

@Injectable()
export class BenchRepository {
  constructor(private readonly db: Database) {}

  listBuilders(trx: Executor = this.db, filter: { builderId?: string; activeOnly?: boolean } = {}) {
    // "Joined": the invitation was accepted and a password set; a pending invitation takes no builds.
    let q = trx
      .selectFrom('builders')
      .innerJoin('users', 'users.id', 'builders.user_id')
      .select([
        'builders.id',
        'builders.user_id',
        'users.name',
        'users.email',
        'builders.level',
        'builders.hourly_rate',
        'builders.weekly_hours',
        'builders.active',
        sql<boolean>`users.password_hash is not null`.as('joined'),
      ])
      .orderBy('users.name');
    if (filter.builderId) q = q.where('builders.id', '=', filter.builderId);
    if (filter.activeOnly) q = q.where('builders.active', '=', true).where('users.password_hash', 'is not', null);
    return q.execute();
  }

  /**
   * Locks the builder's row until the transaction ends, so acceptances for one builder take their
   * bench time one after another; the exclusion constraint stays the final guard.
   */
  lockBuilder(trx: Executor, builderId: string) {
    return trx
      .selectFrom('builders')
      .innerJoin('users', 'users.id', 'builders.user_id')
      .select([
        'builders.id',
        'builders.user_id',
        'users.name',
        'builders.level',
        'builders.hourly_rate',
        'builders.weekly_hours',
        'builders.active',
        sql<boolean>`users.password_hash is not null`.as('joined'),
      ])
      .where('builders.id', '=', builderId)
      .forNoKeyUpdate('builders')
      .executeTakeFirst();
  }

  closures(trx: Executor = this.db) {
    return trx.selectFrom('shop_closures').select(['starts_on', 'ends_on', 'reason']).orderBy('starts_on').execute();
  }

  absences(trx: Executor = this.db) {
    return trx.selectFrom('builder_absences').select(['id', 'builder_id', 'starts_on', 'ends_on', 'reason']).orderBy('starts_on').execute();
  }

  /** Hours recorded against builds per builder and day (time entries), for "recorded against planned". */
  recordedHoursBetween(trx: Executor, builderIds: string[], from: string, to: string) {
    if (builderIds.length === 0) return Promise.resolve([]);
    return trx
      .selectFrom('time_entries')
      .select(['builder_id', 'worked_on', sql<string>`sum(hours)::text`.as('hours')])
      .where('builder_id', 'in', builderIds)
      .where('worked_on', '>=', from)
      .where('worked_on', '<=', to)
      .groupBy(['builder_id', 'worked_on'])
      .execute();
  }

  /** Public holidays of a country the owner switched off (latest choice per day says the shop works). */
  async workedHolidays(trx: Executor, countryCode: string): Promise<string[]> {
    const rows = await trx
      .selectFrom('shop_holiday_choices')
      .distinctOn('day')
      .select(['day', 'shop_works'])
      .where('country_code', '=', countryCode)
      .orderBy('day')
      .orderBy('decided_at', 'desc')
      .orderBy('id', 'desc')
      .execute();
    return rows.filter((r) => r.shop_works).map((r) => r.day);
  }

  shopSettings(trx: Executor = this.db) {
    return trx.selectFrom('shop_settings').select(['country_code', 'timezone', 'currency']).where('id', '=', 1).executeTakeFirst();
  }

  /** Slices of bench time with the build each belongs to, for the calendar. */
  allocationsBetween(trx: Executor, builderIds: string[], from: string, to: string) {
    if (builderIds.length === 0) return Promise.resolve([]);
    return trx
      .selectFrom('bench_allocations as a')
      .innerJoin('bookings as b', 'b.id', 'a.booking_id')
      .innerJoin('users as c', 'c.id', 'b.customer_id')
      .select([
        'a.builder_id',
        'a.day',
        'a.booking_id',
        'b.reference',
        'b.state',
        'b.bench_date',
        'c.name as customer_name',
        sql<string>`lower(a.hours)`.as('lower'),
        sql<string>`upper(a.hours)`.as('upper'),
      ])
      .where('a.builder_id', 'in', builderIds)
      .where('a.day', '>=', from)
      .where('a.day', '<=', to)
      .orderBy('a.day')
      .orderBy(sql`lower(a.hours)`)
      .execute();
  }

  /** Every slice a builder holds from `from` on, for planning a build (leaving out the build being moved). */
  allocationsFrom(trx: Executor, builderId: string, from: string, exceptBookingId?: string) {
    let q = trx
      .selectFrom('bench_allocations')
      .select(['day', 'booking_id', sql<string>`lower(hours)`.as('lower'), sql<string>`upper(hours)`.as('upper')])
      .where('builder_id', '=', builderId)
      .where('day', '>=', from);
    if (exceptBookingId) q = q.where('booking_id', '!=', exceptBookingId);
    return q.execute();
  }

  /**
   * As allocationsFrom, for several builders in one query (the lead time and the suggestions plan
   * every eligible builder at once; one query each was most of their time with a year of data).
   */
  allocationsFromEach(trx: Executor, builderIds: readonly string[], from: string, exceptBookingId?: string) {
    if (builderIds.length === 0) return Promise.resolve([]);
    let q = trx
      .selectFrom('bench_allocations')
      .select(['builder_id', 'day', 'booking_id', sql<string>`lower(hours)`.as('lower'), sql<string>`upper(hours)`.as('upper')])
      .where('builder_id', 'in', builderIds)
      .where('day', '>=', from);
    if (exceptBookingId) q = q.where('booking_id', '!=', exceptBookingId);
    return q.execute();
  }

  /** A build's own slices, day by day. */
  allocationsOf(trx: Executor, bookingId: string) {
    return trx
      .selectFrom('bench_allocations')
      .select(['builder_id', 'day', sql<string>`upper(hours) - lower(hours)`.as('length')])
      .where('booking_id', '=', bookingId)
      .orderBy('day')
      .execute();
  }

  /** Frees a build's bench time after `day` (it finished early); returns the slices freed. */
  deleteAllocationsAfter(trx: Executor, bookingId: string, day: string) {
    return trx
      .deleteFrom('bench_allocations')
      .where('booking_id', '=', bookingId)
      .where('day', '>', day)
      .returning(['day', sql<string>`upper(hours) - lower(hours)`.as('length')])
      .execute();
  }

  insertAllocations(
    trx: Executor,
    rows: Array<{ bookingId: string; builderId: string; day: string; from: string; to: string; dayCapacity: string }>,
  ) {
    if (rows.length === 0) return Promise.resolve([]);
    return trx
      .insertInto('bench_allocations')
      .values(
        rows.map((r) => ({
          booking_id: r.bookingId,
          builder_id: r.builderId,
          day: r.day,
          hours: sql<string>`numrange(${r.from}::numeric, ${r.to}::numeric, '[)')`,
          day_capacity: r.dayCapacity,
        })),
      )
      .returning('id')
      .execute();
  }

  deleteAllocationsOf(trx: Executor, bookingId: string) {
    return trx.deleteFrom('bench_allocations').where('booking_id', '=', bookingId).execute();
  }

  /** A booking with the estimate it was requested on (the newest estimate quote). */
  findBookingForPlanning(trx: Executor, bookingId: string) {
    return trx
      .selectFrom('bookings as b')
      .innerJoin('users as c', 'c.id', 'b.customer_id')
      .select([
        'b.id',
        'b.reference',
        'b.state',
        'b.customer_id',
        'b.configuration',
        'b.bench_date',
        'b.builder_id',
        'c.name as customer_name',
        'c.email as customer_email',
      ])
      .where('b.id', '=', bookingId)
      .executeTakeFirst();
  }

  latestEstimateQuote(trx: Executor, bookingId: string) {
    return trx
      .selectFrom('quotes')
      .selectAll()
      .where('booking_id', '=', bookingId)
      .where('kind', '=', 'estimate')
      .orderBy('created_at', 'desc')
      .limit(1)
      .executeTakeFirst();
  }
}
