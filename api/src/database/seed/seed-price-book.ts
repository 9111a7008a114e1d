import { demoPriceBook } from '@loomwright/shared';
import type { Kysely } from 'kysely';
import type { DB } from '../database';

/** Version 1 of the demo shop's book; never touches a book the owner has published since. */
export async function seedPriceBook(db: Kysely<DB>): Promise<void> {
  const owner = await db.selectFrom('users').select('id').where('email', '=', 'owner@shop.example').executeTakeFirst();
  await db
    .insertInto('price_book_versions')
    .values({
      version: 1,
      currency: demoPriceBook.currency,
      book: JSON.stringify(demoPriceBook),
      notes: 'Opening prices of the demo shop.',
      published_by: owner?.id ?? null,
    })
    .onConflict((oc) => oc.column('version').doNothing())
    .execute();
}
