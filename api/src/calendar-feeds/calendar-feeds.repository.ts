import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { Database, type Executor } from '../database/database';

/** States in which a build holds (or held) a place on the bench. */
const ON_THE_CALENDAR = ['scheduled', 'pedals_received', 'on_bench', 'testing', 'ready', 'delivered'];

@Injectable()
export class CalendarFeedsRepository {
  constructor(private readonly db: Database) {}

  /** A feed for the shop and for every builder who has joined; missing ones are made (idempotent). */
  async ensureFeeds(trx: Executor = this.db) {
    await sql`insert into calendar_feeds (builder_id) values (null) on conflict do nothing`.execute(trx);
    await sql`insert into calendar_feeds (builder_id)
              select b.id from builders b join users u on u.id = b.user_id where u.password_hash is not null
              on conflict do nothing`.execute(trx);
  }

  list(trx: Executor = this.db) {
    return trx
      .selectFrom('calendar_feeds as f')
      .leftJoin('builders as b', 'b.id', 'f.builder_id')
      .leftJoin('users as u', 'u.id', 'b.user_id')
      .select(['f.id', 'f.builder_id', 'f.generation', 'f.rotated_at', 'u.name as builder_name', 'b.level as builder_level', 'b.user_id'])
      .orderBy(sql`f.builder_id is not null`)
      .orderBy('u.name')
      .execute();
  }

  find(id: string, trx: Executor = this.db) {
    return trx
      .selectFrom('calendar_feeds as f')
      .leftJoin('builders as b', 'b.id', 'f.builder_id')
      .leftJoin('users as u', 'u.id', 'b.user_id')
      .select(['f.id', 'f.builder_id', 'f.generation', 'f.rotated_at', 'u.name as builder_name', 'b.level as builder_level'])
      .where('f.id', '=', id)
      .executeTakeFirst();
  }

  rotate(id: string, by: string, trx: Executor = this.db) {
    return trx
      .updateTable('calendar_feeds')
      .set({ generation: sql`generation + 1`, rotated_at: new Date(), rotated_by: by })
      .where('id', '=', id)
      .returning('id')
      .executeTakeFirst();
  }

  /** Builds with a bench date from `since` on, for one builder or the whole shop, with their booked days. */
  builds(builderId: string | null, since: string, trx: Executor = this.db) {
    let q = trx
      .selectFrom('bookings as bk')
      .innerJoin('users as c', 'c.id', 'bk.customer_id')
      .leftJoin('builders as bl', 'bl.id', 'bk.builder_id')
      .leftJoin('users as bu', 'bu.id', 'bl.user_id')
      .select([
        'bk.id',
        'bk.reference',
        'bk.state',
        'bk.bench_date',
        'bk.expected_completion',
        'bk.calendar_sequence',
        'bk.updated_at',
        'c.name as customer_name',
        'bu.name as builder_name',
        sql<string | null>`(select q.labor_hours::text from quotes q where q.booking_id = bk.id
                            order by (q.kind = 'firm') desc, q.created_at desc limit 1)`.as('quoted_hours'),
        sql<Array<{ day: string; hours: string }>>`coalesce((
          select json_agg(json_build_object('day', a.day, 'hours', (upper(a.hours) - lower(a.hours))::text) order by a.day)
          from bench_allocations a where a.booking_id = bk.id), '[]'::json)`.as('days'),
      ])
      .where(sql<boolean>`bk.state::text in (${sql.join(ON_THE_CALENDAR)})`)
      .where('bk.bench_date', 'is not', null)
      .where(sql<boolean>`coalesce(bk.expected_completion, bk.bench_date) >= ${since}::date`)
      .orderBy('bk.bench_date')
      .orderBy('bk.reference');
    if (builderId) q = q.where('bk.builder_id', '=', builderId);
    return q.execute();
  }

  shop(trx: Executor = this.db) {
    return trx.selectFrom('shop_settings').select(['name', 'timezone']).where('id', '=', 1).executeTakeFirstOrThrow();
  }
}
