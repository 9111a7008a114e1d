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

  updateBuilder(userId: string, values: { level: BuilderLevel; hourlyRate: string }, trx: Executor = this.db) {
    return trx
      .updateTable('builders')
      .set({ level: values.level, hourly_rate: values.hourlyRate })
      .where('user_id', '=', userId)
      .returning(['id'])
      .executeTakeFirst();
  }
}
