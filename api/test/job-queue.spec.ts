import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { JobQueue } from '../src/jobs/job-queue.service';
import { MailWorker } from '../src/mail/mail-worker.service';
import { MessageNoticesWorker } from '../src/messages/message-notices.worker';
import { RemindersWorker } from '../src/reminders/reminders-worker.service';
import { createTestApp, type TestApp } from './support/test-app';

/**
 * One pg-boss instance per process: the mail, message-notice and reminder workers (and pg-boss's
 * own maintenance) run on the JobQueue's instance and its one pool, which stops once on shutdown,
 * after every worker has stopped fetching.
 */
describe('the job queue: one pg-boss instance per process', () => {
  let t: TestApp;
  let closed = false;

  beforeAll(async () => {
    t = await createTestApp({ env: { RUN_WORKERS: 'true' } });
  });
  afterAll(async () => {
    if (!closed) await t.close();
  });

  it('every worker runs on the one instance, whose pool holds at most its five connections', async () => {
    const boss = await t.app.get(JobQueue).start();
    const workers = [t.app.get(MailWorker), t.app.get(MessageNoticesWorker), t.app.get(RemindersWorker)];
    for (const worker of workers) expect((worker as unknown as { boss: unknown }).boss).toBe(boss);
    // Each worker's queues exist and are worked (pg-boss keeps one row per queue in pgboss.queue).
    const queues = await sql<{ name: string }>`select name from pgboss.queue order by name`.execute(t.db);
    expect(queues.rows.map((q) => q.name)).toEqual(
      expect.arrayContaining(['mail-deliver', 'mail-sweep', 'message-notices', 'message-notices-sweep', 'reminders-sweep']),
    );
    // pg-boss names its connections 'pgboss' (application_name, set in pg-boss's src/db.js). Three
    // instances used to hold up to 3 + 2 + 2; the one pool holds at most 5.
    const { rows } = await sql<{ n: string }>`select count(*)::text as n from pg_stat_activity
      where datname = current_database() and application_name = 'pgboss'`.execute(t.db);
    expect(Number(rows[0].n)).toBeGreaterThan(0);
    expect(Number(rows[0].n)).toBeLessThanOrEqual(5);
  });

  it('stops the instance once on shutdown, after the workers stopped fetching from their queues', async () => {
    const jobs = t.app.get(JobQueue);
    const boss = await jobs.start();
    const offWork = vi.spyOn(jobs, 'offWork');
    const stop = vi.spyOn(boss, 'stop');
    closed = true;
    await t.close();
    expect(offWork.mock.calls.map((call) => call.join(',')).sort()).toEqual(
      ['mail-deliver,mail-sweep', 'message-notices,message-notices-sweep', 'reminders-sweep'].sort(),
    );
    expect(stop).toHaveBeenCalledTimes(1);
    const lastOffWork = Math.max(...offWork.mock.invocationCallOrder);
    expect(stop.mock.invocationCallOrder[0]).toBeGreaterThan(lastOffWork);
  });
});
