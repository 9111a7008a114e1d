import type { ColumnType, Generated, JSONColumnType } from 'kysely';
import { Kysely } from 'kysely';

/**
 * The typed shape of every table. Each domain adds its tables here beside its migration.
 * numeric and bigint columns arrive from pg as strings: money stays a decimal string until decimal.js.
 */
export type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;

export interface ShopSettingsTable {
  id: Generated<number>;
  name: string;
  tagline: string;
  currency: string;
  country_code: string;
  timezone: string;
  contact_email: string;
  updated_at: Generated<Timestamp>;
}

export interface DB {
  shop_settings: ShopSettingsTable;
}

/** The database as its own DI token: inject `Database` anywhere a Kysely instance is needed. */
export class Database extends Kysely<DB> {}

export type { JSONColumnType };
