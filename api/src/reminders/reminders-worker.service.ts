import { Injectable, Logger, OnApplicationBootstrap, OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import PgBoss from 'pg-boss';
import { createQueue } from '../jobs/create-queue';
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
export class RemindersWorker implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('RemindersWorker');
  private boss: PgBoss | null = null;

  constructor(
    private readonly config: ConfigService<AppConfig, true>,
    private readonly reminders: RemindersService,
  ) {}

  get running() {
    return this.boss !== null;
  }

  async onApplicationBootstrap() {
    if (this.config.get('app', { infer: true }).runWorkers) await this.start();
  }

  async start() {
    if (this.boss) return;
    // The mail worker's instance runs pg-boss's maintenance; this one only schedules and works its queue.
    const boss = new PgBoss({
      connectionString: this.config.get('database', { infer: true }).url,
      schema: 'pgboss',
      max: 2,
      supervise: false,
    });
    boss.on('error', (error) => this.logger.error(`pg-boss: ${error.message}`));
    await boss.start();
    await createQueue(boss, REMINDERS_QUEUE, { policy: 'singleton', retryLimit: 0, expireInSeconds: 10 * 60 });
    await boss.work(REMINDERS_QUEUE, { pollingIntervalSeconds: 5 }, async () => {
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

  async stop() {
    const boss = this.boss;
    this.boss = null;
    if (boss) await boss.stop({ graceful: true, timeout: 10_000, wait: true });
  }

  async onApplicationShutdown() {
    await this.stop();
  }
}
