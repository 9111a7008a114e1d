import { Injectable } from '@nestjs/common';
import type { Kysely } from 'kysely';
import { Database, DB } from '../database/database';

@Injectable()
export class ShopRepository {
  constructor(private readonly db: Database) {}

  findSettings(trx: Kysely<DB> = this.db) {
    return trx.selectFrom('shop_settings').selectAll().where('id', '=', 1).executeTakeFirst();
  }
}
