import { Injectable } from '@nestjs/common';
import { shopFormat, type ShopFormat } from '@loomwright/shared';
import { Database, type Executor } from '../database/database';

@Injectable()
export class ShopRepository {
  constructor(private readonly db: Database) {}

  findSettings(trx: Executor = this.db) {
    return trx.selectFrom('shop_settings').selectAll().where('id', '=', 1).executeTakeFirst();
  }

  /**
   * The shop's own formatter (its locale, currency and time zone from settings) for words the API
   * writes into history lines and refusals, so they read as the apps and the mails do.
   */
  async formatOf(trx: Executor = this.db): Promise<ShopFormat> {
    const row = await trx.selectFrom('shop_settings').select(['locale', 'currency', 'timezone']).where('id', '=', 1).executeTakeFirst();
    return shopFormat(row ? { locale: row.locale, currency: row.currency.trim(), timeZone: row.timezone } : {});
  }
}
