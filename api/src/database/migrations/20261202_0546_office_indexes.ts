import { sql, type Kysely } from 'kysely';

/**
 * Indexes the shop's office reads by: the exports and reports walk bookings by when they were
 * requested, money by the day it arrived or went back, and hours by the day worked, and look up
 * each booking's payments, extras and hour entries (which had no index by booking until now).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index if not exists bookings_created_at_idx on bookings (created_at, id)`.execute(db);
  await sql`create index if not exists payments_booking_idx on payments (booking_id)`.execute(db);
  await sql`create index if not exists payments_paid_at_idx on payments (paid_at) where paid_at is not null`.execute(db);
  await sql`create index if not exists payments_refunded_at_idx on payments (refunded_at) where refunded_at is not null`.execute(db);
  await sql`create index if not exists booking_extras_booking_idx on booking_extras (booking_id)`.execute(db);
  await sql`create index if not exists time_entries_booking_idx on time_entries (booking_id)`.execute(db);
  await sql`create index if not exists time_entries_worked_on_idx on time_entries (worked_on, builder_id)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const name of [
    'time_entries_worked_on_idx',
    'time_entries_booking_idx',
    'booking_extras_booking_idx',
    'payments_refunded_at_idx',
    'payments_paid_at_idx',
    'payments_booking_idx',
    'bookings_created_at_idx',
  ]) {
    await sql`drop index if exists ${sql.ref(name)}`.execute(db);
  }
}
