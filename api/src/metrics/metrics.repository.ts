import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { Database } from '../database/database';

/** The job queue's figures: pg-boss's own tables (schema `pgboss`), which no module of ours owns. */
@Injectable()
export class MetricsRepository {
  constructor(private readonly db: Database) {}

  /** Jobs per queue and state, or nothing before pg-boss has made its tables. */
  async jobsByQueueAndState(): Promise<Array<{ name: string; state: string; n: string }>> {
    const exists = await sql<{ t: string | null }>`select to_regclass('pgboss.job')::text as t`.execute(this.db);
    if (!exists.rows[0]?.t) return [];
    const rows = await sql<{
      name: string;
      state: string;
      n: string;
    }>`select name, state::text as state, count(*)::text as n from pgboss.job group by name, state`.execute(this.db);
    return rows.rows;
  }
}
