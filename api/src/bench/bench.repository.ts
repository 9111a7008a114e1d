import { Injectable } from '@nestjs/common';
import { sql, type Updateable } from 'kysely';
import { jsonArrayFrom, jsonObjectFrom } from 'kysely/helpers/postgres';
import type { BuilderLevel, WeeklyHours } from '@loomwright/shared';
import { BookingsRepository } from '../bookings/bookings.repository';
import { Database, Executor, type BuildersTable } from '../database/database';

/**
 * A booking's booked bench days as a column of a query over bookings (`booking` names its id column):
 * each day (YYYY-MM-DD) with its hours, in day order, `[]` when it holds none; only the days of
 * `range` when one is given.
 */
export const benchDaysOf = (booking: string, range?: { from: string; to: string }) =>
  sql<Array<{ day: string; hours: string }>>`coalesce((
    select json_agg(json_build_object('day', a.day::text, 'hours', (upper(a.hours) - lower(a.hours))::text) order by a.day)
    from bench_allocations a where a.booking_id = ${sql.ref(booking)}${range ? sql` and a.day between ${range.from}::date and ${range.to}::date` : sql``}), '[]'::json)`;

/** Whether a booking holds bench time on a day of `range`, as a condition of a query over bookings. */
export const holdsBenchTimeIn = (booking: string, range: { from: string; to: string }) =>
  sql<boolean>`exists (select 1 from bench_allocations a where a.booking_id = ${sql.ref(booking)} and a.day between ${range.from}::date and ${range.to}::date)`;

@Injectable()
export class BenchRepository {
  constructor(
    private readonly db: Database,
    private readonly bookings: BookingsRepository,
  ) {}

  /** The newest estimate quote of a booking (through its owner, the bookings repository). */
  latestEstimateQuote(trx: Executor, bookingId: string) {
    return this.bookings.latestQuote(trx, bookingId, 'estimate');
  }

  /** Builders with their accounts, as every list of the team shows them; callers add columns, filters and order. */
  buildersWithAccounts(trx: Executor = this.db) {
    return (
      trx
        .selectFrom('builders')
        // Each builder's account found by its key. A plain join let the planner hash every user (a
        // shop's thousands of customers) to name twenty builders; a lateral subquery with a limit is
        // never flattened into a join, so it stays one index lookup per builder. It keeps the name
        // `users`, so callers filter and order on `users.name` and `users.password_hash` as before.
        .innerJoinLateral(
          (eb) =>
            eb
              .selectFrom('users')
              .select(['users.id', 'users.name', 'users.email', 'users.password_hash'])
              .whereRef('users.id', '=', 'builders.user_id')
              .limit(1)
              .as('users'),
          (join) => join.onTrue(),
        )
        .select([
          'builders.id',
          'builders.user_id',
          'users.name',
          'users.email',
          'builders.level',
          'builders.hourly_rate',
          'builders.weekly_hours',
          'builders.active',
          // "Joined": the invitation was accepted and a password set; a pending invitation takes no builds.
          sql<boolean>`users.password_hash is not null`.as('joined'),
        ])
    );
  }

  listBuilders(trx: Executor = this.db, filter: { builderId?: string; activeOnly?: boolean } = {}) {
    let q = this.buildersWithAccounts(trx).orderBy('users.name');
    if (filter.builderId) q = q.where('builders.id', '=', filter.builderId);
    if (filter.activeOnly) q = q.where('builders.active', '=', true).where('users.password_hash', 'is not', null);
    return q.execute();
  }

  /**
   * Locks the builder's row until the transaction ends, so acceptances for one builder take their
   * bench time one after another; the exclusion constraint stays the final guard.
   */
  lockBuilder(trx: Executor, builderId: string) {
    return this.buildersWithAccounts(trx).where('builders.id', '=', builderId).forNoKeyUpdate('builders').executeTakeFirst();
  }

