import { Injectable, OnModuleDestroy } from '@nestjs/common';
import { sql } from 'kysely';
import { PhotoStorage } from '../bookings/photo-storage';
import { Database } from '../database/database';

@Injectable()
export class HealthService implements OnModuleDestroy {
  /** Set on the first shutdown hook: a load balancer stops sending new work while answers drain. */
  shuttingDown = false;

  constructor(
    private readonly db: Database,
    private readonly storage: PhotoStorage,
  ) {}

  onModuleDestroy() {
    this.shuttingDown = true;
  }

  /** A real round trip, bounded so a hung database still gets a prompt "down". */
  async databaseIsUp(timeoutMs = 2_000): Promise<boolean> {
    const query = sql<{ ok: number }>`select 1 as ok`.execute(this.db).then((r) => r.rows[0]?.ok === 1);
    const timeout = new Promise<boolean>((resolve) => setTimeout(() => resolve(false), timeoutMs).unref());
    return Promise.race([query, timeout]).catch(() => false);
  }

  /** The photo store answers (the bucket exists and the keys work, or the upload folder is there). */
  async storageIsUp(timeoutMs = 2_000): Promise<boolean> {
    const timeout = new Promise<boolean>((resolve) => setTimeout(() => resolve(false), timeoutMs).unref());
    return Promise.race([this.storage.isReachable(timeoutMs), timeout]).catch(() => false);
  }
}
