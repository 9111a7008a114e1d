import { BeforeApplicationShutdown, Injectable, Logger, OnApplicationBootstrap } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type PgBoss from 'pg-boss';
import { createQueue } from '../jobs/create-queue';
import { JobQueue } from '../jobs/job-queue.service';
import type { AppConfig } from '../config/configuration';
import { RemindersService } from './reminders.service';

export const REMINDERS_QUEUE = 'reminders-sweep';
/** Every fifteen minutes: the unfinished-checkout reminder counts in hours, the others in days. */
export const REMINDERS_CRON = '*/15 * * * *';

/**
 * Runs the reminder sweep from pg-boss (schema `pgboss`, as the mail worker does), never from a
 * timer of our own. pg-boss's schedule sends one job per cron tick across every process that
 * schedules it, and the `singleton` queue policy lets only one sweep be active at a time; neither
 * is what keeps a reminder from going out twice, though: that is the `reminders_once` unique key,
 * which holds even if two sweeps do run at once (tested with two apps on one database).
 */
@Injectable()
export class RemindersWorker implements OnApplicationBootstrap, BeforeApplicationShutdown {
  private readonly logger = new Logger('RemindersWorker');
  private boss: PgBoss | null = null;

  constructor(
    private readonly config: ConfigService<AppConfig, true>,
    private readonly reminders: RemindersService,
    private readonly jobs: JobQueue,
  ) {}

  get running() {
    return this.boss !== null;
  }

  async onApplicationBootstrap() {
    if (this.config.get('app', { infer: true }).runWorkers) await this.start();
  }

  async start() {
    if (this.boss) return;
    // The process's one pg-boss instance (JobQueue), which also runs pg-boss's maintenance once.
    const boss = await this.jobs.start();
    await createQueue(boss, REMINDERS_QUEUE, { policy: 'singleton', retryLimit: 0, expireInSeconds: 10 * 60 });
    await this.jobs.work(REMINDERS_QUEUE, { pollingIntervalSeconds: 5 }, async () => {
      await this.reminders.runDue();
    });
    await boss.schedule(REMINDERS_QUEUE, REMINDERS_CRON);
    this.boss = boss;
    this.logger.log('Reminder worker started');
  }

  /** Asks for a sweep now (the queue's own job, so a worker in any process may run it). */
  async sweepSoon() {
    if (!this.boss) return null;
    return this.boss.send(REMINDERS_QUEUE, {});
  }

  /** Stops fetching sweeps and waits for one in flight; the instance stays up for the other workers. */
  async stop() {
    if (!this.boss) return;
    this.boss = null;
    await this.jobs.offWork(REMINDERS_QUEUE);
  }

  /** Before the database pool closes: a sweep in flight still needs it (JobQueue then stops the instance). */
  async beforeApplicationShutdown() {
    await this.stop();
  }
}
