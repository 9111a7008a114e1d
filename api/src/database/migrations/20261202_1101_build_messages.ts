import { sql, type Kysely } from 'kysely';

/**
 * Messages between a build's player and the shop, with per-side read markers and the notices that
 * tell the other side by e-mail. A message's photos are rows of `photos` carrying its id (so they
 * keep the booking photos' storage and privacy), outside the booking's own photo count.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('build_messages')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    // A total order for read markers: two messages may share a created_at, never a seq.
    .addColumn('seq', 'bigserial', (c) => c.notNull().unique())
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('author_id', 'uuid', (c) => c.notNull().references('users.id'))
    .addColumn('side', 'text', (c) => c.notNull().check(sql`side in ('player', 'shop')`))
    .addColumn('body', 'text', (c) => c.notNull().check(sql`char_length(body) <= 4000`))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('build_messages_booking').on('build_messages').columns(['booking_id', 'seq']).execute();

  await db.schema
    .createTable('message_read_markers')
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('side', 'text', (c) => c.notNull().check(sql`side in ('player', 'shop')`))
    .addColumn('read_seq', 'bigint', (c) => c.notNull().defaultTo(0))
    .addColumn('read_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addPrimaryKeyConstraint('message_read_markers_pk', ['booking_id', 'side'])
    .execute();

  // One e-mail per side per window: a notice opens with the first message the side has not been
  // told about, and is claimed once (state waiting → sent | skipped) when its window has passed.
  await db.schema
    .createTable('message_notices')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('side', 'text', (c) => c.notNull().check(sql`side in ('player', 'shop')`))
    .addColumn('from_seq', 'bigint', (c) => c.notNull())
    .addColumn('due_at', 'timestamptz', (c) => c.notNull())
    .addColumn('state', 'text', (c) =>
      c
        .notNull()
        .defaultTo('waiting')
        .check(sql`state in ('waiting', 'sent', 'skipped')`),
    )
    .addColumn('message_count', 'integer')
    .addColumn('outbox_id', 'uuid', (c) => c.references('mail_outbox.id').onDelete('set null'))
    .addColumn('settled_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await sql`create unique index message_notices_one_waiting on message_notices (booking_id, side) where state = 'waiting'`.execute(db);
  await sql`create index message_notices_due on message_notices (due_at) where state = 'waiting'`.execute(db);

  await db.schema
    .alterTable('photos')
    .addColumn('message_id', 'uuid', (c) => c.references('build_messages.id').onDelete('cascade'))
    .execute();
  await sql`create index photos_message on photos (message_id) where message_id is not null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`delete from photos where message_id is not null`.execute(db);
  await db.schema.alterTable('photos').dropColumn('message_id').execute();
  await db.schema.dropTable('message_notices').execute();
  await db.schema.dropTable('message_read_markers').execute();
  await db.schema.dropTable('build_messages').execute();
}
