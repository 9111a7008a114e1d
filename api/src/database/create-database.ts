import { Kysely, PostgresDialect } from 'kysely';
import { Pool, types } from 'pg';
import Cursor from 'pg-cursor';
import { Database, DB } from './database';

// numeric (1700) and int8 (20) stay strings so money never passes through a float.
types.setTypeParser(1700, (v) => v);
types.setTypeParser(20, (v) => v);
// date columns (1082) stay 'YYYY-MM-DD': a bench date is a calendar day, not an instant.
types.setTypeParser(1082, (v) => v);

/** The one pg pool of a process: Kysely runs on it, and so does the throttling store. */
export function createPool(url: string, poolMax = 10): Pool {
  const pool = new Pool({
    connectionString: url,
    max: poolMax,
    connectionTimeoutMillis: 3_000,
    idleTimeoutMillis: 10_000,
  });
  // A dropped connection (database restarted) must not crash the process; the pool reconnects.
  pool.on('error', () => undefined);
  // The same for a client that is checked out when its connection drops: pg emits 'error' on it, and
  // with no listener that would end the process. The query it was running fails on its own.
  pool.on('connect', (client) => client.on('error', () => undefined));
  return pool;
}

/**
 * pg-cursor lets Kysely's `.stream()` read a large result in chunks (the CSV exports), so 100,000
 * rows never sit in memory at once.
 */
export const databaseOnPool = (pool: Pool): Database =>
  new Kysely<DB>({ dialect: new PostgresDialect({ pool, cursor: Cursor }) }) as Database;

export function createDatabase(url: string, poolMax = 10): Database {
  return databaseOnPool(createPool(url, poolMax));
}
