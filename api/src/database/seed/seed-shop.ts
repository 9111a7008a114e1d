import type { Kysely } from 'kysely';
import type { DB } from '../database';

/** The invented demo shop. Idempotent: a second run changes nothing the owner has edited. */
export async function seedShop(db: Kysely<DB>): Promise<void> {
  await db
    .insertInto('shop_settings')
    .values({
      id: 1,
      name: 'Copperline Rig Works',
      tagline: 'Hand-wired pedalboards, built to tour.',
      currency: 'USD',
      country_code: 'US',
      timezone: 'America/Chicago',
      locale: 'en-US',
      contact_email: 'bench@shop.example',
    } as never)
    .onConflict((oc) => oc.column('id').doNothing())
    .execute();
}
