import { sql, type Kysely } from 'kysely';

// Frozen in time: never import application code here.
/**
 * The Builds list shows one state at a time, by bench date (its default) or by last change. With only
 * a (sort column, id) index PostgreSQL walked that order and read each booking to test its state:
 * some 1,800 pages to find the 25 newest delivered builds of a year. With the state first, the page
 * is the first entries of its state's range, read from the index alone.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`create index bookings_state_updated_idx on bookings (state, updated_at desc, id desc)`.execute(db);
  await sql`create index bookings_state_bench_date_idx on bookings (state, bench_date, id)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists bookings_state_bench_date_idx`.execute(db);
  await sql`drop index if exists bookings_state_updated_idx`.execute(db);
}
