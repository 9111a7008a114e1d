import { sql, type Kysely } from 'kysely';

/**
 * What the payment provider can report after a checkout: a bank debit still settling
 * ("processing"), a refund's own life (pending, failed, …), and a dispute (chargeback) with the
 * owner's decision on delivery. One open attempt per booking and kind covers "processing" too.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table payments drop constraint if exists payments_status_check`.execute(db);
  await sql`alter table payments add constraint payments_status_check
    check (status in ('pending', 'processing', 'paid', 'failed', 'expired', 'refunded'))`.execute(db);
  await sql`drop index if exists payments_one_pending`.execute(db);
  await sql`create unique index payments_one_open on payments (booking_id, kind) where status in ('pending', 'processing')`.execute(db);
  await db.schema
    .alterTable('payments')
    .addColumn('refund_status', 'text', (c) =>
      c.check(sql`refund_status in ('pending', 'requires_action', 'succeeded', 'failed', 'canceled')`),
    )
    .addColumn('refund_failure', 'text')
    .addColumn('refund_attempts', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('dispute_id', 'text')
    .addColumn('dispute_status', 'text')
    .addColumn('dispute_reason', 'text')
    .addColumn('dispute_amount_minor', 'bigint')
    .addColumn('dispute_opened_at', 'timestamptz')
    .addColumn('dispute_released_at', 'timestamptz')
    .addColumn('dispute_released_by', 'text')
    .execute();
  await sql`create index payments_intent_idx on payments (payment_intent_id) where payment_intent_id is not null`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists payments_intent_idx`.execute(db);
  for (const column of [
    'refund_status',
    'refund_failure',
    'refund_attempts',
    'dispute_id',
    'dispute_status',
    'dispute_reason',
    'dispute_amount_minor',
    'dispute_opened_at',
    'dispute_released_at',
    'dispute_released_by',
  ]) {
    await db.schema.alterTable('payments').dropColumn(column).execute();
  }
  await sql`drop index if exists payments_one_open`.execute(db);
  await sql`create unique index payments_one_pending on payments (booking_id, kind) where status = 'pending'`.execute(db);
  await sql`alter table payments drop constraint if exists payments_status_check`.execute(db);
  await sql`alter table payments add constraint payments_status_check
    check (status in ('pending', 'paid', 'failed', 'expired', 'refunded'))`.execute(db);
}
