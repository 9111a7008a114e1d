import { Client } from 'pg';
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freePort, startApiProcess, Visitor, type ApiProcess } from './support/api-process';
import { eventually } from './support/payment-harness';
import { createEmptyDatabase } from './support/test-app';

/**
 * SIGTERM, as an orchestrator or `docker stop` sends it before a rolling update: the built API as
 * its own process, with a request and a mail job both held half-way, must
 * - answer readiness with 503 while it drains (so a load balancer takes it out of rotation),
 * - let the mail job in flight finish and record 'sent' (no message lost, none sent twice),
 * - close its listener, yet give the request in flight its full answer,
 * - exit 0, well within its shutdown bound.
 * (Kubernetes documentation, "Pod Lifecycle" → "Termination of Pods": SIGTERM, then a grace period
 * of 30 s by default before SIGKILL; the readiness probe takes the pod out of the Service's endpoints.)
 */
describe('graceful shutdown of an API process', () => {
  let api: ApiProcess;
  let drop: () => Promise<void>;
  let smtp: SMTPServer;
  let db: Client;
  const received: string[] = [];
  let releaseMail: () => void = () => undefined;
  const mailHeld = new Promise<void>((resolve) => (releaseMail = resolve));
  let mailArrived: () => void = () => undefined;
  const mailInFlight = new Promise<void>((resolve) => (mailArrived = resolve));

  beforeAll(async () => {
    const database = await createEmptyDatabase('lw_shutdown');
    drop = database.drop;
    // A mail server that reads the whole message, then holds its 250 reply until the test says so.
    smtp = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      logger: false,
      onData(stream, session, callback) {
        stream.resume();
        stream.on('end', () => {
          received.push(session.envelope.rcptTo.map((r) => r.address).join(','));
          mailArrived();
          mailHeld.then(() => callback());
        });
      },
    });
    const smtpPort = await freePort();
    await new Promise<void>((resolve) => smtp.listen(smtpPort, '127.0.0.1', resolve));
    api = await startApiProcess({
      DATABASE_URL: database.url,
      SEED_DEMO: 'true',
      RUN_WORKERS: 'true',
      JWT_SECRET: 'shutdown-test-secret-0123456789abcdef',
      SMTP_HOST: '127.0.0.1',
      SMTP_PORT: String(smtpPort),
      LOG_LEVEL: 'info',
      AUTH_THROTTLE_LIMIT: '1000',
      SHUTDOWN_DELAY_SECONDS: '1',
      SHUTDOWN_TIMEOUT_SECONDS: '45',
    });
    db = new Client({ connectionString: database.url });
    await db.connect();
  }, 90_000);

  afterAll(async () => {
    releaseMail();
    await db?.query('rollback').catch(() => undefined);
    await db?.end();
    await api?.stop();
    await new Promise<void>((resolve) => smtp.close(() => resolve()));
    await drop?.();
  });

  it('drains the request and the mail job in flight on SIGTERM, and exits 0', async () => {
    try {
      const owner = new Visitor(api.url);
      expect((await owner.call('POST', '/api/auth/sign-in', { email: 'owner@shop.example', password: 'demo-pass-2026' })).status).toBe(200);
      expect((await owner.call('GET', '/api/health/ready')).status).toBe(200);

      // A job in flight: a reset e-mail the mail server has read but not yet answered.
      expect((await new Visitor(api.url).call('POST', '/api/auth/password-reset', { email: 'player@mail.example' })).status).toBe(202);
      await mailInFlight;

      // A request in flight: the owner's settings change waits on a row lock the test holds.
      await db.query('begin');
      await db.query('select 1 from shop_settings for update');
      const slow = owner.call('PATCH', '/api/settings', { tagline: 'Boards wired while you play.' });
      await eventually(
        async () =>
          (await db.query(`select 1 from pg_stat_activity where wait_event_type = 'Lock' and datname = current_database()`)).rowCount,
        'the settings request to wait on the lock',
        15_000,
      );

      const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null; at: number }>((resolve) =>
        api.child.once('exit', (code, signal) => resolve({ code, signal, at: Date.now() })),
      );
      const sentAt = Date.now();
      api.child.kill('SIGTERM');

      // Out of rotation at once, in words.
      const ready = await eventually(async () => {
        const r = await new Visitor(api.url).call('GET', '/api/health/ready');
        return r.status === 503 ? r : undefined;
      }, 'readiness to answer 503');
      expect(ready.body.reasons).toContain('this process is shutting down');
      expect((await new Visitor(api.url).call('GET', '/api/health/live')).status).toBe(200);

      // The mail server answers; the job records it and the worker stops; then the listener closes
      // while the settings request is still waiting.
      releaseMail();
      await eventually(
        async () => {
          try {
            await fetch(`${api.url}/api/health/live`);
            return false;
          } catch {
            return true;
          }
        },
        'the listener to close',
        20_000,
      );
      expect(api.child.exitCode).toBeNull();

      await db.query('commit');
      const answer = await slow;
      expect(answer.status, answer.text).toBe(200);
      expect(answer.body.tagline).toBe('Boards wired while you play.');

      const exit = await exited;
      expect(exit).toMatchObject({ code: 0, signal: null });
      // Kubernetes' default grace period is 30 s; this drain must end well inside it.
      expect(exit.at - sentAt).toBeLessThan(30_000);

      // Nothing lost, nothing twice: the message is recorded sent, and the server saw it once.
      const rows = await db.query(`select state from mail_outbox where template = 'password-reset'`);
      expect(rows.rows).toEqual([{ state: 'sent' }]);
      expect(received).toEqual(['player@mail.example']);
      const settings = await db.query('select tagline from shop_settings');
      expect(settings.rows[0].tagline).toBe('Boards wired while you play.');
      const lines = api.lines.filter((l) => l.startsWith('{')).map((l) => JSON.parse(l) as { msg?: string });
      expect(lines.some((l) => /SIGTERM: requests and jobs drained/.test(l.msg ?? ''))).toBe(true);
    } catch (error) {
      // The process's own log lines, only when something went wrong.
      console.error(`API process output:\n${api.output().split('\n').slice(-60).join('\n')}`);
      throw error;
    }
  }, 90_000);
});
