import { Kysely, sql } from 'kysely';

// Frozen in time: never import application code here.
export async function up(db: Kysely<any>): Promise<void> {
  // btree_gist lets an exclusion constraint combine "same builder" (=) with "overlapping range" (&&).
  await sql`create extension if not exists btree_gist`.execute(db);
  await sql`create extension if not exists citext`.execute(db);

  await db.schema
    .createTable('shop_settings')
    .addColumn('id', 'integer', (c) =>
      c
        .primaryKey()
        .defaultTo(1)
        .check(sql`id = 1`),
    )
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('tagline', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('currency', 'char(3)', (c) => c.notNull().defaultTo('USD'))
    .addColumn('country_code', 'char(2)', (c) => c.notNull().defaultTo('US'))
    .addColumn('timezone', 'text', (c) => c.notNull().defaultTo('America/Chicago'))
    .addColumn('contact_email', 'text', (c) => c.notNull())
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('shop_settings').execute();
}
