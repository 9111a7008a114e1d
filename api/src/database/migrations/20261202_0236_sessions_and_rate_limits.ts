import { Kysely, sql } from 'kysely';

// Frozen in time: never import application code here.
// Sessions the server can end, and throttling counts every API process shares.
export async function up(db: Kysely<any>): Promise<void> {
  // One row per signed-in device. The session cookie's token names its row (the `sid` claim), and
  // every request checks the row is still open, so signing out ends the token at once.
  await db.schema
    .createTable('sessions')
    .addColumn('id', 'uuid', (c) => c.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn('user_id', 'uuid', (c) => c.notNull().references('users.id').onDelete('cascade'))
    .addColumn('created_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('renewed_at', 'timestamptz', (c) => c.notNull().defaultTo(sql`now()`))
    .addColumn('expires_at', 'timestamptz', (c) => c.notNull())
    .addColumn('ended_at', 'timestamptz')
    .addColumn('ended_reason', 'text', (c) => c.check(sql`ended_reason in ('signed_out', 'signed_out_everywhere', 'password_changed')`))
    .addColumn('ended_by', 'uuid', (c) => c.references('users.id').onDelete('set null'))
    .addColumn('user_agent', 'text')
    .addCheckConstraint('sessions_end_has_reason', sql`(ended_at is null) = (ended_reason is null)`)
    .execute();
  await db.schema.createIndex('sessions_open_by_user').on('sessions').column('user_id').where(sql.ref('ended_at'), 'is', null).execute();

  // The table rate-limiter-flexible's PostgreSQL store reads and writes (its own layout: key,
  // points, expire in epoch milliseconds), created here so no process needs DDL rights at run time.
  await db.schema
    .createTable('rate_limits')
    .addColumn('key', 'varchar(255)', (c) => c.primaryKey())
    .addColumn('points', 'integer', (c) => c.notNull().defaultTo(0))
    .addColumn('expire', 'bigint')
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable('rate_limits').execute();
  await db.schema.dropTable('sessions').execute();
}
