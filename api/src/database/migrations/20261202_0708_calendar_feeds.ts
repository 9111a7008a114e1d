import { sql, type Kysely } from 'kysely';

/**
 * Private calendar feeds: one for the whole shop (builder_id null) and one per builder. The
 * secret in a feed's link is derived from the server's secret and the feed's generation, so no
 * usable link is stored here; rotating a link is generation + 1.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('calendar_feeds')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('builder_id', 'uuid', (c) => c.references('builders.id').onDelete('cascade').unique())
    .addColumn('generation', 'integer', (c) =>
      c
        .notNull()
        .defaultTo(0)
        .check(sql`generation >= 0`),
    )
    .addColumn('rotated_at', 'timestamptz')
    .addColumn('rotated_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  // One feed for the whole shop.
  await sql`create unique index calendar_feeds_one_shop on calendar_feeds ((builder_id is null)) where builder_id is null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('calendar_feeds').execute();
}
