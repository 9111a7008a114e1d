import { Injectable } from '@nestjs/common';
import { QueueWorker, type WorkedQueue } from '../jobs/queue-worker';
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
export class MessageNoticesWorker extends QueueWorker {
  constructor(private readonly notices: MessageNoticesService) {
    super();
  }

  protected queuesOf(): WorkedQueue[] {
    const sendDue = () => this.notices.sendDue();
    return [
      {
        name: NOTICE_QUEUE,
        options: { policy: 'standard', retryLimit: 5, retryDelay: 30, retryBackoff: true },
        work: { pollingIntervalSeconds: 5 },
        handler: sendDue,
      },
      {
        name: NOTICE_SWEEP_QUEUE,
        options: { policy: 'singleton', retryLimit: 0 },
        work: { pollingIntervalSeconds: 10 },
        handler: sendDue,
        cron: '* * * * *',
      },
    ];
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
}
