import { Injectable } from '@nestjs/common';
import type { Insertable, Updateable } from 'kysely';
import { Database, Executor, UsersTable } from '../database/database';

@Injectable()
export class UsersRepository {
  constructor(private readonly db: Database) {}

  findByEmail(email: string, trx: Executor = this.db) {
    return trx.selectFrom('users').selectAll().where('email', '=', email.trim()).executeTakeFirst();
  }

  findById(id: string, trx: Executor = this.db) {
    return trx.selectFrom('users').selectAll().where('id', '=', id).executeTakeFirst();
  }

  insert(values: Insertable<UsersTable>, trx: Executor = this.db) {
    return trx.insertInto('users').values(values).returningAll().executeTakeFirstOrThrow();
  }

  update(id: string, values: Updateable<UsersTable>, trx: Executor = this.db) {
    return trx.updateTable('users').set(values).where('id', '=', id).returningAll().executeTakeFirst();
  }
}
