import { Kysely, sql } from 'kysely';

/**
 * Two changes to the outbox, both about what a database copy or a crash can do:
 * - a state of its own, 'unknown', for a message whose sender stopped while the mail server had it
 *   (it used to be filed as 'failed', which invited a duplicate); earlier such rows are moved over
 *   by the wording they were given;
 * - single-use links (password reset, staff invitation) are removed from the data of messages that
 *   are no longer waiting to go out, so no usable token stays readable at rest. The application
 *   does the same from now on, in the same statement that records a message's final state.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table mail_outbox drop constraint mail_outbox_state_check`.execute(db);
  await sql`alter table mail_outbox add constraint mail_outbox_state_check
    check (state in ('queued', 'sending', 'sent', 'failed', 'unknown'))`.execute(db);
  await sql`update mail_outbox set state = 'unknown' where state = 'failed' and last_error like 'Delivery outcome unknown:%'`.execute(db);
  await sql`update mail_outbox set data = data - array['resetUrl']
    where template = 'password-reset' and state in ('sent', 'failed', 'unknown')`.execute(db);
  await sql`update mail_outbox set data = data - array['acceptUrl', 'inviteUrl']
    where template = 'staff-invite' and state in ('sent', 'failed', 'unknown')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`update mail_outbox set state = 'failed' where state = 'unknown'`.execute(db);
  await sql`alter table mail_outbox drop constraint mail_outbox_state_check`.execute(db);
  await sql`alter table mail_outbox add constraint mail_outbox_state_check
    check (state in ('queued', 'sending', 'sent', 'failed'))`.execute(db);
}
