import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app';

const sessionCookie = (res: { headers: Record<string, unknown> }) =>
  ((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith('lw_session='));

describe('sign-up, sign-in, me and sign-out', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t.close());

  it('signs a new player up as a customer with an httpOnly, SameSite session cookie', async () => {
    const res = await t
      .http()
      .post('/api/auth/sign-up')
      .send({ email: 'Juniper.Marsh@Mail.Example', password: 'a-long-password', name: 'Juniper Marsh' })
      .expect(201);
    expect(res.body.user).toMatchObject({ email: 'juniper.marsh@mail.example', role: 'customer' });
    const cookie = sessionCookie(res)!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const row = await t.db
      .selectFrom('users')
      .select(['password_hash'])
      .where('email', '=', 'juniper.marsh@mail.example')
      .executeTakeFirstOrThrow();
    // OWASP Password Storage Cheat Sheet, scrypt: N=2^17, r=8, p=1.
    expect(row.password_hash).toMatch(/^scrypt\$131072\$8\$1\$/);
    // The welcome e-mail is queued with the account, once.
    const mails = await t.db
      .selectFrom('mail_outbox')
      .select(['template', 'to_address', 'data'])
      .where('to_address', '=', 'juniper.marsh@mail.example')
      .execute();
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({ template: 'welcome', data: { name: 'Juniper Marsh' } });
  });

  it('treats e-mail case-insensitively: the same address in capitals is refused with 409', async () => {
    const res = await t
      .http()
      .post('/api/auth/sign-up')
      .send({ email: 'JUNIPER.MARSH@mail.example', password: 'another-password', name: 'J' });
    expect(res.status).toBe(409);
    const mails = await t.db.selectFrom('mail_outbox').select('id').where('template', '=', 'welcome').execute();
    expect(mails).toHaveLength(1);
  });

  it('says what is wrong with sign-up input in words, each problem with its field', async () => {
    const res = await t.http().post('/api/auth/sign-up').send({ email: 'not-an-email', password: 'short', name: '' }).expect(400);
    expect(res.body.details).toEqual(
      expect.arrayContaining([
        'Enter a name',
        'Enter an e-mail address, like name@example.com',
        'Choose a password of at least 10 characters',
      ]),
    );
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(expect.arrayContaining(['name', 'email', 'password']));
  });

  it('signs the demo player in, answers me, and forgets the session on sign-out', async () => {
    const agent = (await import('supertest')).default.agent(t.app.getHttpServer());
    await agent.post('/api/auth/sign-in').send({ email: 'player@mail.example', password: 'demo-pass-2026' }).expect(200);
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.user).toMatchObject({ email: 'player@mail.example', role: 'customer' });
    await agent.post('/api/auth/sign-out').send({}).expect(200);
    await agent.get('/api/auth/me').expect(401);
  });

  it('GET /api/auth/session: the person while signed in, 200 { user: null } before and after (no 401 in a browser console)', async () => {
    const agent = (await import('supertest')).default.agent(t.app.getHttpServer());
    expect((await agent.get('/api/auth/session').expect(200)).body).toEqual({ user: null });
    await agent.post('/api/auth/sign-in').send({ email: 'player@mail.example', password: 'demo-pass-2026' }).expect(200);
    expect((await agent.get('/api/auth/session').expect(200)).body.user).toMatchObject({ email: 'player@mail.example', role: 'customer' });
    await agent.post('/api/auth/sign-out').send({}).expect(200);
    expect((await agent.get('/api/auth/session').expect(200)).body).toEqual({ user: null });
    // An ended session's cookie, sent again by hand, reads as nobody too.
    expect((await t.http().get('/api/auth/session').set('Cookie', 'lw_session=not-a-token').expect(200)).body).toEqual({ user: null });
  });

  it('gives one answer for an unknown e-mail and a wrong password', async () => {
    const unknown = await t.http().post('/api/auth/sign-in').send({ email: 'nobody@mail.example', password: 'whatever-123' });
    const wrong = await t.http().post('/api/auth/sign-in').send({ email: 'player@mail.example', password: 'whatever-123' });
    expect(unknown.status).toBe(401);
    expect(wrong.status).toBe(401);
    expect(unknown.body.message).toBe(wrong.body.message);
  });
});
