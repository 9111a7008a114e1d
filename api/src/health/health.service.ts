import { BeforeApplicationShutdown, Injectable, Logger, OnApplicationShutdown, OnModuleDestroy } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { sql } from 'kysely';
import { PhotoStorage } from '../bookings/photo-storage';
import type { AppConfig } from '../config/configuration';
import { Database } from '../database/database';

/**
 * Readiness, and the order of a graceful stop. On SIGTERM (Nest's shutdown hooks, see app.setup.ts):
 * 1. onModuleDestroy: readiness answers 503 from now on;
 * 2. beforeApplicationShutdown: a watchdog is armed (SHUTDOWN_TIMEOUT_SECONDS, then exit 1), the
 *    process keeps serving for SHUTDOWN_DELAY_SECONDS so a load balancer sees the 503 and stops
 *    sending work; the mail worker stops fetching and lets the jobs in flight finish (MailWorker);
 * 3. Nest closes the HTTP listener: no new connections, and the requests in flight get their answers;
 * 4. onApplicationShutdown: the mail transport and the database pool close, and the process exits 0.
 * The database pool closes last, so every answer and job in flight can still write what it did.
 */
@Injectable()
export class HealthService implements OnModuleDestroy, BeforeApplicationShutdown, OnApplicationShutdown {
  private readonly logger = new Logger('Shutdown');
  /** Set on the first shutdown hook: a load balancer stops sending new work while answers drain. */
  shuttingDown = false;
  private watchdog: NodeJS.Timeout | undefined;

  constructor(
    private readonly db: Database,
    private readonly storage: PhotoStorage,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  onModuleDestroy() {
    this.shuttingDown = true;
  }

  /** `signal` is set only when a signal (not app.close() in a test) started the stop. */
  async beforeApplicationShutdown(signal?: string) {
    if (!signal) return;
    const { shutdownDelaySeconds, shutdownTimeoutSeconds } = this.config.get('app', { infer: true });
    this.watchdog = setTimeout(() => {
      this.logger.error(`Still draining after ${shutdownTimeoutSeconds} s (SHUTDOWN_TIMEOUT_SECONDS); exiting without waiting further`);
      process.exit(1);
    }, shutdownTimeoutSeconds * 1000);
    this.watchdog.unref();
    this.logger.log(
      `${signal}: readiness now answers 503; serving ${shutdownDelaySeconds} s more, then draining requests and jobs in flight`,
    );
    if (shutdownDelaySeconds > 0) await new Promise((resolve) => setTimeout(resolve, shutdownDelaySeconds * 1000));
  }

  onApplicationShutdown(signal?: string) {
    if (this.watchdog) clearTimeout(this.watchdog);
    if (signal) this.logger.log(`${signal}: requests and jobs drained; exiting`);
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
