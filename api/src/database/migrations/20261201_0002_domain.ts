import { Kysely, sql } from 'kysely';

// Frozen in time: never import application code here.
// The whole domain in one step: people, the team, the price book, bookings with their quotes,
// payments, photos, the bench and the mail outbox.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable('users')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('email', sql`citext`, (c) => c.notNull().unique())
    .addColumn('name', 'text', (c) => c.notNull())
    .addColumn('role', 'text', (c) => c.notNull().check(sql`role in ('customer', 'builder', 'owner')`))
    .addColumn('password_hash', 'text')
    .addColumn('phone', 'text')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('last_sign_in_at', 'timestamptz')
    .execute();

  await db.schema
    .createTable('auth_tokens')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('purpose', 'text', (c) => c.notNull().check(sql`purpose in ('password_reset', 'staff_invite')`))
    .addColumn('token_hash', 'text', (c) => c.notNull().unique())
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('used_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('builders')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('user_id', 'uuid', (c) => c.notNull().unique().references('users.id').onDelete('cascade'))
    .addColumn('level', 'text', (c) => c.notNull().check(sql`level in ('apprentice', 'journeyman', 'master')`))
    .addColumn('hourly_rate', 'numeric(10, 2)', (c) => c.notNull().check(sql`hourly_rate > 0`))
    // Bench hours per ISO weekday ("1" = Monday … "7" = Sunday); a missing or 0 day is a day off.
    .addColumn('weekly_hours', 'jsonb', (c) => c.notNull())
    .addColumn('active', 'boolean', (c) => c.notNull().defaultTo(true))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('shop_closures')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('starts_on', 'date', (c) => c.notNull())
    .addColumn('ends_on', 'date', (c) => c.notNull())
    .addColumn('reason', 'text', (c) => c.notNull())
    .addCheckConstraint('shop_closures_order', sql`ends_on >= starts_on`)
    .execute();

  await db.schema
    .createTable('price_book_versions')
    .addColumn('version', 'integer', (c) => c.primaryKey())
    .addColumn('currency', 'char(3)', (c) => c.notNull())
    // The whole book (surfaces, cases, materials, labor, functions, levels, deposit policy) as
    // published; a version is never edited, a change publishes the next one.
    .addColumn('book', 'jsonb', (c) => c.notNull())
    .addColumn('notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('published_by', 'uuid', (c) => c.references('users.id'))
    .addColumn('published_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('bookings')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('reference', 'text', (c) => c.notNull().unique())
    .addColumn('customer_id', 'uuid', (c) => c.notNull().references('users.id'))
    .addColumn('state', 'text', (c) =>
      c
        .notNull()
        .check(
          sql`state in ('draft', 'requested', 'deposit_paid', 'scheduled', 'pedals_received', 'on_bench', 'testing', 'ready', 'delivered', 'declined', 'cancelled', 'refunded')`,
        ),
    )
    .addColumn('configuration', 'jsonb', (c) => c.notNull())
    .addColumn('customer_notes', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('builder_id', 'uuid', (c) => c.references('builders.id'))
    .addColumn('bench_date', 'date')
    .addColumn('expected_completion', 'date')
    .addColumn('awaiting_layout_approval', 'boolean', (c) => c.notNull().defaultTo(false))
    .addColumn('inbound_carrier', 'text')
    .addColumn('inbound_tracking', 'text')
    .addColumn('decline_reason', 'text')
    .addColumn('cancel_reason', 'text')
    .addColumn('balance_waived_reason', 'text')
    .addColumn('level_override_reason', 'text')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('bookings_customer_idx').on('bookings').column('customer_id').execute();
  await db.schema.createIndex('bookings_state_idx').on('bookings').columns(['state', 'created_at']).execute();
  await sql`create sequence booking_reference_seq start 1001`.execute(db);

  await db.schema
    .createTable('quotes')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('estimate', 'firm')`))
    .addColumn('price_book_version', 'integer', (c) => c.notNull().references('price_book_versions.version'))
    .addColumn('currency', 'char(3)', (c) => c.notNull())
    .addColumn('configuration', 'jsonb', (c) => c.notNull())
    // The engine's full answer (lines, totals, checks, notes) exactly as it was priced.
    .addColumn('estimate', 'jsonb', (c) => c.notNull())
    .addColumn('labor_hours', 'numeric(8, 2)', (c) => c.notNull())
    .addColumn('total_low', 'numeric(12, 2)', (c) => c.notNull())
    .addColumn('total_high', 'numeric(12, 2)', (c) => c.notNull())
    .addColumn('deposit', 'numeric(12, 2)', (c) => c.notNull())
    .addColumn('hourly_rate', 'numeric(10, 2)')
    .addColumn('labor_total', 'numeric(12, 2)')
    .addColumn('total', 'numeric(12, 2)')
    .addColumn('builder_id', 'uuid', (c) => c.references('builders.id'))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addCheckConstraint('quotes_range', sql`total_low <= total_high`)
    .execute();
  await db.schema.createIndex('quotes_booking_idx').on('quotes').columns(['booking_id', 'created_at']).execute();
  // A quote is a snapshot: once written it never changes (a firm quote is a new row).
  await sql`
    create function quotes_are_immutable() returns trigger language plpgsql as $$
    begin
      raise exception 'quotes are immutable; write a new quote instead' using errcode = 'P0001';
    end $$`.execute(db);
  await sql`create trigger quotes_no_update before update on quotes for each row execute function quotes_are_immutable()`.execute(db);

  await db.schema
    .createTable('booking_events')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('from_state', 'text')
    .addColumn('to_state', 'text', (c) => c.notNull())
    .addColumn('actor_id', 'uuid', (c) => c.references('users.id'))
    .addColumn('actor_label', 'text', (c) => c.notNull())
    .addColumn('note', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  await db.schema.createIndex('booking_events_booking_idx').on('booking_events').columns(['booking_id', 'id']).execute();

  await db.schema
    .createTable('payments')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('deposit', 'balance')`))
    .addColumn('amount', 'numeric(12, 2)', (c) => c.notNull().check(sql`amount > 0`))
    .addColumn('amount_minor', 'bigint', (c) => c.notNull())
    .addColumn('currency', 'char(3)', (c) => c.notNull())
    .addColumn('status', 'text', (c) => c.notNull().check(sql`status in ('pending', 'paid', 'failed', 'expired', 'refunded')`))
    .addColumn('checkout_session_id', 'text', (c) => c.unique())
    .addColumn('checkout_url', 'text')
    .addColumn('payment_intent_id', 'text')
    .addColumn('refund_id', 'text')
    .addColumn('failure_message', 'text')
    .addColumn('paid_at', 'timestamptz')
    .addColumn('refunded_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('updated_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();
  // At most one open checkout and one successful payment of each kind per booking.
  await sql`create unique index payments_one_pending on payments (booking_id, kind) where status = 'pending'`.execute(db);
  await sql`create unique index payments_one_paid on payments (booking_id, kind) where status in ('paid', 'refunded')`.execute(db);

  await db.schema
    .createTable('payment_events')
    .addColumn('event_id', 'text', (c) => c.primaryKey())
    .addColumn('type', 'text', (c) => c.notNull())
    .addColumn('payload', 'jsonb', (c) => c.notNull())
    .addColumn('received_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('booking_extras')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('description', 'text', (c) => c.notNull())
    .addColumn('amount', 'numeric(12, 2)', (c) => c.notNull().check(sql`amount >= 0`))
    .addColumn('reason', 'text', (c) => c.notNull())
    .addColumn('status', 'text', (c) => c.notNull().check(sql`status in ('proposed', 'approved', 'declined')`))
    .addColumn('proposed_by', 'uuid', (c) => c.references('users.id'))
    .addColumn('decided_at', 'timestamptz')
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('photos')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('uploaded_by', 'uuid', (c) => c.notNull().references('users.id'))
    .addColumn('kind', 'text', (c) => c.notNull().check(sql`kind in ('customer', 'intake', 'build')`))
    .addColumn('storage_key', 'text', (c) => c.notNull().unique())
    .addColumn('content_type', 'text', (c) => c.notNull())
    .addColumn('size_bytes', 'integer', (c) => c.notNull())
    .addColumn('caption', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('intake_items')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('item', 'text', (c) => c.notNull())
    .addColumn('condition', 'text', (c) => c.notNull().check(sql`condition in ('working', 'faulty')`))
    .addColumn('note', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('photo_id', 'uuid', (c) => c.references('photos.id'))
    .addColumn('recorded_by', 'uuid', (c) => c.notNull().references('users.id'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  await db.schema
    .createTable('time_entries')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('builder_id', 'uuid', (c) => c.notNull().references('builders.id'))
    .addColumn('worked_on', 'date', (c) => c.notNull())
    .addColumn('hours', 'numeric(5, 2)', (c) => c.notNull().check(sql`hours > 0 and hours <= 24`))
    .addColumn('note', 'text', (c) => c.notNull().defaultTo(''))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .execute();

  // Bench time: each row holds a slice [lower, upper) of one builder's hours on one day. The
  // exclusion constraint makes overlapping slices impossible, and the check keeps every slice
  // inside that day's capacity, so two acceptances can never both take the same hours.
  await db.schema
    .createTable('bench_allocations')
    .addColumn('id', 'bigserial', (c) => c.primaryKey())
    .addColumn('booking_id', 'uuid', (c) => c.notNull().references('bookings.id').onDelete('cascade'))
    .addColumn('builder_id', 'uuid', (c) => c.notNull().references('builders.id'))
    .addColumn('day', 'date', (c) => c.notNull())
    .addColumn('hours', sql`numrange`, (c) => c.notNull())
    .addColumn('day_capacity', 'numeric(4, 2)', (c) => c.notNull())
    .addCheckConstraint(
      'bench_allocations_within_day',
      sql`not isempty(hours) and lower(hours) >= 0 and upper(hours) <= day_capacity and day_capacity <= 24`,
    )
    .execute();
  await sql`alter table bench_allocations add constraint bench_allocations_no_overlap
    exclude using gist (builder_id with =, day with =, hours with &&)`.execute(db);
  await db.schema.createIndex('bench_allocations_booking_idx').on('bench_allocations').column('booking_id').execute();

  await db.schema
    .createTable('mail_outbox')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    // Stable across retries, so a resend after a crash is recognisably the same message.
    .addColumn('message_id', 'text', (c) => c.notNull().unique())
    .addColumn('template', 'text', (c) => c.notNull())
    .addColumn('to_address', 'text', (c) => c.notNull())
    .addColumn('data', 'jsonb', (c) => c.notNull())
    .addColumn('subject', 'text')
    .addColumn('booking_id', 'uuid', (c) => c.references('bookings.id').onDelete('set null'))
    .addColumn('user_id', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('state', 'text', (c) =>
      c
        .notNull()
        .defaultTo('queued')
        .check(sql`state in ('queued', 'sending', 'sent', 'failed')`),
    )
    .addColumn('attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('last_error', 'text')
    // Optional key that makes "send this once" idempotent (e.g. 'scheduled:<booking>:<date>').
    .addColumn('dedupe_key', 'text', (c) => c.unique())
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('sent_at', 'timestamptz')
    .execute();
  await db.schema.createIndex('mail_outbox_state_idx').on('mail_outbox').columns(['state', 'created_at']).execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of [
    'mail_outbox',
    'bench_allocations',
    'time_entries',
    'intake_items',
    'photos',
    'booking_extras',
    'payment_events',
    'payments',
    'booking_events',
    'quotes',
    'bookings',
    'price_book_versions',
    'shop_closures',
    'builders',
    'auth_tokens',
    'users',
  ]) {
    await db.schema.dropTable(table).ifExists().execute();
  }
  await sql`drop function if exists quotes_are_immutable`.execute(db);
  await sql`drop sequence if exists booking_reference_seq`.execute(db);
}
