import { passwordChangeSchema } from '@loomwright/shared';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { renderStoredMail } from '../src/mail/templates/render';
import { asRequestCookie, sessionCookieOf } from './support/sessions';
import { clearTables, createTestApp, type TestApp } from './support/test-app';

/**
 * Changing a password while signed in. The rules checked are those of OWASP ASVS 4.0.3:
 * V2.1.5 (users can change their password), V2.1.6 (changing it requires the current and the new
 * password), V2.2.3 (a notification is sent after an update to authentication details) and
 * V3.3.3 (the option to end all other sessions after a successful password change: here they
 * always end). Guessing the current password is stalled like sign-in: throttling.spec.ts.
 */
describe('POST /api/auth/password', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t.close());
  beforeEach(async () => clearTables(t.db, ['mail_outbox']));

  let seq = 0;
  /** A fresh player with two signed-in devices (each test owns its account, so passwords never leak between tests). */
  async function playerWithTwoDevices(password = 'first-secret-123') {
    const email = `changer-${Date.now()}-${seq++}@mail.example`;
    const signUp = await t.http().post('/api/auth/sign-up').send({ name: 'Ilse Varga', email, password }).expect(201);
    const laptop = asRequestCookie(sessionCookieOf(signUp)!);
    const signIn = await t.http().post('/api/auth/sign-in').send({ email, password }).expect(200);
    const phone = asRequestCookie(sessionCookieOf(signIn)!);
    return { email, laptop, phone };
  }

  const changedMails = (to: string) =>
    t.db
      .selectFrom('mail_outbox')
      .select(['template', 'data'])
      .where('to_address', '=', to)
      .where('template', '=', 'password-changed')
      .execute();

  it('changes the password, keeps this device signed in with a fresh cookie, signs out every other device, and tells the address', async () => {
    const { email, laptop, phone } = await playerWithTwoDevices();
    const res = await t
      .http()
      .post('/api/auth/password')
      .set('Cookie', laptop)
      .send({ currentPassword: 'first-secret-123', password: 'second-secret-456' })
      .expect(200);
    expect(res.body.user).toMatchObject({ email, role: 'customer' });
    const fresh = asRequestCookie(sessionCookieOf(res)!);
    expect(fresh).not.toBe(laptop);

    await t.http().get('/api/auth/me').set('Cookie', fresh).expect(200);
    const oldLaptop = await t.http().get('/api/auth/me').set('Cookie', laptop);
    expect(oldLaptop.status).toBe(401);
    expect(oldLaptop.body.code).toBe('session_ended');
    const oldPhone = await t.http().get('/api/auth/me').set('Cookie', phone);
    expect(oldPhone.status).toBe(401);
    expect(oldPhone.body.message).toMatch(/password/i);

    await t.http().post('/api/auth/sign-in').send({ email, password: 'first-secret-123' }).expect(401);
    await t.http().post('/api/auth/sign-in').send({ email, password: 'second-secret-456' }).expect(200);

    const mails = await changedMails(email);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.data).toMatchObject({ name: 'Ilse Varga', how: 'signed-in' });
    expect(String((mails[0]!.data as { forgotPasswordUrl: string }).forgotPasswordUrl)).toMatch(/\/forgot-password$/);
    const rendered = renderStoredMail('password-changed', mails[0]!.data, { name: 'Test shop', timezone: 'UTC' } as never);
    expect(rendered.subject).toBe('Your Test shop password was changed');
    expect(rendered.text).toContain('Every device that was signed in has been signed out.');
  });

  it('refuses a wrong current password with its own code and changes nothing', async () => {
    const { email, laptop, phone } = await playerWithTwoDevices();
    const res = await t
      .http()
      .post('/api/auth/password')
      .set('Cookie', laptop)
      .send({ currentPassword: 'not-my-password', password: 'second-secret-456' });
    expect(res.status).toBe(400);
    expect(res.body.code).toBe('current_password_wrong');
    expect(res.body.message).toMatch(/not your current password/);
    await t.http().get('/api/auth/me').set('Cookie', phone).expect(200);
    await t.http().post('/api/auth/sign-in').send({ email, password: 'first-secret-123' }).expect(200);
    expect(await changedMails(email)).toHaveLength(0);
  });

  it('refuses a short new password, and one equal to the current, in the shared schema’s words', async () => {
    const { laptop } = await playerWithTwoDevices();
    const short = await t
      .http()
      .post('/api/auth/password')
      .set('Cookie', laptop)
      .send({ currentPassword: 'first-secret-123', password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.code).toBe('validation_failed');
    expect(JSON.stringify(short.body)).toContain('at least 10 characters');
    const same = await t
      .http()
      .post('/api/auth/password')
      .set('Cookie', laptop)
      .send({ currentPassword: 'first-secret-123', password: 'first-secret-123' });
    expect(same.status).toBe(400);
    expect(JSON.stringify(same.body)).toContain('differs from your current one');
    expect(passwordChangeSchema.safeParse({ currentPassword: 'a', password: 'b'.repeat(10) }).success).toBe(true);
  });

  it('needs a session: a visitor gets 401', async () => {
    const res = await t.http().post('/api/auth/password').send({ currentPassword: 'x', password: 'second-secret-456' });
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('not_signed_in');
  });

  it('a reset by link also tells the address, naming the link', async () => {
    const { email } = await playerWithTwoDevices();
    await t.http().post('/api/auth/password-reset').send({ email }).expect(202);
    const [reset] = await t.db
      .selectFrom('mail_outbox')
      .select('data')
      .where('to_address', '=', email)
      .where('template', '=', 'password-reset')
      .execute();
    const token = new URL(String((reset!.data as { resetUrl: string }).resetUrl)).searchParams.get('token');
    await t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'third-secret-789' }).expect(200);
    const mails = await changedMails(email);
    expect(mails).toHaveLength(1);
    expect(mails[0]!.data).toMatchObject({ how: 'reset-link' });
  });
});
