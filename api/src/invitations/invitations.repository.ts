import { Injectable } from '@nestjs/common';
import type { BuilderLevel, WeeklyHours } from '@loomwright/shared';
import { Database, Executor } from '../database/database';

@Injectable()
export class InvitationsRepository {
  constructor(private readonly db: Database) {}

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
    return trx
      .selectFrom('builders')
      .innerJoin('users', 'users.id', 'builders.user_id')
      .select([
        'builders.id',
        'builders.level',
        'builders.hourly_rate',
        'users.id as user_id',
        'users.email',
        'users.name',
        'users.password_hash',
      ])
      .where('builders.id', '=', builderId)
      .forUpdate('builders')
      .executeTakeFirst();
  }

  updateBuilder(userId: string, values: { level: BuilderLevel; hourlyRate: string }, trx: Executor = this.db) {
    return trx
      .updateTable('builders')
      .set({ level: values.level, hourly_rate: values.hourlyRate })
      .where('user_id', '=', userId)
      .returning(['id'])
      .executeTakeFirst();
  }
}
