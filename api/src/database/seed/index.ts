import type { Kysely } from 'kysely';
import type { DB } from '../database';
import { seedBookings } from './seed-bookings';
import { seedPeople } from './seed-people';
import { seedPriceBook } from './seed-price-book';
import { seedShop } from './seed-shop';

/**
 * Seeds the invented demo shop. Each domain contributes one idempotent step, in dependency order
 * (the shop, then people, then the price book, then bookings that refer to both).
 */
export const seedSteps: Array<{ name: string; run: (db: Kysely<DB>) => Promise<void> }> = [
  { name: 'shop', run: seedShop },
  { name: 'people', run: seedPeople },
  { name: 'price-book', run: seedPriceBook },
  { name: 'bookings', run: seedBookings },
];

export async function seedDemoShop(db: Kysely<DB>): Promise<void> {
  for (const step of seedSteps) await step.run(db);
}
