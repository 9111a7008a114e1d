import { sql } from 'kysely';
import { Injectable } from '@nestjs/common';
import type { PriceBook } from '@loomwright/shared';
import { Database, Executor } from '../database/database';

@Injectable()
export class PriceBookRepository {
  constructor(private readonly db: Database) {}

  findCurrent(trx: Executor = this.db) {
    return trx.selectFrom('price_book_versions').selectAll().orderBy('version', 'desc').limit(1).executeTakeFirst();
  }

  findVersion(version: number, trx: Executor = this.db) {
    return trx.selectFrom('price_book_versions').selectAll().where('version', '=', version).executeTakeFirst();
  }

  listVersions(trx: Executor = this.db) {
    return trx
      .selectFrom('price_book_versions as v')
      .leftJoin('users as u', 'u.id', 'v.published_by')
      .select(['v.version', 'v.currency', 'v.notes', 'v.published_at', 'u.name as published_by_name'])
      .orderBy('v.version', 'desc')
      .execute();
  }

  async latestVersionNumber(trx: Executor = this.db): Promise<number> {
    const row = await trx
      .selectFrom('price_book_versions')
      .select((eb) => eb.fn.max('version').as('latest'))
      .executeTakeFirst();
    return row?.latest ?? 0;
  }

  insert(values: { version: number; book: PriceBook; notes: string; publishedBy: string | null }, trx: Executor = this.db) {
    return trx
      .insertInto('price_book_versions')
      .values({
        version: values.version,
        currency: values.book.currency,
        book: JSON.stringify(values.book),
        notes: values.notes,
        published_by: values.publishedBy,
      })
      .returningAll()
      .executeTakeFirstOrThrow();
  }

  /** Serialises publishers until the transaction ends, so the next number is read and written as one step. */
  lockPublishing(trx: Executor) {
    return sql`select pg_advisory_xact_lock(hashtext('price_book_versions'))`.execute(trx);
  }
}
