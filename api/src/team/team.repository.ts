import { Injectable } from '@nestjs/common';
import type { Updateable } from 'kysely';
import { Database, Executor, type BuildersTable } from '../database/database';

@Injectable()
export class TeamRepository {
  constructor(private readonly db: Database) {}

  list(trx: Executor = this.db) {
    return trx
      .selectFrom('builders')
      .innerJoin('users', 'users.id', 'builders.user_id')
      .select(['builders.id', 'builders.user_id', 'users.name', 'users.email', 'builders.level', 'builders.hourly_rate', 'builders.weekly_hours', 'builders.active'])
      .orderBy('builders.active', 'desc')
      .orderBy('users.name')
      .execute();
  }

  update(trx: Executor, builderId: string, values: Updateable<BuildersTable>) {
    return trx.updateTable('builders').set(values).where('id', '=', builderId).returning('id').executeTakeFirst();
  }
}
