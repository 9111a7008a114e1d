import { BeforeApplicationShutdown, Injectable, Logger, OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import PgBoss from 'pg-boss';
import type { AppConfig } from '../config/configuration';

/**
 * Connections of the one pg-boss pool: fetching, completing and failing jobs for every queue, sending
 * jobs that carry no transaction of their own, schedules and maintenance. (The workers' own work —
 * delivering mail, sending notices, sweeping reminders — runs on the app's database pool.)
 */
const POOL_SIZE = 5;

/**
 * The process's one pg-boss instance (schema `pgboss` in the app's database) with its one pool,
 * shared by every worker: mail delivery, message notices and reminders. Its maintenance and cron
 * schedules therefore run once per process. The first worker that starts starts it (workers start
 * with RUN_WORKERS=true, or when a test starts one); it stops once, on shutdown, after the workers
 * have stopped fetching, and waits for the jobs still in flight.
 *
 * `work` and `offWork` wrap pg-boss's own so that one worker can stop fetching from its queues and
 * wait for its jobs in flight while the instance keeps running for the others (pg-boss's offWork
 * only stops the polling).
 */
@Injectable()
export class JobQueue implements BeforeApplicationShutdown, OnApplicationShutdown {
  private readonly logger = new Logger('JobQueue');
  private starting: Promise<PgBoss> | null = null;
  private readonly inFlight = new Map<string, Set<Promise<unknown>>>();

  constructor(private readonly config: ConfigService<AppConfig, true>) {}

  /** Starts the instance once (later calls share the first start) and answers it. */
  start(): Promise<PgBoss> {
    this.starting ??= this.open().catch((error: unknown) => {
      this.starting = null;
      throw error;
    });
    return this.starting;
  }

  private async open() {
    const boss = new PgBoss({ connectionString: this.config.get('database', { infer: true }).url, schema: 'pgboss', max: POOL_SIZE });
    boss.on('error', (error) => this.logger.error(`pg-boss: ${error.message}`));
    await boss.start();
    return boss;
  }

  /** pg-boss's `work`, with each run of the handler counted so `offWork` can wait for it. */
  async work<T>(queue: string, options: PgBoss.WorkOptions, handler: PgBoss.WorkHandler<T>): Promise<string> {
    const boss = await this.start();
    let running = this.inFlight.get(queue);
    if (!running) this.inFlight.set(queue, (running = new Set()));
    const runs = running;
    return boss.work<T>(queue, options, (jobs) => {
      const run = handler(jobs);
      runs.add(run);
      return run.finally(() => runs.delete(run));
    });
  }

  /** Stops fetching from these queues and waits for their jobs in flight; the instance keeps serving the others. */
  async offWork(...queues: string[]) {
    const boss = await this.starting?.catch(() => null);
    if (boss) for (const queue of queues) await boss.offWork(queue);
    await Promise.allSettled(queues.flatMap((queue) => [...(this.inFlight.get(queue) ?? [])]));
  }

  /** Stops the instance: no more fetching, jobs in flight finish (up to 10 s), then its pool closes. */
  async stop() {
    const starting = this.starting;
    this.starting = null;
    const boss = await starting?.catch(() => null);
    if (boss) await boss.stop({ graceful: true, timeout: 10_000, wait: true });
  }

  /**
   * Before Nest closes the listener and the database pool (the workers, in the modules that import
   * this one, have already stopped fetching by then): jobs in flight still need that pool.
   */
  async beforeApplicationShutdown() {
    await this.stop();
  }

  async onApplicationShutdown() {
    await this.stop();
  }
}
