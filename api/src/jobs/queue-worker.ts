import { BeforeApplicationShutdown, Inject, Logger, OnApplicationBootstrap } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type PgBoss from 'pg-boss';
import type { AppConfig } from '../config/configuration';
import { createQueue } from './create-queue';
import { JobQueue } from './job-queue.service';

/** A queue a worker creates and works: its pg-boss options, how it polls, what each fetch runs, and its cron schedule if any. */
export interface WorkedQueue<T = unknown> {
  name: string;
  options: Omit<PgBoss.Queue, 'name'>;
  work: PgBoss.WorkOptions;
  handler(jobs: PgBoss.Job<T>[]): Promise<unknown>;
  cron?: string;
}

/**
 * What every pg-boss worker of the API shares (mail delivery, message notices, reminders): it
 * starts with the app when RUN_WORKERS is on (or when a test starts it), on the process's one
 * instance (JobQueue); it creates its queues, works them and schedules their cron; and before the
 * database pool closes it stops fetching from its own queues and waits for the jobs in flight,
 * while the instance keeps serving the other workers (JobQueue then stops it once).
 *
 * A subclass names its queues (`queuesOf`, given the instance, so a handler may fail a job on it)
 * and may do more once running (`started`, the mail worker's first sweep).
 */
export abstract class QueueWorker implements OnApplicationBootstrap, BeforeApplicationShutdown {
  protected readonly logger = new Logger(this.constructor.name);
  /** The instance while this worker runs; null before it starts and once it stops. */
  protected boss: PgBoss | null = null;
  private queueNames: string[] = [];

  @Inject() protected readonly config: ConfigService<AppConfig, true>;
  @Inject() protected readonly jobs: JobQueue;

  /** The queues this worker runs on the given instance. */
  protected abstract queuesOf(boss: PgBoss): WorkedQueue[];

  /** Anything to do once the worker runs (the boss is set by then). */
  protected async started(): Promise<void> {}

  get running() {
    return this.boss !== null;
  }

  async onApplicationBootstrap() {
    if (this.config.get('app', { infer: true }).runWorkers) await this.start();
  }

  async start() {
    if (this.boss) return;
    const boss = await this.jobs.start();
    const queues = this.queuesOf(boss);
    for (const queue of queues) await createQueue(boss, queue.name, queue.options);
    for (const queue of queues) await this.jobs.work(queue.name, queue.work, (jobs) => queue.handler(jobs));
    for (const queue of queues) if (queue.cron) await boss.schedule(queue.name, queue.cron);
    this.queueNames = queues.map((queue) => queue.name);
    this.boss = boss;
    await this.started();
    this.logger.log(`${this.constructor.name} started`);
  }

  /** Stops fetching from this worker's queues and waits for the jobs in flight (the instance stays up for the other workers). */
  async stop() {
    if (!this.boss) return;
    this.boss = null;
    await this.jobs.offWork(...this.queueNames);
  }

  /**
   * Before Nest closes the listener and the database pool: stop fetching and wait for the jobs in
   * flight, which still need the pool to record their work (JobQueue then stops the instance).
   */
  async beforeApplicationShutdown() {
    await this.stop();
  }
}
