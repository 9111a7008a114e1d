import type { Kysely } from 'kysely';

/**
 * When the password last changed: sessions issued before it stop working, so a reset locks out
 * whoever held an old session (the reason a player usually resets).
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('users').addColumn('password_changed_at', 'timestamptz').execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('users').dropColumn('password_changed_at').execute();
}
