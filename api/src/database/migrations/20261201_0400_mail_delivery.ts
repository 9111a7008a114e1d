import { Kysely, sql } from 'kysely';

/**
 * What the mail worker needs beside the outbox row: when a sender claimed it (so a claim left by a
 * crashed sender can be recognised), when it was last tried, and which message a resend repeats.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('mail_outbox')
    .addColumn('claimed_at', 'timestamptz')
    .addColumn('last_attempt_at', 'timestamptz')
    .addColumn('resent_from_id', 'uuid', (c) => c.references('mail_outbox.id').onDelete('set null'))
    .execute();
  await db.schema
    .createIndex('mail_outbox_to_idx')
    .on('mail_outbox')
    .expression(sql`lower(to_address)`)
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropIndex('mail_outbox_to_idx').ifExists().execute();
  await db.schema.alterTable('mail_outbox').dropColumn('claimed_at').dropColumn('last_attempt_at').dropColumn('resent_from_id').execute();
}
