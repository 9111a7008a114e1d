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