  closures(trx: Executor = this.db) {
    return trx.selectFrom('shop_closures').selectAll().orderBy('starts_on').execute();
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

  /**
   * What every plan reads about the shop's calendar, in one statement: the settings, the closures,
   * each builder's absences, and the public holidays the owner chose to work (the latest choice per
   * day, for the settings' country). Dates come as 'YYYY-MM-DD', as the date parser gives them.
   */
  calendarFacts(trx: Executor = this.db) {
    const day = (column: string) => sql<string>`to_char(${sql.ref(column)}, 'YYYY-MM-DD')`;
    return trx
      .selectNoFrom((eb) => [
        jsonObjectFrom(eb.selectFrom('shop_settings').select(['country_code', 'timezone', 'currency']).where('id', '=', 1)).as('settings'),
        jsonArrayFrom(
          eb
            .selectFrom('shop_closures')
            .select([day('starts_on').as('starts_on'), day('ends_on').as('ends_on'), 'reason'])
            .orderBy('starts_on'),
        ).as('closures'),
        jsonArrayFrom(
          eb
            .selectFrom('builder_absences')
            .select(['builder_id', day('starts_on').as('starts_on'), day('ends_on').as('ends_on'), 'reason'])
            .orderBy('starts_on'),
        ).as('absences'),
        jsonArrayFrom(
          eb
            .selectFrom((inner) =>
              inner
                .selectFrom('shop_holiday_choices')
                .distinctOn('day')
                .select(['day', 'shop_works'])
                .where('country_code', '=', sql<string>`coalesce((select country_code from shop_settings where id = 1), 'US')`)
                .orderBy('day')
                .orderBy('decided_at', 'desc')
                .orderBy('id', 'desc')
                .as('latest'),
            )
            .select(day('latest.day').as('day'))
            .where('latest.shop_works', '=', true),
        ).as('worked_holidays'),
      ])
      .executeTakeFirstOrThrow();
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

  /**
   * Every slice a builder holds from `from` on, for planning a build (leaving out the build being
   * moved), its ends in centihours (slices hold two decimals, so hundredths are whole numbers).
   */
  allocationsFrom(trx: Executor, builderId: string, from: string, exceptBookingId?: string) {
    let q = this.slicesFrom(trx, from).where('builder_id', '=', builderId);
    if (exceptBookingId) q = q.where('booking_id', '!=', exceptBookingId);
    return q.execute();
  }

  /**
   * Every slice of every builder from `from` on, for the bench held in memory (BenchCache). With a
   * busy bench nearly every slice lies ahead, and PostgreSQL reads the table whole (35 pages for a year).
   */
  allocationsFromDay(trx: Executor, from: string) {
    return this.slicesFrom(trx, from).execute();
  }

  private slicesFrom(trx: Executor, from: string) {
    return trx
      .selectFrom('bench_allocations')
      .select([
        'builder_id',
        'day',
        'booking_id',
        sql<number>`(lower(hours) * 100)::int`.as('from_centihours'),
        sql<number>`(upper(hours) * 100)::int`.as('to_centihours'),
      ])
      .where('day', '>=', from);
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

  /** A booking with its player, for planning its bench time (its estimate is the bookings repository's `latestQuote`). */
  findBookingForPlanning(trx: Executor, bookingId: string) {
    return this.bookings
      .withPeopleNamed(trx)
      .select(['b.customer_id', 'b.configuration', 'b.bench_date', 'b.builder_id', 'c.email as customer_email'])
      .where('b.id', '=', bookingId)
      .executeTakeFirst();
  }

  // The team's and the settings' writes: the bench owns who builds, when they are away and when the shop is shut.

  insertBuilder(values: { userId: string; level: BuilderLevel; hourlyRate: string; weeklyHours: WeeklyHours }, trx: Executor = this.db) {
    return trx
      .insertInto('builders')
      .values({
        user_id: values.userId,
        level: values.level,
        hourly_rate: values.hourlyRate,
        weekly_hours: JSON.stringify(values.weeklyHours),
      })
      .returning(['id'])
      .executeTakeFirstOrThrow();
  }

  /** The builder's row and account, locked so two resends of one invitation go one after the other. */
  lockInvitedBuilder(builderId: string, trx: Executor) {
    return this.buildersWithAccounts(trx)
      .select('users.password_hash')
      .where('builders.id', '=', builderId)
      .forUpdate('builders')
      .executeTakeFirst();
  }

  /** Level and rate of the builder row of an account (a re-sent invitation may change them). */
  updateBuilderOfUser(userId: string, values: { level: BuilderLevel; hourlyRate: string }, trx: Executor = this.db) {
    return trx
      .updateTable('builders')
      .set({ level: values.level, hourly_rate: values.hourlyRate })
      .where('user_id', '=', userId)
      .returning(['id'])
      .executeTakeFirst();
  }

  updateBuilder(trx: Executor, builderId: string, values: Updateable<BuildersTable>) {
    return trx.updateTable('builders').set(values).where('id', '=', builderId).returning('id').executeTakeFirst();
  }

  insertAbsence(trx: Executor, values: { builderId: string; startsOn: string; endsOn: string; reason: string }) {
    return trx
      .insertInto('builder_absences')
      .values({ builder_id: values.builderId, starts_on: values.startsOn, ends_on: values.endsOn, reason: values.reason })
      .returning(['id', 'builder_id', 'starts_on', 'ends_on', 'reason'])
      .executeTakeFirstOrThrow();
  }

  deleteAbsence(trx: Executor, id: string) {
    return trx.deleteFrom('builder_absences').where('id', '=', id).returning('id').executeTakeFirst();
  }

  insertClosure(trx: Executor, values: { startsOn: string; endsOn: string; reason: string }) {
    return trx
      .insertInto('shop_closures')
      .values({ starts_on: values.startsOn, ends_on: values.endsOn, reason: values.reason })
      .returningAll()
      .executeTakeFirstOrThrow();
  }

  deleteClosure(trx: Executor, id: string) {
    return trx.deleteFrom('shop_closures').where('id', '=', id).returning('id').executeTakeFirst();
  }

  /** Every choice about holidays of a country with who made it: the latest per day, or the newest `limit` of all. */
  holidayChoices(trx: Executor, countryCode: string, pick: { latestPerDay: true } | { newest: number }) {
    const q = trx
      .selectFrom('shop_holiday_choices as h')
      .leftJoin('users as u', 'u.id', 'h.decided_by')
      .select(['h.day', 'h.holiday_name', 'h.shop_works', 'h.decided_at', 'u.name as decided_by_name'])
      .where('h.country_code', '=', countryCode);
    if ('latestPerDay' in pick) {
      // The table keeps every earlier choice; the newest per day is the one in force.
      return q.distinctOn('h.day').orderBy('h.day').orderBy('h.decided_at', 'desc').orderBy('h.id', 'desc').execute();
    }
    return q.orderBy('h.decided_at', 'desc').orderBy('h.id', 'desc').limit(pick.newest).execute();
  }

  insertHolidayChoice(trx: Executor, values: { countryCode: string; day: string; name: string; shopWorks: boolean; decidedBy: string }) {
    return trx
      .insertInto('shop_holiday_choices')
      .values({
        country_code: values.countryCode,
        day: values.day,
        holiday_name: values.name,
        shop_works: values.shopWorks,
        decided_by: values.decidedBy,
      })
      .returning(['day', 'holiday_name', 'shop_works', 'decided_at'])
      .executeTakeFirstOrThrow();
  }

  /** Serialises choices about one day so two clicks at once leave one row each way, not a race. */
  lockHolidayDay(trx: Executor, countryCode: string, day: string) {
    return sql`select pg_advisory_xact_lock(hashtext(${`holiday:${countryCode}:${day}`}))`.execute(trx);
  }

  /** Builds holding bench time between two days, the whole shop's or one builder's: the ones a closure or an absence hits. */
  buildsWithBenchTimeBetween(trx: Executor, from: string, to: string, builderId?: string) {
    return this.bookings
      .withPeople(trx)
      .innerJoin('bench_allocations as a', 'a.booking_id', 'b.id')
      .select(['b.id', 'b.reference', sql<string[]>`array_agg(distinct a.day::text order by a.day::text)`.as('days')])
      .where('a.day', '>=', from)
      .where('a.day', '<=', to)
      .$if(builderId !== undefined, (q) => q.where('a.builder_id', '=', builderId!))
      .groupBy(['b.id', 'b.reference'])
      .orderBy('b.reference')
      .execute();
  }
}
