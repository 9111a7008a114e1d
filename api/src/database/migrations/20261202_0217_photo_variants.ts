import { Kysely } from 'kysely';

/**
 * Photos are re-encoded on upload: the stored copy has no metadata, and a small copy serves photo
 * lists. A row without a thumbnail_key predates that and is re-encoded the first time it is read.
 */
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .alterTable('photos')
    .addColumn('thumbnail_key', 'text')
    .addColumn('width', 'integer')
    .addColumn('height', 'integer')
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.alterTable('photos').dropColumn('thumbnail_key').dropColumn('width').dropColumn('height').execute();
}
