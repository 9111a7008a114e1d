import { sql } from 'kysely';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { authMessages } from '@loomwright/shared';
import { startMailFake, type MailFake } from '../fakes/mail/mail-fake';
import { MailDeliveryService } from '../src/mail/mail-delivery.service';
import { sessionCookieFor } from './support/sessions';
import { clearTables, createTestApp, type TestApp } from './support/test-app';

/**
 * No usable link token stays readable in the database once its message has gone out (or has been
 * given up on). The tokens are 32 random bytes in base64url (RFC 4648 §5), 43 characters; the
 * check searches every row of every table for the token the player received, so it does not
 * depend on where a copy might hide.
 */
const TOKEN_SHAPE = /[A-Za-z0-9_-]{43}/g;
const tokenIn = (text: string) => /token=([A-Za-z0-9_-]{43})/.exec(text)?.[1];

describe('single-use links at rest', () => {
  let t: TestApp;
  let fake: MailFake;
  let delivery: MailDeliveryService;
  let owner: string;

  beforeAll(async () => {
    fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
    t = await createTestApp({ env: { SMTP_PORT: String(fake.smtpPort), MAIL_MAX_ATTEMPTS: '2' } });
    delivery = t.app.get(MailDeliveryService);
    owner = await sessionCookieFor(t, 'owner');
  }, 60_000);
  afterAll(async () => {
    await fake.stop();
    await t.close();
  });
  beforeEach(async () => {
    await clearTables(t.db, ['auth_tokens', 'mail_outbox']);
    await t.db.deleteFrom('users').where('email', '=', 'ines.okafor@shop.example').execute();
    fake.messages.length = 0;
  });

  /** How many rows, across every table of the application and the job queue, contain `text`. */
  async function rowsContaining(text: string): Promise<number> {
    const tables = await sql<{ schema: string; name: string }>`
      select table_schema as schema, table_name as name from information_schema.tables
      where table_type = 'BASE TABLE' and table_schema in ('public', 'pgboss')`.execute(t.db);
    let found = 0;
    for (const { schema, name } of tables.rows) {
      const hit = await sql<{
        n: string;
      }>`select count(*) as n from ${sql.table(`${schema}.${name}`)} as r where strpos(r::text, ${text}) > 0`.execute(t.db);
      found += Number(hit.rows[0]!.n);
    }
    return found;
  }

  const outboxRow = (template: string) =>
    t.db.selectFrom('mail_outbox').selectAll().where('template', '=', template).orderBy('created_at', 'desc').executeTakeFirstOrThrow();
  const mailedToken = (to: string) => tokenIn(fake.messages.find((m) => m.to.includes(to))?.text ?? '');
  const resend = (id: string) => t.http().post(`/api/mail/${id}/resend`).set('Cookie', owner).send({});

  it('removes a reset link from the outbox as its message is sent; the mailed link still works', async () => {
    await t.http().post('/api/auth/password-reset').send({ email: 'player@mail.example' }).expect(202);
    // While the message waits, its link must be there to be sent (so this search can find one).
    const waiting = tokenIn(JSON.stringify((await outboxRow('password-reset')).data))!;
    expect(waiting).toBeDefined();
    expect(await rowsContaining(waiting)).toBe(1);

    expect(await delivery.deliverPending()).toMatchObject({ sent: 1 });
    const mailed = mailedToken('player@mail.example');
    expect(mailed).toBe(waiting);
    expect(await rowsContaining(mailed!)).toBe(0);
    const row = await outboxRow('password-reset');
    expect(row.state).toBe('sent');
    expect(row.data).toEqual({ name: 'Rowan Achterberg', expiresAt: expect.any(String) });
    // Nothing shaped like a token is left to try.
    expect(JSON.stringify(row).match(TOKEN_SHAPE)).toBeNull();

    await t.http().post('/api/auth/password-reset/confirm').send({ token: mailed, password: 'fresh-bench-pass-1' }).expect(200);
  });

  it('removes an invitation link when its message fails for good; a resend mails a fresh link and the old one is dead', async () => {
    await fake.stop();
    await t
      .http()
      .post('/api/invitations')
      .set('Cookie', owner)
      .send({ email: 'ines.okafor@shop.example', name: 'Ines Okafor', level: 'apprentice', hourlyRate: '45.00' })
      .expect(201);
    const first = tokenIn(JSON.stringify((await outboxRow('staff-invite')).data))!;
    await delivery.deliverPending();
    expect(await delivery.deliverPending()).toMatchObject({ failed: 1 });
    const failed = await outboxRow('staff-invite');
    expect(failed.state).toBe('failed');
    expect(await rowsContaining(first)).toBe(0);
    expect(failed.data).not.toHaveProperty('inviteUrl');

    fake = await fake.restart();
    const again = await resend(failed.id).expect(201);
    expect(again.body).toMatchObject({ template: 'staff-invite', resentFromId: failed.id, state: 'queued' });
    expect(await delivery.deliverPending()).toMatchObject({ sent: 1 });
    const fresh = mailedToken('ines.okafor@shop.example')!;
    expect(fresh).toBeDefined();
    expect(fresh).not.toBe(first);
    expect(await rowsContaining(fresh)).toBe(0);
    // The link nobody received was retired when the fresh one was made.
    const stale = await t.http().post('/api/invitations/accept').send({ token: first, password: 'apprentice-pass-01' }).expect(400);
    expect(stale.body.message).toBe(authMessages.inviteTokenInvalid);
    await t.http().post('/api/invitations/accept').send({ token: fresh, password: 'apprentice-pass-01' }).expect(200);

    // Once accepted, there is nothing to resend: refused in words, and nothing queued.
    const done = await resend(again.body.id).expect(409);
    expect(done.body.message).toBe(
      'Ines Okafor has already accepted this invitation and chosen a password, so there is nothing to resend.',
    );
    expect(await t.db.selectFrom('mail_outbox').select('id').where('state', '=', 'queued').execute()).toHaveLength(0);
  });

  it('a resent reset mails a fresh link and retires the one sent before; never to an address the account left', async () => {
    await t.http().post('/api/auth/password-reset').send({ email: 'cass@mail.example' }).expect(202);
    await delivery.deliverPending();
    const before = mailedToken('cass@mail.example')!;
    const original = await outboxRow('password-reset');

    const copy = await resend(original.id).expect(201);
    expect(await delivery.deliverPending()).toMatchObject({ sent: 1 });
    const after = tokenIn(fake.messages[0]!.text)!;
    expect(fake.messages[0]!.messageId).toBe(copy.body.messageId);
    expect(after).not.toBe(before);
    for (const token of [before, after]) expect(await rowsContaining(token)).toBe(0);
    const old = await t.http().post('/api/auth/password-reset/confirm').send({ token: before, password: 'another-pass-22' }).expect(400);
    expect(old.body.message).toBe(authMessages.resetTokenInvalid);

    // The account moves to another address: the old address gets no new reset link.
    await t.db.updateTable('users').set({ email: 'cass.new@mail.example' }).where('email', '=', 'cass@mail.example').execute();
    try {
      const moved = await resend(original.id).expect(409);
      expect(moved.body.message).toMatch(/different e-mail address/);
      expect(await t.db.selectFrom('mail_outbox').select('id').where('state', '=', 'queued').execute()).toHaveLength(0);
    } finally {
      await t.db.updateTable('users').set({ email: 'cass@mail.example' }).where('email', '=', 'cass.new@mail.example').execute();
    }
  });
});
