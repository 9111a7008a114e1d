import { sql, type Kysely } from 'kysely';

// Frozen in time: never import application code here.
// Approvals the player (or the shop, for the player) can give, notes that stay internal unless
// the writer tells the player, payments taken at the counter, and records that can be corrected.
export async function up(db: Kysely<any>): Promise<void> {
  // How a payment came in: through the hosted checkout, or recorded by the shop when taken in person.
  await db.schema
    .alterTable('payments')
    .addColumn('method', 'text', (c) =>
      c
        .notNull()
        .defaultTo('checkout')
        .check(sql`method in ('checkout', 'cash', 'card_terminal', 'bank_transfer')`),
    )
    .addColumn('recorded_by', 'uuid', (c) => c.references('users.id'))
    .addColumn('note', 'text', (c) => c.notNull().defaultTo(''))
    .execute();

  // Who decided an extra and how: the player in the app, or staff recording a yes given by phone or in person.
  await db.schema
    .alterTable('booking_extras')
    .addColumn('decided_via', 'text', (c) => c.check(sql`decided_via in ('app', 'phone', 'in_person', 'email')`))
    .addColumn('decision_comment', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('decided_by_name', 'text')
    .addColumn('recorded_by', 'uuid', (c) => c.references('users.id'))
    .execute();

  await db.schema
    .createTable('layout_approvals')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('requested_by', 'uuid', (c) => c.references('users.id'))
    .addColumn('message', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('status', 'text', (c) =>
      c
        .notNull()
        .defaultTo('waiting')
        .check(sql`status in ('waiting', 'approved', 'declined')`),
    )
    .addColumn('decided_via', 'text', (c) => c.check(sql`decided_via in ('app', 'phone', 'in_person', 'email')`))
    .addColumn('decision_comment', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('decided_by_name', 'text')
    .addColumn('recorded_by', 'uuid', (c) => c.references('users.id'))
    .addColumn('decided_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  // At most one layout waits for an answer at a time.
  await sql`create unique index layout_approvals_one_waiting on layout_approvals (booking_id) where status = 'waiting'`.execute(db);

  // A history line the player may read ('player'), or one for the shop only ('internal'): staff
  // notes, hours and intake remarks. State changes the player should know of stay 'player'.
  await db.schema
    .alterTable('booking_events')
    .addColumn('visibility', 'text', (c) =>
      c
        .notNull()
        .defaultTo('player')
        .check(sql`visibility in ('player', 'internal')`),
    )
    .execute();
  // Hours and intake remarks written before this were shown to the player; they are the shop's own.
  await sql`update booking_events set visibility = 'internal'
    where from_state = to_state and (note like 'Recorded % h on %' or note like 'Intake:%')`.execute(db);

  // Intake: one row per item of the rig, in signal-chain order, corrected in place.
  await db.schema
    .alterTable('intake_items')
    .addColumn('item_key', 'text')
    .addColumn('position', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('updated_at', 'timestamptz')
    .addColumn('updated_by', 'uuid', (c) => c.references('users.id'))
    .execute();
  await sql`update intake_items set item_key = 'item:' || lower(item) || ':' || id::text where item_key is null`.execute(db);
  await sql`alter table intake_items alter column item_key set not null`.execute(db);
  await sql`create unique index intake_items_one_per_item on intake_items (booking_id, item_key)`.execute(db);

  // Hours: who wrote the entry (they and the owner may correct it) and when it last changed.
  await db.schema
    .alterTable('time_entries')
    .addColumn('created_by', 'uuid', (c) => c.references('users.id'))
    .addColumn('updated_at', 'timestamptz')
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('time_entries').dropColumn('created_by').dropColumn('updated_at').execute();
  await sql`drop index if exists intake_items_one_per_item`.execute(db);
  await db.schema
    .alterTable('intake_items')
    .dropColumn('item_key')
    .dropColumn('position')
    .dropColumn('updated_at')
    .dropColumn('updated_by')
    .execute();
  await db.schema.alterTable('booking_events').dropColumn('visibility').execute();
  await db.schema.dropTable('layout_approvals').ifExists().execute();
  await db.schema
    .alterTable('booking_extras')
    .dropColumn('decided_via')
    .dropColumn('decision_comment')
    .dropColumn('decided_by_name')
    .dropColumn('recorded_by')
    .execute();
  await db.schema.alterTable('payments').dropColumn('method').dropColumn('recorded_by').dropColumn('note').execute();
}
