import { Injectable } from '@nestjs/common';
import { sql, type Updateable } from 'kysely';
import { Database, Executor, type ShopSettingsTable } from '../database/database';

@Injectable()
export class SettingsRepository {
  constructor(private readonly db: Database) {}

  find(trx: Executor = this.db) {
    return trx.selectFrom('shop_settings').selectAll().where('id', '=', 1).executeTakeFirst();
  }

  update(trx: Executor, values: Updateable<ShopSettingsTable>) {
    return trx
      .updateTable('shop_settings')
      .set({ ...values, updated_at: sql`now()` } as unknown as Updateable<ShopSettingsTable>)
      .where('id', '=', 1)
      .returningAll()
      .executeTakeFirst();
  }

  closures(trx: Executor = this.db) {
    return trx.selectFrom('shop_closures').selectAll().orderBy('starts_on').execute();
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

  /** The latest choice per public holiday of a country (the table keeps every earlier one). */
  latestHolidayChoices(trx: Executor, countryCode: string) {
    return trx
      .selectFrom('shop_holiday_choices as h')
      .leftJoin('users as u', 'u.id', 'h.decided_by')
      .distinctOn('h.day')
      .select(['h.day', 'h.holiday_name', 'h.shop_works', 'h.decided_at', 'u.name as decided_by_name'])
      .where('h.country_code', '=', countryCode)
      .orderBy('h.day')
      .orderBy('h.decided_at', 'desc')
      .orderBy('h.id', 'desc')
      .execute();
  }

  /** Every choice about holidays of a country, newest first. */
  holidayHistory(trx: Executor, countryCode: string, limit: number) {
    return trx
      .selectFrom('shop_holiday_choices as h')
      .leftJoin('users as u', 'u.id', 'h.decided_by')
      .select(['h.day', 'h.holiday_name', 'h.shop_works', 'h.decided_at', 'u.name as decided_by_name'])
      .where('h.country_code', '=', countryCode)
      .orderBy('h.decided_at', 'desc')
      .orderBy('h.id', 'desc')
      .limit(limit)
      .execute();
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

  /** Builds that already hold bench time inside a date range (a new closure does not move them). */
  buildsWithBenchTimeBetween(trx: Executor, from: string, to: string) {
    return trx
      .selectFrom('bench_allocations as a')
      .innerJoin('bookings as b', 'b.id', 'a.booking_id')
      .select(['b.id', 'b.reference', sql<string[]>`array_agg(distinct a.day::text order by a.day::text)`.as('days')])
      .where('a.day', '>=', from)
      .where('a.day', '<=', to)
      .groupBy(['b.id', 'b.reference'])
      .orderBy('b.reference')
      .execute();
  }
}
