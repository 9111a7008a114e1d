import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { BookingsRepository, quotedHoursOf } from '../bookings/bookings.repository';
import { benchDaysOf, holdsBenchTimeIn } from '../bench/bench.repository';
import { Database, type Executor } from '../database/database';

/** States in which a build is the bench's business: booked in, being built, or built and not yet gone. */
export const ACTIVE_STATES = ['scheduled', 'pedals_received', 'on_bench', 'testing', 'ready'] as const;

/** The rows Today reads: a read model over bookings (through their owner's repository), bench time, hours and approvals. */
@Injectable()
export class TodayRepository {
  constructor(
    private readonly db: Database,
    private readonly bookings: BookingsRepository,
  ) {}

  builderIdOf(userId: string, trx: Executor = this.db) {
    return trx.selectFrom('builders').select('id').where('user_id', '=', userId).executeTakeFirst();
  }

  /** Active builds with bench hours in the week, and the ready ones; one builder's, or every one. */
  builds(week: { today: string; start: string; end: string }, builderId: string | undefined, trx: Executor = this.db) {
    let q = this.bookings
      .withPeopleNamed(trx)
      .select([
        'b.builder_id',
        'b.inbound_carrier',
        'b.inbound_tracking',
        'b.awaiting_layout_approval',
        'bu.name as builder_name',
        benchDaysOf('b.id', { from: week.start, to: week.end }).as('bench_days'),
        sql<string>`coalesce((select sum(t.hours) from time_entries t where t.booking_id = b.id and t.worked_on = ${week.today}::date), 0)::text`.as(
          'recorded_today',
        ),
        sql<string>`coalesce((select sum(t.hours) from time_entries t where t.booking_id = b.id), 0)::text`.as('recorded_hours'),
        quotedHoursOf('b.id').as('quoted_hours'),
        sql<number>`(select count(*)::int from layout_approvals la where la.booking_id = b.id and la.status = 'waiting')`.as(
          'waiting_layouts',
        ),
        sql<number>`(select count(*)::int from booking_extras e where e.booking_id = b.id and e.status = 'proposed')`.as('proposed_extras'),
      ])
      .where(sql<boolean>`b.state::text in (${sql.join([...ACTIVE_STATES])})`)
      .where((eb) => eb.or([eb('b.state', '=', 'ready'), holdsBenchTimeIn('b.id', { from: week.start, to: week.end })]));
    if (builderId) q = q.where('b.builder_id', '=', builderId);
    return q.orderBy('b.reference').execute();
  }
}
