import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMailFake, type CaughtMessage, type MailFake } from '../fakes/mail/mail-fake';
import { MailService } from '../src/mail/mail.service';
import { MailWorker } from '../src/mail/mail-worker.service';
import { eventually } from './support/payment-harness';
import { createTestApp, type TestApp } from './support/test-app';

/** pg-boss retries after a second here (MAIL_RETRY_DELAY_SECONDS=1); on a busy machine its polling takes longer. */
const WORKER_WAIT_MS = 25_000;

describe('the pg-boss mail worker (RUN_WORKERS=true)', () => {
  let t: TestApp;
  let fake: MailFake;
  let mail: MailService;

  const jobsFor = (outboxId: string) =>
    sql<{
      state: string;
      retry_count: number;
    }>`select state, retry_count from pgboss.job where name = 'mail-deliver' and singleton_key = ${outboxId}`
      .execute(t.db)
      .then((r) => r.rows);
  const outboxRow = (id: string) => t.db.selectFrom('mail_outbox').selectAll().where('id', '=', id).executeTakeFirstOrThrow();

  beforeAll(async () => {
    fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
    t = await createTestApp({ env: { SMTP_PORT: String(fake.smtpPort), RUN_WORKERS: 'true', MAIL_RETRY_DELAY_SECONDS: '1' } });
    mail = t.app.get(MailService);
    expect(t.app.get(MailWorker).running).toBe(true);
  });
  afterAll(async () => {
    await fake.stop();
    await t.close();
  });

  it('inserts the delivery job in the caller transaction: a rollback leaves neither row nor job', async () => {
    let id = '';
    await expect(
      t.db.transaction().execute(async (trx) => {
        id = (await mail.enqueue(trx, { template: 'welcome', to: 'ghost@mail.example', data: { name: 'Ghost' } }))!.id;
        const inside = await sql<{ n: string }>`select count(*) as n from pgboss.job where singleton_key = ${id}`.execute(trx);
        expect(inside.rows[0].n).toBe('1');
        // Not visible outside the transaction before it commits.
        expect(await jobsFor(id)).toHaveLength(0);
        throw new Error('the change failed');
      }),
    ).rejects.toThrow('the change failed');
    expect(await jobsFor(id)).toHaveLength(0);
    expect(await t.db.selectFrom('mail_outbox').select('id').where('id', '=', id).execute()).toHaveLength(0);
  });

  it('retries with backoff while the mail server is down and delivers exactly once when it is back', async () => {
    await fake.stop();
    const row = (await t.db.transaction().execute((trx) =>
      mail.enqueue(trx, {
        template: 'deposit-refunded',
        to: 'patient@mail.example',
        data: { name: 'Pat', reference: 'LW-3003', amount: '150.00', currency: 'USD' },
      }),
    ))!;
    const refused = await eventually(
      async () => {
        const r = await outboxRow(row.id);
        return r.attempts >= 1 && r.state === 'queued' && r.last_error ? r : undefined;
      },
      'a refused attempt',
      WORKER_WAIT_MS,
    );
    expect(refused.last_error).toMatch(/ECONNREFUSED|ECONNECTION/);
    // pg-boss holds the job for a later retry rather than dropping it.
    await eventually(
      async () => (await jobsFor(row.id)).some((j) => j.state === 'retry' || j.state === 'active' || j.state === 'created'),
      'the job to wait for its retry',
      WORKER_WAIT_MS,
    );

    fake = await fake.restart();
    const sent = await eventually(
      async () => {
        const r = await outboxRow(row.id);
        return r.state === 'sent' ? r : undefined;
      },
      'delivery after the server came back',
      WORKER_WAIT_MS,
    );
    expect(sent.attempts).toBeGreaterThanOrEqual(2);
    await eventually(async () => (await jobsFor(row.id)).every((j) => j.state === 'completed'), 'the job to complete', WORKER_WAIT_MS);
    // A short wait for any stray retry; the message must still be there once.
    await new Promise((r) => setTimeout(r, 2_500));
    const inbox: CaughtMessage[] = await (await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages?to=patient@mail.example`)).json();
    expect(inbox).toHaveLength(1);
    expect(inbox[0].messageId).toBe(row.message_id);
    expect(inbox[0].subject).toBe('Deposit refunded for LW-3003: $150.00');
  });

  it('sweeps up a message queued where no worker ran (another replica), once it is overdue', async () => {
    const inserted = await t.db
      .insertInto('mail_outbox')
      .values({
        message_id: '<swept-1@shop.example>',
        template: 'welcome',
        to_address: 'swept@mail.example',
        data: JSON.stringify({ name: 'Sam' }),
        created_at: sql`now() - interval '5 minutes'`,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    const fresh = await t.db
      .insertInto('mail_outbox')
      .values({
        message_id: '<fresh-1@shop.example>',
        template: 'welcome',
        to_address: 'fresh@mail.example',
        data: JSON.stringify({ name: 'Fay' }),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await t.app.get(MailWorker).sweep();
    await eventually(async () => (await outboxRow(inserted.id)).state === 'sent', 'the swept message to be sent', WORKER_WAIT_MS);
    // The fresh row has no job and is not overdue yet: the sweep leaves it for later.
    expect(await jobsFor(fresh.id)).toHaveLength(0);
    const inbox: CaughtMessage[] = await (await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages?to=swept@mail.example`)).json();
    expect(inbox.map((m) => m.messageId)).toEqual(['<swept-1@shop.example>']);
  });
});
