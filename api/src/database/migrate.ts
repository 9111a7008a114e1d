import { Kysely, Migrator } from 'kysely';
import { migrations } from './migrations';

/** Runs every pending migration; Kysely's Migrator takes a lock, so replicas may start together. */
export async function migrateToLatest(db: Kysely<any>): Promise<string[]> {
  const migrator = new Migrator({ db, provider: { getMigrations: async () => migrations } });
  const { error, results } = await migrator.migrateToLatest();
  if (error) {
    const failed = results?.find((r) => r.status === 'Error')?.migrationName ?? 'unknown';
    throw new Error(`Migration ${failed} failed: ${(error as Error).message ?? String(error)}`);
  }
  return (results ?? []).map((r) => r.migrationName);
}
