import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { Database } from '../database/database';

@Injectable()
export class HealthService {
  constructor(private readonly db: Database) {}

  /** A real round trip, bounded so a hung database still gets a prompt "down". */
  async databaseIsUp(timeoutMs = 2_000): Promise<boolean> {
    const query = sql<{ ok: number }>`select 1 as ok`.execute(this.db).then((r) => r.rows[0]?.ok === 1);
    const timeout = new Promise<boolean>((resolve) => setTimeout(() => resolve(false), timeoutMs).unref());
    return Promise.race([query, timeout]).catch(() => false);
  }
}
