import { sql, type Kysely } from 'kysely';

/**
 * Reminders sent by the job queue and the expiry of unpaid requests.
 *
 * `reminder_settings`: one row per kind, on or off, and its one figure (days, or hours for an
 * unfinished checkout). Defaults are common practice, no published source.
 *
 * `reminders`: one row per reminder sent (or request expired). The unique key on kind + booking +
 * event is what makes each reminder go out once, however many API processes run the job at the
 * same moment: the row is inserted in the same transaction as its e-mail and history line, and a
 * second process's insert finds the key taken and does nothing.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('reminder_settings')
    .addColumn('kind', 'text', (c) => c.primaryKey().check(sql`kind in ('shipBy', 'balanceUnpaid', 'checkoutAbandoned', 'requestExpiry')`))
    .addColumn('enabled', 'boolean', (c) => c.notNull())
    .addColumn('amount', 'integer', (c) => c.notNull().check(sql`amount between 1 and 365`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .execute();
  await db
    .insertInto('reminder_settings')
    .values([
      { kind: 'shipBy', enabled: true, amount: 3 },
      { kind: 'balanceUnpaid', enabled: true, amount: 7 },
      { kind: 'checkoutAbandoned', enabled: true, amount: 24 },
      { kind: 'requestExpiry', enabled: true, amount: 30 },
    ])
    .execute();

  await db.schema
    .createTable('reminders')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('shipBy', 'balanceUnpaid', 'checkoutAbandoned', 'requestExpiry')`))
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('event_key', 'text', (c) => c.notNull())
    .addColumn('due_at', 'timestamptz', (c) => c.notNull())
    .addColumn('sent_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('reminders_once').on('reminders').columns(['kind', 'booking_id', 'event_key']).unique().execute();
  await db.schema.createIndex('reminders_booking_idx').on('reminders').column('booking_id').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('reminders').execute();
  await db.schema.dropTable('reminder_settings').execute();
}
