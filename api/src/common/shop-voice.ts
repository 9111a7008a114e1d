import { shopFormat, type ShopFormat } from '@loomwright/shared';
import type { Executor } from '../database/database';

/**
 * The shop's own formatter (its locale, currency and time zone from settings) for words the API
 * writes into history lines and refusals, so they read as the apps and the mails do.
 */
export async function shopFormatOf(trx: Executor): Promise<ShopFormat> {
  const row = await trx.selectFrom('shop_settings').select(['locale', 'currency', 'timezone']).where('id', '=', 1).executeTakeFirst();
  return shopFormat(row ? { locale: row.locale, currency: row.currency.trim(), timeZone: row.timezone } : {});
}

/** A calendar day with its year, in the shop's voice: "Tue, Jan 12, 2027", "Di., 12. Jan. 2027". */
export const dayWords = (f: ShopFormat, day: string) => f.day(day, { year: 'always' });

/**
 * An amount that carries its own currency (a payment row, a letter's data) in a voice: "$220.99".
 * The one money helper for the API's words; the default voice is the shared formatter's (en-US).
 */
export const moneyOf = (held: { amount: string; currency: string }, f: ShopFormat = shopFormat()) =>
  f.money(held.amount, held.currency.trim());
