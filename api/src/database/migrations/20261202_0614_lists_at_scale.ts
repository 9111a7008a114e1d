import { Kysely, sql } from 'kysely';

// Frozen in time: never import application code here.
// Lists that stay fast with a year of bookings and mail, and a price book every replica can hold
// in memory: indexes for each list's order and keyset, trigram indexes for the "%…%" searches,
// and a notification whenever the price book changes.
export async function up(db: Kysely<any>): Promise<void> {
  // pg_trgm (PostgreSQL contrib, like btree_gist) lets a GIN index answer ILIKE '%text%'.
  await sql`create extension if not exists pg_trgm`.execute(db);

  // Bookings lists: the other sorts, each ending in id so a page boundary is exact (the default order,
  // created_at then id, has bookings_created_at_idx from 20261202_0546; read backwards for newest first).
  await sql`create index bookings_updated_idx on bookings (updated_at desc, id desc)`.execute(db);
  await sql`create index bookings_bench_date_idx on bookings (bench_date, id)`.execute(db);
  await sql`create index bookings_state_order_idx on bookings (state, id)`.execute(db);
  await sql`create index bookings_customer_created_idx on bookings (customer_id, created_at desc, id desc)`.execute(db);
  await sql`create index bookings_reference_trgm on bookings using gin (reference gin_trgm_ops)`.execute(db);

  // Customers: name and e-mail searches (e-mail is citext; the search reads it as text).
  await sql`create index users_name_trgm on users using gin (name gin_trgm_ops)`.execute(db);
  await sql`create index users_email_trgm on users using gin ((email::text) gin_trgm_ops)`.execute(db);
  await sql`create index users_role_name_idx on users (role, name, id)`.execute(db);

  // Deposit status of a list row: the payments of one booking and kind.
  await sql`create index payments_booking_kind_idx on payments (booking_id, kind, status)`.execute(db);

  // Mail log: newest first, and the recipient search.
  await sql`create index mail_outbox_created_idx on mail_outbox (created_at desc, id desc)`.execute(db);
  await sql`create index mail_outbox_to_trgm on mail_outbox using gin (lower(to_address) gin_trgm_ops)`.execute(db);

  // Every change to the price book, by anyone, tells each listening API process to drop its copy.
  await sql`
    create function price_book_changed() returns trigger language plpgsql as $$
    begin
      perform pg_notify('price_book_changed', '');
      return null;
    end $$`.execute(db);
  await sql`create trigger price_book_versions_changed after insert or update or delete or truncate on price_book_versions
    for each statement execute function price_book_changed()`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger if exists price_book_versions_changed on price_book_versions`.execute(db);
  await sql`drop function if exists price_book_changed`.execute(db);
  for (const index of [
    'mail_outbox_to_trgm',
    'mail_outbox_created_idx',
    'payments_booking_kind_idx',
    'users_role_name_idx',
    'users_email_trgm',
    'users_name_trgm',
    'bookings_reference_trgm',
    'bookings_customer_created_idx',
    'bookings_state_order_idx',
    'bookings_bench_date_idx',
    'bookings_updated_idx',
  ]) {
    await sql`drop index if exists ${sql.raw(index)}`.execute(db);
  }
}
