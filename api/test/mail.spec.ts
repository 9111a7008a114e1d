import ICAL from 'ical.js';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { startMailFake, type CaughtMessage, type MailFake } from '../fakes/mail/mail-fake';
import { MailDeliveryService, OUTCOME_UNKNOWN } from '../src/mail/mail-delivery.service';
import { MailService } from '../src/mail/mail.service';
import type { MailTemplateData, OutgoingMail } from '../src/mail/mail.types';
import { clearTables, createTestApp, type TestApp } from './support/test-app';
import { signIn as signInTo } from './support/bench-fixtures';

const scheduledData: MailTemplateData['booking-scheduled'] = {
  name: 'Rosa Delgado-Finch',
  reference: 'LW-2001',
  benchDate: '2027-01-12',
  shipBy: '2027-01-08',
  builderLevel: 'master',
  expectedCompletion: '2027-01-14',
  whatToShip: ['Tuner', 'Overdrive', 'Analog delay', 'Your power supply, with all its leads.'],
  bookingUrl: 'http://localhost:3000/builds/LW-2001',
};

describe('mail delivery through the outbox into the mail fake', () => {
  let t: TestApp;
  let fake: MailFake;
  let mail: MailService;
  let delivery: MailDeliveryService;

  const inbox = async (): Promise<CaughtMessage[]> => (await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages`)).json();

  beforeAll(async () => {
    fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
    t = await createTestApp({ env: { SMTP_PORT: String(fake.smtpPort), MAIL_MAX_ATTEMPTS: '4' } });
    mail = t.app.get(MailService);
    delivery = t.app.get(MailDeliveryService);
  });
  afterAll(async () => {
    await fake.stop();
    await t.close();
  });
  beforeEach(async () => {
    await clearTables(t.db, ['mail_outbox']);
    await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages`, { method: 'DELETE' });
  });

  const enqueueScheduled = (to = 'player@mail.example', extra: Partial<MailTemplateData['booking-scheduled']> = {}) =>
    t.db.transaction().execute((trx) => mail.enqueue(trx, { template: 'booking-scheduled', to, data: { ...scheduledData, ...extra } }));

  it('delivers over SMTP with the outbox Message-ID and the calendar file, readable over the fake HTTP JSON', async () => {
    const row = await enqueueScheduled();
    expect(row?.message_id).toMatch(/^<[0-9a-f-]{36}@shop\.example>$/);
    expect(await delivery.deliverPending()).toMatchObject({ sent: 1, retry: 0, failed: 0 });

    const messages = await inbox();
    expect(messages).toHaveLength(1);
    const [m] = messages;
    expect(m.to).toEqual(['player@mail.example']);
    expect(m.from).toBe('bench@shop.example');
    // RFC 5322 §3.6.4: the Message-ID travels as sent, angle brackets included.
    expect(m.messageId).toBe(row!.message_id);
    expect(m.subject).toBe('Booked: bench date Tue, Jan 12, 2027 for LW-2001');
    expect(m.text).toContain('Fri, Jan 8, 2027');
    expect(m.html).toContain('Master builder');
    expect(m.attachments).toHaveLength(1);
    expect(m.attachments[0]).toMatchObject({ filename: 'LW-2001-ship-by.ics' });
    expect(m.attachments[0].contentType).toBe('text/calendar');
    // RFC 5545, parsed by ical.js after the round trip through SMTP and mailparser.
    const ics = Buffer.from(m.attachments[0].content, 'base64').toString('utf8');
    const event = new ICAL.Event(new ICAL.Component(ICAL.parse(ics)).getFirstSubcomponent('vevent')!);
    expect(event.startDate.toString()).toBe('2027-01-08');
    expect(event.startDate.isDate).toBe(true);

    const one = await (await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages/${m.id}`)).json();
    expect(one.messageId).toBe(row!.message_id);
    const page = await (await fetch(`http://127.0.0.1:${fake.httpPort}/`)).text();
    expect(page).toContain('Booked: bench date Tue, Jan 12, 2027 for LW-2001');
    expect((await fetch(`http://127.0.0.1:${fake.httpPort}/api/messages/nope`)).status).toBe(404);

    const stored = await t.db.selectFrom('mail_outbox').selectAll().executeTakeFirstOrThrow();
    expect(stored).toMatchObject({ state: 'sent', attempts: 1, last_error: null, subject: m.subject });
    expect(stored.sent_at).not.toBeNull();
  });

  it('writes nothing when the transaction that caused the message rolls back', async () => {
    await expect(
      t.db.transaction().execute(async (trx) => {
        await mail.enqueue(trx, { template: 'welcome', to: 'ghost@mail.example', data: { name: 'Ghost' } });
        throw new Error('the booking change failed');
      }),
    ).rejects.toThrow('the booking change failed');
    expect(await t.db.selectFrom('mail_outbox').select('id').execute()).toHaveLength(0);
  });

  it('queues a message once per dedupe key', async () => {
    const first = await mail.enqueue(t.db, { template: 'welcome', to: 'a@mail.example', data: { name: 'A' }, dedupeKey: 'welcome:a' });
    const second = await mail.enqueue(t.db, { template: 'welcome', to: 'a@mail.example', data: { name: 'A' }, dedupeKey: 'welcome:a' });
    expect(first).toBeDefined();
    expect(second).toBeUndefined();
    await delivery.deliverPending();
    expect(await inbox()).toHaveLength(1);
  });

  it('keeps messages while the mail server is down and delivers each exactly once when it is back', async () => {
    await fake.stop();
    const rows = await Promise.all(['p1@mail.example', 'p2@mail.example', 'p3@mail.example'].map((to) => enqueueScheduled(to)));
    // Two rounds with the server down: every attempt is refused, nothing is lost.
    expect(await delivery.deliverPending()).toMatchObject({ sent: 0, retry: 3 });
    expect(await delivery.deliverPending()).toMatchObject({ sent: 0, retry: 3 });
    const waiting = await t.db.selectFrom('mail_outbox').selectAll().execute();
    expect(waiting.map((r) => r.state)).toEqual(['queued', 'queued', 'queued']);
    expect(waiting.every((r) => r.attempts === 2 && /ECONNREFUSED|ECONNECTION/.test(r.last_error ?? ''))).toBe(true);

    fake = await fake.restart();
    expect(await delivery.deliverPending()).toMatchObject({ sent: 3, retry: 0, failed: 0 });
    // A further round finds nothing to send: no duplicates.
    expect(await delivery.deliverPending()).toMatchObject({ sent: 0, retry: 0, failed: 0, skipped: 0 });
    const messages = await inbox();
    expect(messages.map((m) => m.messageId).sort()).toEqual(rows.map((r) => r!.message_id).sort());
    expect(new Set(messages.map((m) => m.to[0]))).toEqual(new Set(['p1@mail.example', 'p2@mail.example', 'p3@mail.example']));
  });

  it('gives up after the last attempt and says why', async () => {
    await fake.stop();
    const row = await mail.enqueue(t.db, { template: 'welcome', to: 'late@mail.example', data: { name: 'Late' } });
    for (let i = 0; i < 3; i += 1) await delivery.deliverPending();
    expect(await delivery.deliverPending()).toMatchObject({ failed: 1 });
    const stored = await t.db.selectFrom('mail_outbox').selectAll().where('id', '=', row!.id).executeTakeFirstOrThrow();
    expect(stored).toMatchObject({ state: 'failed', attempts: 4 });
    expect(stored.last_error).toMatch(/ECONNREFUSED|ECONNECTION/);
    fake = await fake.restart();
    expect(await delivery.deliverPending()).toMatchObject({ sent: 0 });
    expect(await inbox()).toHaveLength(0);
  });

  it('lets only one of several racing senders deliver a message', async () => {
    const rows = await Promise.all(Array.from({ length: 5 }, (_, i) => enqueueScheduled(`race${i}@mail.example`)));
    const outcomes = await Promise.all(
      rows.flatMap((r) => [delivery.deliverOne(r!.id), delivery.deliverOne(r!.id), delivery.deliverOne(r!.id)]),
    );
    expect(outcomes.filter((o) => o === 'sent')).toHaveLength(5);
    expect(outcomes.filter((o) => o === 'skipped')).toHaveLength(10);
    const messages = await inbox();
    expect(messages).toHaveLength(5);
    expect(new Set(messages.map((m) => m.messageId)).size).toBe(5);
  });

  it('never re-sends after a crash: a retried job for a sent row and a stale claim both send nothing', async () => {
    const sent = await enqueueScheduled('sent@mail.example');
    expect(await delivery.deliverOne(sent!.id)).toBe('sent');
    // pg-boss retrying the job of a handler that died after the mail went out:
    expect(await delivery.deliverOne(sent!.id)).toBe('skipped');

    // A sender that claimed a row and died before marking it: the row sits in 'sending'.
    const claimed = await enqueueScheduled('crashed@mail.example');
    await t.db
      .updateTable('mail_outbox')
      .set({ state: 'sending', attempts: 1, claimed_at: new Date() })
      .where('id', '=', claimed!.id)
      .execute();
    expect(await delivery.deliverPending()).toMatchObject({ sent: 0 });
    expect(await delivery.deliverOne(claimed!.id)).toBe('skipped');
    expect(await delivery.markStaleClaimsUnknown()).toBe(0); // still inside its lease
    await t.db
      .updateTable('mail_outbox')
      .set({ claimed_at: new Date(Date.now() - 16 * 60_000) })
      .where('id', '=', claimed!.id)
      .execute();
    expect(await delivery.markStaleClaimsUnknown()).toBe(1);
    const stale = await t.db.selectFrom('mail_outbox').selectAll().where('id', '=', claimed!.id).executeTakeFirstOrThrow();
    expect(stale).toMatchObject({ state: 'unknown', last_error: OUTCOME_UNKNOWN });
    expect(await delivery.deliverPending()).toMatchObject({ sent: 0 });
    expect((await inbox()).map((m) => m.to[0])).toEqual(['sent@mail.example']);
  });

  it('fails a message whose data the template cannot use, naming the missing key, without sending', async () => {
    // Data as a stored row may hold it (the types refuse it at compile time): the run-time check is what is tested.
    await mail.enqueue(t.db, { template: 'password-reset', to: 'p@mail.example', data: { name: 'P' } } as unknown as OutgoingMail);
    expect(await delivery.deliverPending()).toMatchObject({ failed: 1 });
    const row = await t.db.selectFrom('mail_outbox').selectAll().executeTakeFirstOrThrow();
    expect(row.state).toBe('failed');
    expect(row.last_error).toBe('The message cannot be written: the data has no "resetUrl".');
    expect(await inbox()).toHaveLength(0);
  });

  describe('the mail log API', () => {
    const signIn = (email: string) => signInTo(t.app, email);

    it('pages newest first, filters by state and searches by recipient: every message for the owner, only theirs for a builder', async () => {
      for (let i = 0; i < 7; i += 1) {
        await mail.enqueue(t.db, { template: 'welcome', to: `Person${i}@Mail.Example`, data: { name: `P${i}` } });
      }
      await mail.enqueue(t.db, { template: 'password-reset', to: 'broken@mail.example', data: {} } as unknown as OutgoingMail);
      await delivery.deliverPending();
      // The owner's log holds every message; a builder's only theirs (none of these).
      const builder = await signIn('owner@shop.example');
      const first = await builder.get('/api/mail?page=1&pageSize=3').expect(200);
      expect(first.body).toMatchObject({ total: 8, page: 1, pageSize: 3, canResend: true });
      expect(first.body.items).toHaveLength(3);
      expect(first.body.items[0].to).toBe('broken@mail.example');
      const third = await builder.get('/api/mail?page=3&pageSize=3').expect(200);
      expect(third.body.items).toHaveLength(2);
      const failed = await builder.get('/api/mail?state=failed').expect(200);
      expect(failed.body.total).toBe(1);
      expect(failed.body.items[0]).toMatchObject({ state: 'failed', attempts: 1, template: 'password-reset' });
      expect(failed.body.items[0].lastError).toBe('The message cannot be written: the data has no "name".');
      const found = await builder.get('/api/mail?q=person3@mail').expect(200);
      expect(found.body.items.map((e: { to: string }) => e.to)).toEqual(['Person3@Mail.Example']);
      // A search term is matched literally, never as a LIKE pattern.
      expect((await builder.get('/api/mail?q=%25').expect(200)).body.total).toBe(0);

      const aBuilder = await signIn('builder@shop.example');
      expect((await aBuilder.get('/api/mail').expect(200)).body).toMatchObject({ total: 0, canResend: false });

      const player = await signIn('player@mail.example');
      await player.get('/api/mail').expect(403);
      await request(t.app.getHttpServer()).get('/api/mail').expect(401);
    });

    it('answers bad filters with 400 in words', async () => {
      const owner = await signIn('owner@shop.example');
      const bad = await owner.get('/api/mail?state=lost&pageSize=500&page=0').expect(400);
      const text = JSON.stringify(bad.body.message);
      expect(text).toContain('Status must be one of: \\"queued\\", \\"sending\\", \\"sent\\", \\"failed\\" or \\"unknown\\"');
      expect(text).toContain('Rows per page can be at most 100');
      expect(text).toContain('Page must be 1 or more');
    });

    it('lets the owner resend: a new message with a new Message-ID, linked to the original', async () => {
      const original = await enqueueScheduled('again@mail.example');
      await delivery.deliverPending();
      const builder = await signIn('builder@shop.example');
      await builder.post(`/api/mail/${original!.id}/resend`).send({}).expect(403);
      const owner = await signIn('owner@shop.example');
      const res = await owner.post(`/api/mail/${original!.id}/resend`).send({}).expect(201);
      expect(res.body).toMatchObject({
        state: 'queued',
        to: 'again@mail.example',
        resentFromId: original!.id,
        template: 'booking-scheduled',
      });
      expect(res.body.messageId).not.toBe(original!.message_id);
      // While the copy waits, resending it again is refused.
      const busy = await owner.post(`/api/mail/${res.body.id}/resend`).send({}).expect(409);
      expect(busy.body.message).toContain('still waiting to go out');
      await delivery.deliverPending();
      const messages = await inbox();
      expect(messages.map((m) => m.messageId)).toEqual([res.body.messageId, original!.message_id]);
      expect(messages[0].subject).toBe(messages[1].subject);

      const missing = await owner.post('/api/mail/00000000-0000-4000-8000-000000000000/resend').send({}).expect(404);
      expect(missing.body.message).toContain('no message with the id');
      const bad = await owner.post('/api/mail/not-a-uuid/resend').send({}).expect(400);
      expect(bad.body.message).toBe('This address does not name a message in the mail log; open it again from its list');
    });

    it('delivers and resends a row written under the older key names as the same message as under today’s keys', async () => {
      // As an earlier version wrote it: the player as customerName, the page as buildUrl, what to
      // ship as pedals with the switcher flag (still pending after an upgrade, or resent later).
      const older = {
        customerName: 'Rosa Delgado-Finch',
        reference: 'LW-2001',
        benchDate: '2027-01-12',
        shipBy: '2027-01-08',
        builderLevel: 'master',
        expectedCompletion: '2027-01-14',
        pedals: ['Tuner', 'Overdrive', 'Analog delay'],
        switcher: true,
        buildUrl: 'http://localhost:3000/builds/LW-2001',
      };
      const stored = await t.db
        .insertInto('mail_outbox')
        .values({
          message_id: '<older-keys@shop.example>',
          template: 'booking-scheduled',
          to_address: 'older@mail.example',
          data: JSON.stringify(older),
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      await enqueueScheduled('today@mail.example', {
        whatToShip: [
          'Your pedals (3): Tuner, Overdrive, Analog delay.',
          'Your power supply, with all its leads.',
          'Your loop switcher, with its power lead and any MIDI or control cables.',
        ],
      });
      expect(await delivery.deliverPending()).toMatchObject({ sent: 2, failed: 0 });
      const owner = await signIn('owner@shop.example');
      await owner.post(`/api/mail/${stored.id}/resend`).send({}).expect(201);
      expect(await delivery.deliverPending()).toMatchObject({ sent: 1, failed: 0 });
      const byTo = new Map((await inbox()).map((m) => [m.to[0], m]));
      const today = byTo.get('today@mail.example')!;
      const copies = (await inbox()).filter((m) => m.to[0] === 'older@mail.example');
      expect(copies).toHaveLength(2);
      for (const m of copies) {
        expect(m.subject).toBe(today.subject);
        expect(m.text).toBe(today.text);
        expect(m.html).toBe(today.html);
      }
      expect(today.text).toContain('Hello Rosa Delgado-Finch');
      expect(today.text).toContain('See your booking: http://localhost:3000/builds/LW-2001');
    });
  });
});
