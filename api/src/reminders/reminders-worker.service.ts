import { Injectable } from '@nestjs/common';
import { QueueWorker, type WorkedQueue } from '../jobs/queue-worker';
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
export class RemindersWorker extends QueueWorker {
  constructor(private readonly reminders: RemindersService) {
    super();
  }

  protected queuesOf(): WorkedQueue[] {
    return [
      {
        name: REMINDERS_QUEUE,
        options: { policy: 'singleton', retryLimit: 0, expireInSeconds: 10 * 60 },
        work: { pollingIntervalSeconds: 5 },
        handler: () => this.reminders.runDue(),
        cron: REMINDERS_CRON,
      },
    ];
  }

  /** Asks for a sweep now (the queue's own job, so a worker in any process may run it). */
  async sweepSoon() {
    if (!this.boss) return null;
    return this.boss.send(REMINDERS_QUEUE, {});
  }
}
