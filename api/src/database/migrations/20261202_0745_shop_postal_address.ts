import { Kysely } from 'kysely';

// Frozen in time: never import application code here.
// The shop's postal address, in the structured fields a postal label needs (street lines, city,
// region, postal code; the country is the shop's country_code). Empty until the owner fills it in;
// the scheduled e-mail, its calendar file and the build sheet print it once it is there.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('shop_settings')
    .addColumn('address_line1', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('address_line2', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('address_city', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('address_region', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('address_postal_code', 'text', (c) => c.notNull().defaultTo(''))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('shop_settings')
    .dropColumn('address_line1')
    .dropColumn('address_line2')
    .dropColumn('address_city')
    .dropColumn('address_region')
    .dropColumn('address_postal_code')
    .execute();
}
