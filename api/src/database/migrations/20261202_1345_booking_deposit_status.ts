import { sql, type Kysely } from 'kysely';

// Frozen in time: never import application code here.
/**
 * A booking's deposit in one word, kept on the booking row: the Requests list filters and sorts by it
 * through an index instead of working it out from the payment rows of every booking (a year of
 * bookings made the "deposit paid" filter a join over all payments for each page and each count).
 *
 * The word is decided as the list has always decided it, from the booking's deposit payments: an
 * open dispute first (the money may not stay), then paid, refunded, processing, pending, else unpaid.
 * A row trigger on payments writes it in the same transaction as any change to a deposit payment
 * (insert, delete, or an update of the columns the decision reads), whoever makes the change: the
 * payments path, a webhook, a migration or psql. It updates the booking only when the word changes,
 * so an unrelated payment update neither locks nor rewrites the booking, and it never touches
 * `updated_at` (the list's "last change" stays the booking's own).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('bookings')
    .addColumn('deposit_status', 'text', (c) =>
      c
        .notNull()
        .defaultTo('unpaid')
        .check(sql`deposit_status in ('unpaid', 'pending', 'processing', 'paid', 'disputed', 'refunded')`),
    )
    .execute();

  await sql`
    create function booking_deposit_status(b uuid) returns text language sql stable as $$
      select case
        when exists (select 1 from payments p where p.booking_id = b and p.kind = 'deposit' and p.dispute_id is not null
                     and p.dispute_status not in ('won', 'warning_closed')) then 'disputed'
        when exists (select 1 from payments p where p.booking_id = b and p.kind = 'deposit' and p.status = 'paid') then 'paid'
        when exists (select 1 from payments p where p.booking_id = b and p.kind = 'deposit' and p.status = 'refunded') then 'refunded'
        when exists (select 1 from payments p where p.booking_id = b and p.kind = 'deposit' and p.status = 'processing') then 'processing'
        when exists (select 1 from payments p where p.booking_id = b and p.kind = 'deposit' and p.status = 'pending') then 'pending'
        else 'unpaid'
      end
    $$`.execute(db);

  await sql`
    create function payments_keep_deposit_status() returns trigger language plpgsql as $$
    declare
      touched uuid[] := '{}';
      b uuid;
      word text;
    begin
      if tg_op in ('UPDATE', 'DELETE') and old.kind = 'deposit' then touched := touched || old.booking_id; end if;
      if tg_op in ('INSERT', 'UPDATE') and new.kind = 'deposit' then touched := touched || new.booking_id; end if;
      foreach b in array touched loop
        word := booking_deposit_status(b);
        update bookings set deposit_status = word where id = b and deposit_status is distinct from word;
      end loop;
      return null;
    end $$`.execute(db);
  await sql`
    create trigger payments_deposit_status
      after insert or delete or update of booking_id, kind, status, dispute_id, dispute_status on payments
      for each row execute function payments_keep_deposit_status()`.execute(db);

  // Bookings that have a deposit payment get their word; the rest keep the default, 'unpaid'.
  await sql`
    update bookings set deposit_status = booking_deposit_status(bookings.id)
    where exists (select 1 from payments p where p.booking_id = bookings.id and p.kind = 'deposit')`.execute(db);

  // The Requests list by deposit, newest first (and its count, read from the index alone).
  await sql`create index bookings_deposit_created_idx on bookings (deposit_status, created_at desc, id desc)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists bookings_deposit_created_idx`.execute(db);
  await sql`drop trigger if exists payments_deposit_status on payments`.execute(db);
  await sql`drop function if exists payments_keep_deposit_status()`.execute(db);
  await sql`drop function if exists booking_deposit_status(uuid)`.execute(db);
  await db.schema.alterTable('bookings').dropColumn('deposit_status').execute();
}
