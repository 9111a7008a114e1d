import { sql, type Kysely } from 'kysely';

// Frozen in time: never import application code here.
/**
 * Every change to what the public lead time and the accept suggestions read (the bench slices, the
 * shop's closures, settings and worked holidays, the builders and their days away, a builder's name
 * or whether they have joined) tells each listening API process to drop its copy of the bench, when
 * the writing transaction commits, whoever writes (an API process, a migration, psql).
 */
const TABLES = ['bench_allocations', 'shop_closures', 'builder_absences', 'shop_settings', 'shop_holiday_choices', 'builders'];

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create function bench_changed() returns trigger language plpgsql as $$
    begin
      perform pg_notify('bench_changed', '');
      return null;
    end $$`.execute(db);
  for (const table of TABLES) {
    await sql`create trigger ${sql.id(`${table}_bench_changed`)} after insert or update or delete or truncate on ${sql.table(table)}
      for each statement execute function bench_changed()`.execute(db);
  }
  // A builder's account: the name the suggestions show, and the password that makes an invited
  // builder one who has joined. Sign-ins and customers' changes do not concern the bench.
  await sql`
    create function bench_builder_account_changed() returns trigger language plpgsql as $$
    begin
      if exists (select 1 from builders where user_id = new.id) then
        perform pg_notify('bench_changed', '');
      end if;
      return null;
    end $$`.execute(db);
  await sql`create trigger users_bench_changed after update of name, email, password_hash on users
    for each row
    when (old.name is distinct from new.name or old.email is distinct from new.email or old.password_hash is distinct from new.password_hash)
    execute function bench_builder_account_changed()`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop trigger if exists users_bench_changed on users`.execute(db);
  await sql`drop function if exists bench_builder_account_changed`.execute(db);
  for (const table of TABLES) await sql`drop trigger if exists ${sql.id(`${table}_bench_changed`)} on ${sql.table(table)}`.execute(db);
  await sql`drop function if exists bench_changed`.execute(db);
}
