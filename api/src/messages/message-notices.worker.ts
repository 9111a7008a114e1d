import { Injectable, Logger, OnApplicationBootstrap, OnApplicationShutdown } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import PgBoss from 'pg-boss';
import { createQueue } from '../jobs/create-queue';
import type { AppConfig } from '../config/configuration';
import { MessageNoticesService } from './message-notices.service';

export const NOTICE_QUEUE = 'message-notices';
export const NOTICE_SWEEP_QUEUE = 'message-notices-sweep';

/**
 * Runs message notices from pg-boss: a job per notice that starts when its window closes, and a
 * minutely schedule that sweeps up any notice whose job is missing (queued by a replica that runs
 * no workers, or lost). Both only call MessageNoticesService.sendDue(), whose claim decides who
 * sends, so a job that runs twice or on two replicas queues one mail.
 */
@Injectable()
export class MessageNoticesWorker implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('MessageNoticesWorker');
  private boss: PgBoss | null = null;

  constructor(
    private readonly config: ConfigService<AppConfig, true>,
    private readonly notices: MessageNoticesService,
  ) {}

  async onApplicationBootstrap() {
    if (this.config.get('app', { infer: true }).runWorkers) await this.start();
  }

  async start() {
    if (this.boss) return;
    const boss = new PgBoss({ connectionString: this.config.get('database', { infer: true }).url, schema: 'pgboss', max: 2 });
    boss.on('error', (error) => this.logger.error(`pg-boss: ${error.message}`));
    await boss.start();
    await createQueue(boss, NOTICE_QUEUE, { policy: 'standard', retryLimit: 5, retryDelay: 30, retryBackoff: true });
    await createQueue(boss, NOTICE_SWEEP_QUEUE, { policy: 'singleton', retryLimit: 0 });
    await boss.work(NOTICE_QUEUE, { pollingIntervalSeconds: 5 }, async () => {
      await this.notices.sendDue();
    });
    await boss.work(NOTICE_SWEEP_QUEUE, { pollingIntervalSeconds: 10 }, async () => {
      await this.notices.sendDue();
    });
    await boss.schedule(NOTICE_SWEEP_QUEUE, '* * * * *');
    this.boss = boss;
  }

  /** A wake-up call for when a notice's window closes (the sweep covers it if this is lost). */
  async wakeAt(noticeId: string, dueAt: Date) {
    if (!this.boss) return;
    try {
      await this.boss.send(NOTICE_QUEUE, { noticeId }, { startAfter: dueAt, singletonKey: noticeId });
    } catch (error) {
      this.logger.warn(`Could not schedule notice ${noticeId}; the minutely sweep will send it (${(error as Error).message})`);
    }
  }

  async onApplicationShutdown() {
    const boss = this.boss;
    this.boss = null;
    if (boss) await boss.stop({ graceful: true, timeout: 10_000, wait: true });
  }
}
