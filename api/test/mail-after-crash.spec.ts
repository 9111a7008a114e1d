import net from 'node:net';
import request from 'supertest';
import { SMTPServer } from 'smtp-server';
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from 'vitest';
import { startMailFake, type CaughtMessage, type MailFake } from '../fakes/mail/mail-fake';
import { MailDeliveryService, OUTCOME_UNKNOWN } from '../src/mail/mail-delivery.service';
import { MailOutboxRepository } from '../src/mail/mail-outbox.repository';
import { MailService } from '../src/mail/mail.service';
import { createRelay, testDatabasePort, throughRelay } from './support/tcp-relay';
import { clearTables, createTestApp, type TestApp } from './support/test-app';

/**
 * What the mail log says when a sender stops halfway. The rule under test: a message the mail
 * server accepted (a 250 reply to the end of DATA, RFC 5321 §4.1.1.4) is never logged failed; one
 * whose fate nobody recorded is logged 'unknown' in words, and is never sent again by itself.
 * The database outage is a real one (a TCP relay to PostgreSQL that the test cuts), and the mail
 * servers are real SMTP servers on loopback.
 */
describe('mail whose sender stopped mid-send', () => {
  let t: TestApp;
  let fake: MailFake;
  let mail: MailService;
  let delivery: MailDeliveryService;
  const relay = createRelay(testDatabasePort());

  beforeAll(async () => {
    fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
    t = await createTestApp({ env: { SMTP_PORT: String(fake.smtpPort) }, databaseUrlOverride: throughRelay(await relay.listen()) });
    mail = t.app.get(MailService);
    delivery = t.app.get(MailDeliveryService);
  }, 60_000);
  afterAll(async () => {
    await fake.stop();
    await t.close();
    await relay.cut();
  });
  beforeEach(async () => {
    vi.restoreAllMocks();
    await clearTables(t.db, ['mail_outbox']);
    fake.messages.length = 0;
  });

  const welcome = (to: string) => mail.enqueue(t.db, { template: 'welcome', to, data: { name: 'Juniper Marsh' } });
  const rowOf = (id: string) => t.db.selectFrom('mail_outbox').selectAll().where('id', '=', id).executeTakeFirstOrThrow();

  /** An SMTP server that takes the message, then (before answering 250) runs `whileHolding`. */
  async function withAcceptingServer<T>(whileHolding: () => Promise<void>, run: () => Promise<T>): Promise<T> {
    await fake.stop();
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      onData(stream, _session, callback) {
        stream.resume();
        stream.on('end', () => {
          fake.messages.unshift({ to: ['held'] } as unknown as CaughtMessage);
          whileHolding().then(() => callback(), callback);
        });
      },
    });
    await new Promise<void>((resolve) => server.listen(fake.smtpPort, '127.0.0.1', resolve));
    try {
      return await run();
    } finally {
      await new Promise<void>((resolve) => server.close(() => resolve()));
      fake = await fake.restart();
    }
  }

  it('logs a message the server took as unknown, never failed, when the database went away before it was recorded', async () => {
    const row = await welcome('juniper.marsh@mail.example');
    // The database goes down just as the mail server has the whole message, before its 250.
    const outcome = await withAcceptingServer(
      () => relay.cut(),
      () => delivery.deliverOne(row!.id),
    );
    expect(outcome).toBe('unknown');
    expect(fake.messages).toHaveLength(1);

    await relay.listen();
    // The row still says 'sending' (nothing could be written). The sweep finds the stale claim.
    await vi.waitFor(async () => expect((await rowOf(row!.id)).state).toBe('sending'), { timeout: 10_000, interval: 250 });
    expect(await delivery.markStaleClaimsUnknown(0)).toBe(1);
    const logged = await rowOf(row!.id);
    expect(logged.state).toBe('unknown');
    expect(logged.last_error).toBe(OUTCOME_UNKNOWN);
    expect(logged.last_error).toMatch(/may have received this message/);
    // Never sent again by itself.
    expect(await delivery.deliverPending()).toMatchObject({ sent: 0, skipped: 0 });
    expect(fake.messages).toHaveLength(1);
  });

  it('records sent through a short database blip after the server took the message', async () => {
    const row = await welcome('cass@mail.example');
    const outbox = t.app.get(MailOutboxRepository);
    const markSent = outbox.markSent.bind(outbox);
    let refusals = 0;
    // The first write of 'sent' is lost as if the connection dropped; the next one lands.
    vi.spyOn(outbox, 'markSent').mockImplementation((...args) => {
      if (refusals++ === 0) return Promise.reject(new Error('Connection terminated unexpectedly'));
      return markSent(...args);
    });
    expect(await delivery.deliverOne(row!.id)).toBe('sent');
    expect((await rowOf(row!.id)).state).toBe('sent');
    expect(refusals).toBe(2);
    expect(fake.messages.map((m) => m.to[0])).toEqual(['cass@mail.example']);
  });

  it('logs unknown, not failed, when the connection drops after the message body was sent', async () => {
    const row = await welcome('dropped@mail.example');
    await fake.stop();
    // A server that reads the whole message, then hangs up without a reply.
    const sockets = new Set<net.Socket>();
    const server = net.createServer((socket) => {
      sockets.add(socket);
      let inData = false;
      let buffered = '';
      socket.write('220 test ESMTP\r\n');
      socket.on('data', (chunk) => {
        buffered += chunk.toString('latin1');
        if (inData) {
          if (buffered.includes('\r\n.\r\n')) socket.destroy();
          return;
        }
        let end: number;
        while ((end = buffered.indexOf('\r\n')) >= 0) {
          const line = buffered.slice(0, end);
          buffered = buffered.slice(end + 2);
          const verb = line.slice(0, 4).toUpperCase();
          if (verb === 'EHLO' || verb === 'HELO') socket.write('250 test\r\n');
          else if (verb === 'DATA') {
            inData = true;
            socket.write('354 go ahead\r\n');
          } else socket.write('250 OK\r\n');
        }
      });
      socket.on('error', () => undefined);
    });
    await new Promise<void>((resolve) => server.listen(fake.smtpPort, '127.0.0.1', resolve));
    try {
      expect(await delivery.deliverOne(row!.id)).toBe('unknown');
    } finally {
      for (const s of sockets) s.destroy();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      fake = await fake.restart();
    }
    const logged = await rowOf(row!.id);
    expect(logged.state).toBe('unknown');
    expect(logged.last_error).toContain(OUTCOME_UNKNOWN);
    expect(await delivery.deliverPending()).toMatchObject({ sent: 0 });
    expect(fake.messages).toHaveLength(0);
  });

  it('shows unknown in the mail log, and resends it only when the owner confirms a second copy', async () => {
    const row = await welcome('held@mail.example');
    await t.db
      .updateTable('mail_outbox')
      .set({ state: 'sending', attempts: 1, claimed_at: new Date(Date.now() - 20 * 60_000) })
      .where('id', '=', row!.id)
      .execute();
    await delivery.markStaleClaimsUnknown();
    const owner = request.agent(t.app.getHttpServer());
    await owner.post('/api/auth/sign-in').send({ email: 'owner@shop.example', password: 'demo-pass-2026' }).expect(200);

    const listed = await owner.get('/api/mail?state=unknown').expect(200);
    expect(listed.body.items.map((e: { id: string; state: string }) => [e.id, e.state])).toEqual([[row!.id, 'unknown']]);
    expect((await owner.get('/api/mail?state=failed').expect(200)).body.total).toBe(0);

    const unconfirmed = await owner.post(`/api/mail/${row!.id}/resend`).send({}).expect(409);
    expect(unconfirmed.body.message).toMatch(/may already have arrived/);
    const typo = await owner.post(`/api/mail/${row!.id}/resend`).send({ confirmPossibleDuplicate: 'yes' }).expect(400);
    expect(JSON.stringify(typo.body.message)).toContain('Confirm a second copy must be yes or no (true or false)');
    const stray = await owner.post(`/api/mail/${row!.id}/resend`).send({ confirm: true }).expect(400);
    expect(JSON.stringify(stray.body.message)).toMatch(/confirm/);
    expect(await t.db.selectFrom('mail_outbox').select('id').execute()).toHaveLength(1);

    const confirmed = await owner.post(`/api/mail/${row!.id}/resend`).send({ confirmPossibleDuplicate: true }).expect(201);
    expect(confirmed.body).toMatchObject({ state: 'queued', resentFromId: row!.id, to: 'held@mail.example' });
    expect(await delivery.deliverPending()).toMatchObject({ sent: 1 });
    // The original keeps its true history.
    expect((await rowOf(row!.id)).state).toBe('unknown');
  });
});
