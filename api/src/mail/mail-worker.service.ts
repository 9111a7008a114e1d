import { Injectable } from '@nestjs/common';
import { CompiledQuery } from 'kysely';
import type PgBoss from 'pg-boss';
import { QueueWorker, type WorkedQueue } from '../jobs/queue-worker';
import type { Executor } from '../database/database';
import { MailDeliveryService } from './mail-delivery.service';
import { MailOutboxRepository } from './mail-outbox.repository';

export const DELIVER_QUEUE = 'mail-deliver';
export const SWEEP_QUEUE = 'mail-sweep';

interface DeliverJob {
  outboxId: string;
}

/**
 * Runs mail delivery from pg-boss (its own `pgboss` schema in the same database), on the process's
 * one instance (JobQueue).
 *
 * How a message gets from the outbox to a job, and why: the outbox row is the record; a pg-boss job
 * is only the wake-up call. When the worker runs, enqueue() inserts the job with pg-boss's `db`
 * option on the caller's own transaction, so row and job commit or vanish together and delivery
 * starts within a poll (about a second) of the commit. A minutely pg-boss schedule sweeps up
 * whatever has no job: rows queued while no worker ran (tests, a replica with RUN_WORKERS=false),
 * rows whose retries outlived their job, and claims left by a dead sender. A sweep alone would
 * also be correct, but would make every message wait up to a minute.
 *
 * Retries and backoff are pg-boss's: a job whose delivery was refused throws, and pg-boss runs it
 * again after retryDelay × 2^n seconds (with jitter). The `stately` policy with the outbox id as
 * singletonKey keeps at most one waiting job per message.
 *
 * On shutdown it stops fetching and waits for the batch in flight (QueueWorker). A row enqueued by a
 * request still draining after that has no job; another replica's sweep (or this one's next start)
 * sends it.
 */
@Injectable()
export class MailWorker extends QueueWorker {
  constructor(
    private readonly delivery: MailDeliveryService,
    private readonly outbox: MailOutboxRepository,
  ) {
    super();
  }

  protected queuesOf(boss: PgBoss): WorkedQueue[] {
    const { retryDelaySeconds, maxAttempts, batchSize } = this.config.get('mail', { infer: true });
    const deliver: WorkedQueue<DeliverJob> = {
      name: DELIVER_QUEUE,
      options: {
        policy: 'stately',
        // Headroom over our own attempt count: a job can also run without claiming anything.
        retryLimit: maxAttempts + 2,
        retryDelay: retryDelaySeconds,
        retryBackoff: true,
        expireInSeconds: 5 * 60,
      },
      // Batch work: one fetch takes up to MAIL_BATCH_SIZE due jobs (pg-boss's own `for update skip
      // locked limit n`, so two replicas never fetch the same job), their rows are claimed in one
      // statement and sent MAIL_CONCURRENCY at a time. A job whose delivery was refused is failed
      // alone, so pg-boss runs it again after its backoff; the rest complete with the batch.
      work: { pollingIntervalSeconds: 0.5, batchSize },
      handler: async (jobs) => {
        const outcomes = await this.delivery.deliverBatch(jobs.map((job) => job.data.outboxId));
        const refused = jobs.filter((job) => outcomes.get(job.data.outboxId) === 'retry');
        for (const job of refused) {
          await boss.fail(DELIVER_QUEUE, job.id, { message: `Delivery of ${job.data.outboxId} was refused; retrying later` });
        }
      },
    };
    const sweep: WorkedQueue = {
      name: SWEEP_QUEUE,
      options: { policy: 'singleton', retryLimit: 0 },
      work: { pollingIntervalSeconds: 5 },
      handler: () => this.sweep(),
      cron: '* * * * *',
    };
    return [deliver, sweep];
  }

  /** Whatever was queued while no worker ran. */
  protected override async started() {
    await this.sweep(true);
  }

  /** Sends a delivery job on the given executor (the caller's transaction, when there is one). */
  async scheduleDelivery(outboxId: string, trx?: Executor) {
    if (!this.boss) return null;
    const db = trx ? { executeSql: (text: string, values: unknown[]) => trx.executeQuery(CompiledQuery.raw(text, values)) } : undefined;
    return this.boss.send(DELIVER_QUEUE, { outboxId } satisfies DeliverJob, { singletonKey: outboxId, ...(db ? { db } : {}) });
  }

  async sweep(everything = false) {
    await this.delivery.markStaleClaimsUnknown();
    const { retryDelaySeconds } = this.config.get('mail', { infer: true });
    const ids = everything ? await this.outbox.queuedIds(1000) : await this.outbox.overdueIds(retryDelaySeconds, 60, 1000);
    for (const id of ids) await this.scheduleDelivery(id);
  }
}
