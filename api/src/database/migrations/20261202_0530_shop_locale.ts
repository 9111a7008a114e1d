import { Kysely, sql } from 'kysely';

// Frozen in time: never import application code here.
// The shop's locale (a BCP 47 tag such as en-US or de-DE): with its currency and time zone it decides
// how every amount, date and time is written in both apps, the e-mails, calendar files and PDFs.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('shop_settings')
    .addColumn('locale', 'text', (c) =>
      c
        .notNull()
        .defaultTo('en-US')
        .check(sql`locale ~ '^[A-Za-z]{2,3}(-[A-Za-z0-9]{2,8})*$'`),
    )
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('shop_settings').dropColumn('locale').execute();
}
