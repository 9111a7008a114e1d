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
}
