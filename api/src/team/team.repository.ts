import { Injectable } from '@nestjs/common';
import { sql, type Updateable } from 'kysely';
import { Database, Executor, type BuildersTable } from '../database/database';

@Injectable()
export class TeamRepository {
  constructor(private readonly db: Database) {}

  list(trx: Executor = this.db) {
    return trx
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
        // Joined: the invitation was accepted and a password chosen. Until then the person is "invited".
        sql<boolean>`users.password_hash is not null`.as('joined'),
        (eb) =>
          eb
            .selectFrom('auth_tokens')
            .select((t) => t.fn.max('auth_tokens.expires_at').as('expires_at'))
            .whereRef('auth_tokens.user_id', '=', 'users.id')
            .where('auth_tokens.purpose', '=', 'staff_invite')
            .where('auth_tokens.used_at', 'is', null)
            .as('invitation_expires_at'),
      ])
      .orderBy('builders.active', 'desc')
      .orderBy('users.name')
      .execute();
  }

  update(trx: Executor, builderId: string, values: Updateable<BuildersTable>) {
    return trx.updateTable('builders').set(values).where('id', '=', builderId).returning('id').executeTakeFirst();
  }

  absences(trx: Executor = this.db) {
    return trx.selectFrom('builder_absences').select(['id', 'builder_id', 'starts_on', 'ends_on', 'reason']).orderBy('starts_on').execute();
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

  /** Builds holding this builder's bench time between two days: the ones an absence hits. */
  buildsOfBuilderBetween(trx: Executor, builderId: string, from: string, to: string) {
    return trx
      .selectFrom('bench_allocations as a')
      .innerJoin('bookings as b', 'b.id', 'a.booking_id')
      .select(['b.id', 'b.reference', sql<string[]>`array_agg(distinct a.day::text order by a.day::text)`.as('days')])
      .where('a.builder_id', '=', builderId)
      .where('a.day', '>=', from)
      .where('a.day', '<=', to)
      .groupBy(['b.id', 'b.reference'])
      .orderBy('b.reference')
      .execute();
  }
}
