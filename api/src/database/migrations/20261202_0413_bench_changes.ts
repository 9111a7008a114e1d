import { Kysely, sql } from 'kysely';

// Frozen in time: never import application code here.
// When plans change on the bench: a builder's own days away, the calendar file's revision
// number per booking, and the player's consent to a firm price above the range they were quoted.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('builder_absences')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('builder_id', 'uuid', (c) => c.notNull().references('builders.id').onDelete('cascade'))
    .addColumn('starts_on', 'date', (c) => c.notNull())
    .addColumn('ends_on', 'date', (c) => c.notNull())
    .addColumn('reason', 'text', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('builder_absences_order', sql`ends_on >= starts_on`)
    .execute();
  await db.schema.createIndex('builder_absences_builder_idx').on('builder_absences').columns(['builder_id', 'starts_on']).execute();

  await db.schema
    .alterTable('bookings')
    // RFC 5545 §3.8.7.4 SEQUENCE of the booking's calendar event: 0 when first sent, one more on every revision.
    .addColumn('calendar_sequence', 'integer', (c) =>
      c
        .notNull()
        .defaultTo(0)
        .check(sql`calendar_sequence >= 0`),
    )
    // null: no consent needed; 'pending': the firm total is above the quoted range and the player has not answered.
    .addColumn('price_consent', 'text', (c) => c.check(sql`price_consent in ('pending', 'given')`))
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('bookings').dropColumn('price_consent').dropColumn('calendar_sequence').execute();
  await db.schema.dropTable('builder_absences').ifExists().execute();
}
