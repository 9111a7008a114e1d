import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { clearTables, createTestApp, type TestApp } from './support/test-app';
import { asRequestCookie, sessionCookieFor, sessionCookieOf } from './support/sessions';

const invite = { email: 'Marit.Solberg@Shop.Example', name: 'Marit Solberg-Ames', level: 'journeyman', hourlyRate: '85.00' };

describe('staff invitations', () => {
  let t: TestApp;
  let owner: string;
  const inviteMails = () =>
    t.db.selectFrom('mail_outbox').select(['to_address', 'data']).where('template', '=', 'staff-invite').orderBy('created_at', 'desc').execute();
  const tokenOf = (data: unknown) => new URL(String((data as { acceptUrl: string }).acceptUrl)).searchParams.get('token')!;

  beforeAll(async () => {
    t = await createTestApp({ env: { AUTH_THROTTLE_LIMIT: '1000', PUBLIC_URL: 'http://shop.test' } });
    owner = await sessionCookieFor(t, 'owner');
  });
  afterAll(async () => t.close());
  beforeEach(async () => {
    await clearTables(t.db, ['auth_tokens', 'mail_outbox']);
    await t.db.deleteFrom('users').where('email', '=', 'marit.solberg@shop.example').execute();
  });

  it('lets only the owner invite', async () => {
    await t.http().post('/api/invitations').send(invite).expect(401);
    await t.http().post('/api/invitations').set('Cookie', await sessionCookieFor(t, 'customerA')).send(invite).expect(403);
    const asBuilder = await t.http().post('/api/invitations').set('Cookie', await sessionCookieFor(t, 'builder')).send(invite);
    expect(asBuilder.status).toBe(403);
    expect(asBuilder.body.message).toBe('Only the shop owner can do this.');
    expect(await inviteMails()).toHaveLength(0);
  });

  it('creates a builder without a password, a Mon–Fri 7 h bench week, and mails a backoffice link', async () => {
    const res = await t.http().post('/api/invitations').set('Cookie', owner).send(invite).expect(201);
    expect(res.body).toMatchObject({ user: { email: 'marit.solberg@shop.example', role: 'builder', name: invite.name }, resent: false });

    const user = await t.db.selectFrom('users').selectAll().where('email', '=', 'marit.solberg@shop.example').executeTakeFirstOrThrow();
    expect(user.password_hash).toBeNull();
    const builder = await t.db.selectFrom('builders').selectAll().where('user_id', '=', user.id).executeTakeFirstOrThrow();
    expect(builder).toMatchObject({ id: res.body.builderId, level: 'journeyman', hourly_rate: '85.00', active: true });
    // ISO 8601 weekday numbers: 1 = Monday … 5 = Friday; weekends off.
    expect(builder.weekly_hours).toEqual({ '1': 7, '2': 7, '3': 7, '4': 7, '5': 7 });

    const [mail] = await inviteMails();
    expect(mail!.to_address).toBe('marit.solberg@shop.example');
    expect(String((mail!.data as { acceptUrl: string }).acceptUrl)).toMatch(/^http:\/\/shop\.test\/backoffice\/accept-invite\?token=[A-Za-z0-9_-]{43}$/);
    expect(mail!.data).toMatchObject({ name: invite.name, invitedBy: 'Odile Varga' });

    // Not yet accepted: no password works, and the answer is the usual one.
    const signIn = await t.http().post('/api/auth/sign-in').send({ email: invite.email, password: 'anything-at-all' });
    expect(signIn.status).toBe(401);
  });

  it('accepting sets the password and signs the builder in; the link then stops working', async () => {
    await t.http().post('/api/invitations').set('Cookie', owner).send(invite).expect(201);
    const token = tokenOf((await inviteMails())[0]!.data);

    const accepted = await t.http().post('/api/invitations/accept').send({ token, password: 'bench-password-01' }).expect(200);
    expect(accepted.body.user).toMatchObject({ email: 'marit.solberg@shop.example', role: 'builder' });
    const me = await t.http().get('/api/auth/me').set('Cookie', asRequestCookie(sessionCookieOf(accepted)!)).expect(200);
    expect(me.body.user.role).toBe('builder');

    await t.http().post('/api/auth/sign-in').send({ email: invite.email, password: 'bench-password-01' }).expect(200);
    const again = await t.http().post('/api/invitations/accept').send({ token, password: 'taking-it-over-02' });
    expect(again.status).toBe(400);
    expect(again.body.message).toMatch(/invitation link has expired or was already used/);

    // Once accepted, the address cannot be invited again.
    const reinvite = await t.http().post('/api/invitations').set('Cookie', owner).send(invite);
    expect(reinvite.status).toBe(409);
  });

  it('inviting a pending address again sends a fresh link, retires the old one, and updates level and rate', async () => {
    await t.http().post('/api/invitations').set('Cookie', owner).send(invite).expect(201);
    const first = tokenOf((await inviteMails())[0]!.data);
    const res = await t.http().post('/api/invitations').set('Cookie', owner).send({ ...invite, level: 'master', hourlyRate: '120' }).expect(201);
    expect(res.body.resent).toBe(true);
    const second = tokenOf((await inviteMails())[0]!.data);
    expect(second).not.toBe(first);
    expect(await t.db.selectFrom('builders').select(['level', 'hourly_rate']).where('id', '=', res.body.builderId).executeTakeFirst()).toEqual({
      level: 'master',
      hourly_rate: '120.00',
    });
    await t.http().post('/api/invitations/accept').send({ token: first, password: 'old-link-password' }).expect(400);
    await t.http().post('/api/invitations/accept').send({ token: second, password: 'new-link-password' }).expect(200);
  });

  it('refuses to turn a player into staff', async () => {
    const res = await t.http().post('/api/invitations').set('Cookie', owner).send({ ...invite, email: 'player@mail.example' });
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/already has an account/);
    const player = await t.db.selectFrom('users').select('role').where('email', '=', 'player@mail.example').executeTakeFirstOrThrow();
    expect(player.role).toBe('customer');
  });

  it('names each bad field', async () => {
    const res = await t.http().post('/api/invitations').set('Cookie', owner).send({ email: 'x', name: '', level: 'wizard', hourlyRate: '0' }).expect(400);
    const text = JSON.stringify(res.body.message);
    for (const field of ['email', 'name', 'level', 'hourlyRate']) expect(text).toContain(field);
    const accept = await t.http().post('/api/invitations/accept').send({ token: 'nope', password: 'x' }).expect(400);
    expect(JSON.stringify(accept.body.message)).toContain('token');
    await t.http().post('/api/invitations/accept').send({ token: 'B'.repeat(43), password: 'a-long-password' }).expect(400);
  });
});
