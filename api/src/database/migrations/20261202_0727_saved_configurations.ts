import { Kysely, sql } from 'kysely';

/**
 * Configurations a signed-in player keeps under a name (reopened, renamed, duplicated, deleted),
 * and short links: a code standing for one configuration, so a shared address is a few characters
 * instead of the whole configuration in the query string.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('saved_configurations')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('owner_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('name', 'text', (c) => c.notNull().check(sql`char_length(btrim(name)) between 1 and 120`))
    .addColumn('configuration', 'jsonb', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  // One name once per player, whatever its case: "Stage board" and "stage board" would be confused.
  await sql`create unique index saved_configurations_owner_name on saved_configurations (owner_id, lower(name))`.execute(db);

  await db.schema
    .createTable('configuration_links')
    .addColumn('code', 'text', (c) => c.primaryKey().check(sql`code ~ '^[A-Za-z0-9]{6,16}$'`))
    // SHA-256 of the configuration's canonical JSON: the same configuration always gets the same code.
    .addColumn('digest', 'text', (c) => c.notNull().unique())
    .addColumn('configuration', 'jsonb', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('last_opened_at', 'timestamptz')
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('configuration_links').execute();
  await db.schema.dropTable('saved_configurations').execute();
}
