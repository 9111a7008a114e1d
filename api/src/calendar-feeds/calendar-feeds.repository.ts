import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { BookingsRepository, quotedHoursOf } from '../bookings/bookings.repository';
import { benchDaysOf } from '../bench/bench.repository';
import { Database, type Executor } from '../database/database';

/** States in which a build holds (or held) a place on the bench. */
const ON_THE_CALENDAR = ['scheduled', 'pedals_received', 'on_bench', 'testing', 'ready', 'delivered'];

@Injectable()
export class CalendarFeedsRepository {
  constructor(
    private readonly db: Database,
    private readonly bookings: BookingsRepository,
  ) {}

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
    let q = this.bookings
      .withPeopleNamed(trx)
      .select([
        'b.bench_date',
        'b.expected_completion',
        'b.calendar_sequence',
        'b.updated_at',
        'bu.name as builder_name',
        quotedHoursOf('b.id').as('quoted_hours'),
        benchDaysOf('b.id').as('days'),
      ])
      .where(sql<boolean>`b.state::text in (${sql.join(ON_THE_CALENDAR)})`)
      .where('b.bench_date', 'is not', null)
      .where(sql<boolean>`coalesce(b.expected_completion, b.bench_date) >= ${since}::date`)
      .orderBy('b.bench_date')
      .orderBy('b.reference');
    if (builderId) q = q.where('b.builder_id', '=', builderId);
    return q.execute();
  }

  shop(trx: Executor = this.db) {
    return trx.selectFrom('shop_settings').select(['name', 'timezone']).where('id', '=', 1).executeTakeFirstOrThrow();
  }
}
