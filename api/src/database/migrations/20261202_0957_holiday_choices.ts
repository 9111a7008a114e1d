import { Kysely, sql } from 'kysely';

// Frozen in time: never import application code here.
// The owner's choices about single public holidays: a row says the shop works (or, again, does not
// work) on one public holiday of its country. Rows are only ever added, so the table is the history
// of those choices; the latest row for a country and day is what the bench honours.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('shop_holiday_choices')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('country_code', 'char(2)', (c) => c.notNull())
    .addColumn('day', 'date', (c) => c.notNull())
    .addColumn('holiday_name', 'text', (c) => c.notNull())
    .addColumn('shop_works', 'boolean', (c) => c.notNull())
    .addColumn('decided_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('decided_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema
    .createIndex('shop_holiday_choices_day')
    .on('shop_holiday_choices')
    .columns(['country_code', 'day', 'decided_at'])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('shop_holiday_choices').execute();
}
