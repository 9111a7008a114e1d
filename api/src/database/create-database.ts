import {
  Kysely,
  PostgresDialect,
  PostgresDriver,
  type CompiledQuery,
  type DatabaseConnection,
  type Driver,
  type PostgresDialectConfig,
  type TransactionSettings,
} from 'kysely';
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

/** Called with the tables a statement of this process wrote, once they are committed. */
export type CommittedWrites = (tables: ReadonlySet<string>) => void;

// insert into "t", update "t", delete from "t" anywhere in a statement (a CTE's write too), and
// truncate [table] [only] "t", "u", …, as Kysely compiles them or as written by hand.
const WRITES = /\b(?:insert\s+into|update|delete\s+from)\s+(?:only\s+)?"?([a-z_][a-z0-9_]*)"?/gi;
const TRUNCATE = /\btruncate\s+(?:table\s+)?((?:(?:only\s+)?"?[a-z_][a-z0-9_]*"?\s*,\s*)*(?:only\s+)?"?[a-z_][a-z0-9_]*"?)/gi;

/** The tables a statement writes, read from its SQL text (lower case). */
export function tablesWrittenBy(text: string): string[] {
  if (!/insert|update|delete|truncate/i.test(text)) return [];
  const tables = [...text.matchAll(WRITES)].map((m) => m[1]!);
  for (const m of text.matchAll(TRUNCATE)) {
    for (const name of m[1]!.split(','))
      tables.push(
        name
          .trim()
          .replace(/^only\s+/i, '')
          .replace(/"/g, ''),
      );
  }
  return tables.map((t) => t.toLowerCase());
}

/**
 * Kysely's PostgreSQL driver, telling `committed` which tables this process wrote once the write is
 * visible to every later read: at once for a statement outside a transaction, at COMMIT for one
 * inside (nothing on ROLLBACK). The in-memory copies of the database (`DatabaseChanges`) drop
 * themselves there, so this process's next read sees its own write without waiting for PostgreSQL's
 * notification to come round.
 */
class WriteWatchingPostgresDriver extends PostgresDriver {
  private readonly inTransaction = new WeakMap<DatabaseConnection, Set<string>>();

  constructor(
    config: PostgresDialectConfig,
    private readonly committed: CommittedWrites,
  ) {
    super({
      ...config,
      onCreateConnection: async (connection) => {
        const execute = connection.executeQuery.bind(connection);
        connection.executeQuery = async <R>(query: CompiledQuery) => {
          const result = await execute<R>(query);
          const tables = tablesWrittenBy(query.sql);
          if (tables.length) {
            const open = this.inTransaction.get(connection);
            if (open) for (const t of tables) open.add(t);
            else this.committed(new Set(tables));
          }
          return result;
        };
        await config.onCreateConnection?.(connection);
      },
    });
  }

  override async beginTransaction(connection: DatabaseConnection, settings: TransactionSettings): Promise<void> {
    await super.beginTransaction(connection, settings);
    this.inTransaction.set(connection, new Set());
  }

  override async commitTransaction(connection: DatabaseConnection): Promise<void> {
    const written = this.inTransaction.get(connection);
    this.inTransaction.delete(connection);
    await super.commitTransaction(connection);
    if (written?.size) this.committed(written);
  }

  override async rollbackTransaction(connection: Parameters<PostgresDriver['rollbackTransaction']>[0]): Promise<void> {
    this.inTransaction.delete(connection);
    await super.rollbackTransaction(connection);
  }
}

class WriteWatchingPostgresDialect extends PostgresDialect {
  constructor(
    private readonly settings: PostgresDialectConfig,
    private readonly committed: CommittedWrites,
  ) {
    super(settings);
  }

  override createDriver(): Driver {
    return new WriteWatchingPostgresDriver(this.settings, this.committed);
  }
}

/**
 * pg-cursor lets Kysely's `.stream()` read a large result in chunks (the CSV exports), so 100,000
 * rows never sit in memory at once. With `committed`, every write this process commits is reported.
 */
export const databaseOnPool = (pool: Pool, committed?: CommittedWrites): Database => {
  const config: PostgresDialectConfig = { pool, cursor: Cursor };
  return new Kysely<DB>({
    dialect: committed ? new WriteWatchingPostgresDialect(config, committed) : new PostgresDialect(config),
  }) as Database;
};

export function createDatabase(url: string, poolMax = 10): Database {
  return databaseOnPool(createPool(url, poolMax));
}
