import { createHash } from 'node:crypto';
import { sql } from 'kysely';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { clearTables, createTestApp, type TestApp } from './support/test-app';
import { asRequestCookie, sessionCookieFor, sessionCookieOf } from './support/sessions';

const resetMails = (t: TestApp, to: string) =>
  t.db
    .selectFrom('mail_outbox')
    .select(['template', 'to_address', 'data', 'user_id'])
    .where('template', '=', 'password-reset')
    .where('to_address', '=', to)
    .orderBy('created_at', 'desc')
    .execute();

const tokenFrom = (resetUrl: unknown) => new URL(String(resetUrl)).searchParams.get('token')!;

describe('password reset by e-mail', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t.close());
  beforeEach(async () => clearTables(t.db, ['auth_tokens', 'mail_outbox']));

  it('gives the same answer for a registered and an unknown e-mail, and mails only the registered one', async () => {
    const known = await t.http().post('/api/auth/password-reset').send({ email: 'Player@Mail.Example' });
    const unknown = await t.http().post('/api/auth/password-reset').send({ email: 'nobody-here@mail.example' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(unknown.body).toEqual(known.body);
    expect(await resetMails(t, 'player@mail.example')).toHaveLength(1);
    const all = await t.db.selectFrom('mail_outbox').select('to_address').execute();
    expect(all.map((m) => m.to_address)).toEqual(['player@mail.example']);
  });

  it('stores only a SHA-256 hash of the token, and links to the storefront reset page', async () => {
    await t.http().post('/api/auth/password-reset').send({ email: 'player@mail.example' }).expect(202);
    const [mail] = await resetMails(t, 'player@mail.example');
    const data = mail!.data as { name: string; resetUrl: string; expiresAt: string };
    expect(data.name).toBe('Rowan Achterberg');
    expect(data.resetUrl).toMatch(/^https?:\/\/[^/]+\/reset-password\?token=[A-Za-z0-9_-]{43}$/);
    const token = tokenFrom(data.resetUrl);
    const rows = await t.db.selectFrom('auth_tokens').selectAll().execute();
    expect(rows).toHaveLength(1);
    // OWASP Forgot Password Cheat Sheet: tokens are stored hashed. Hex SHA-256 per FIPS 180-4.
    expect(rows[0]!.token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(rows)).not.toContain(token);
    // Expires within the hour (PASSWORD_RESET_MINUTES default 60).
    const minutes = (new Date(data.expiresAt).getTime() - Date.now()) / 60_000;
    expect(minutes).toBeGreaterThan(58);
    expect(minutes).toBeLessThanOrEqual(60);
  });

  it('sets the new password once: the link signs the player in, and cannot be used again', async () => {
    await t.http().post('/api/auth/password-reset').send({ email: 'cass@mail.example' }).expect(202);
    const token = tokenFrom((await resetMails(t, 'cass@mail.example'))[0]!.data.resetUrl);

    const done = await t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'a-brand-new-secret' }).expect(200);
    expect(done.body.user).toMatchObject({ email: 'cass@mail.example', role: 'customer' });
    const cookie = sessionCookieOf(done)!;
    await t.http().get('/api/auth/me').set('Cookie', asRequestCookie(cookie)).expect(200);

    await t.http().post('/api/auth/sign-in').send({ email: 'cass@mail.example', password: 'demo-pass-2026' }).expect(401);
    await t.http().post('/api/auth/sign-in').send({ email: 'cass@mail.example', password: 'a-brand-new-secret' }).expect(200);

    const again = await t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'yet-another-secret' });
    expect(again.status).toBe(400);
    expect(again.body.message).toMatch(/expired or was already used/);
    await t.http().post('/api/auth/sign-in').send({ email: 'cass@mail.example', password: 'yet-another-secret' }).expect(401);
  });

  it('ends sessions that were signed in before the reset', async () => {
    // Signed in earlier, e.g. on a lost phone.
    const old = await sessionCookieFor(t, 'customerA');
    await t.http().get('/api/auth/me').set('Cookie', old).expect(200);

    await t.http().post('/api/auth/password-reset').send({ email: 'player@mail.example' }).expect(202);
    const token = tokenFrom((await resetMails(t, 'player@mail.example'))[0]!.data.resetUrl);
    const done = await t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'locked-out-the-thief' }).expect(200);

    const refused = await t.http().get('/api/auth/me').set('Cookie', old);
    expect(refused.status).toBe(401);
    expect(refused.body.message).toMatch(/password was changed/);
    await t
      .http()
      .get('/api/auth/me')
      .set('Cookie', asRequestCookie(sessionCookieOf(done)!))
      .expect(200);
  });

  it('refuses an expired link', async () => {
    await t.http().post('/api/auth/password-reset').send({ email: 'player@mail.example' }).expect(202);
    const token = tokenFrom((await resetMails(t, 'player@mail.example'))[0]!.data.resetUrl);
    await t.db
      .updateTable('auth_tokens')
      .set({ expires_at: sql`now() - interval '1 second'` })
      .execute();
    const res = await t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'too-late-password' });
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/expired/);
  });

  it('retires an older link when a newer one is sent', async () => {
    await t.http().post('/api/auth/password-reset').send({ email: 'player@mail.example' }).expect(202);
    await t.http().post('/api/auth/password-reset').send({ email: 'player@mail.example' }).expect(202);
    const [newer, older] = await resetMails(t, 'player@mail.example');
    const oldToken = tokenFrom(older!.data.resetUrl);
    const newToken = tokenFrom(newer!.data.resetUrl);
    expect(oldToken).not.toBe(newToken);
    await t.http().post('/api/auth/password-reset/confirm').send({ token: oldToken, password: 'from-the-old-link' }).expect(400);
    await t.http().post('/api/auth/password-reset/confirm').send({ token: newToken, password: 'from-the-new-link' }).expect(200);
  });

  it('names the field when the input is bad, and never answers 500', async () => {
    const noEmail = await t.http().post('/api/auth/password-reset').send({ email: 'nope' }).expect(400);
    expect(JSON.stringify(noEmail.body.message)).toContain('Enter an e-mail address, like name@example.com');
    const bad = await t.http().post('/api/auth/password-reset/confirm').send({ token: 'short', password: 'short' }).expect(400);
    const text = JSON.stringify(bad.body.message);
    expect(text).toContain('This link is incomplete; open the link from the e-mail again');
    expect(text).toContain('Choose a password of at least 10 characters');
    // A well-formed token that was never issued.
    const unknown = await t
      .http()
      .post('/api/auth/password-reset/confirm')
      .send({ token: 'A'.repeat(43), password: 'a-long-password' });
    expect(unknown.status).toBe(400);
  });

  it('only one of two simultaneous uses of the same link succeeds', async () => {
    await t.http().post('/api/auth/password-reset').send({ email: 'player@mail.example' }).expect(202);
    const token = tokenFrom((await resetMails(t, 'player@mail.example'))[0]!.data.resetUrl);
    const results = await Promise.all([
      t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'racing-password-1' }),
      t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'racing-password-2' }),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 400]);
  });
});
