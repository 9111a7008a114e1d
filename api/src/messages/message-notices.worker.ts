import { BeforeApplicationShutdown, Injectable, Logger, OnApplicationBootstrap } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import type PgBoss from 'pg-boss';
import { createQueue } from '../jobs/create-queue';
import { JobQueue } from '../jobs/job-queue.service';
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
export class MessageNoticesWorker implements OnApplicationBootstrap, BeforeApplicationShutdown {
  private readonly logger = new Logger('MessageNoticesWorker');
  private boss: PgBoss | null = null;

  constructor(
    private readonly config: ConfigService<AppConfig, true>,
    private readonly notices: MessageNoticesService,
    private readonly jobs: JobQueue,
  ) {}

  async onApplicationBootstrap() {
    if (this.config.get('app', { infer: true }).runWorkers) await this.start();
  }

  async start() {
    if (this.boss) return;
    // The process's one pg-boss instance (JobQueue), shared with the mail and reminder workers.
    const boss = await this.jobs.start();
    await createQueue(boss, NOTICE_QUEUE, { policy: 'standard', retryLimit: 5, retryDelay: 30, retryBackoff: true });
    await createQueue(boss, NOTICE_SWEEP_QUEUE, { policy: 'singleton', retryLimit: 0 });
    await this.jobs.work(NOTICE_QUEUE, { pollingIntervalSeconds: 5 }, async () => {
      await this.notices.sendDue();
    });
    await this.jobs.work(NOTICE_SWEEP_QUEUE, { pollingIntervalSeconds: 10 }, async () => {
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

  /** Stops fetching notice jobs and waits for the one in flight (JobQueue then stops the instance). */
  async beforeApplicationShutdown() {
    if (!this.boss) return;
    this.boss = null;
    await this.jobs.offWork(NOTICE_QUEUE, NOTICE_SWEEP_QUEUE);
  }
}
