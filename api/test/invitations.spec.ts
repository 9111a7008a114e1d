import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { clearTables, createTestApp, type TestApp } from './support/test-app';
import { asRequestCookie, sessionCookieFor, sessionCookieOf } from './support/sessions';

const invite = { email: 'Marit.Solberg@Shop.Example', name: 'Marit Solberg-Ames', level: 'journeyman', hourlyRate: '85.00' };

describe('staff invitations', () => {
  let t: TestApp;
  let owner: string;
  const inviteMails = () =>
    t.db
      .selectFrom('mail_outbox')
      .select(['to_address', 'data'])
      .where('template', '=', 'staff-invite')
      .orderBy('created_at', 'desc')
      .execute();
  const tokenOf = (data: unknown) => new URL(String((data as { inviteUrl: string }).inviteUrl)).searchParams.get('token')!;

  beforeAll(async () => {
    t = await createTestApp();
    owner = await sessionCookieFor(t, 'owner');
  });
  afterAll(async () => t.close());
  beforeEach(async () => {
    await clearTables(t.db, ['auth_tokens', 'mail_outbox']);
    await t.db.deleteFrom('users').where('email', '=', 'marit.solberg@shop.example').execute();
  });

  it('lets only the owner invite', async () => {
    await t.http().post('/api/invitations').send(invite).expect(401);
    await t
      .http()
      .post('/api/invitations')
      .set('Cookie', await sessionCookieFor(t, 'customerA'))
      .send(invite)
      .expect(403);
    const asBuilder = await t
      .http()
      .post('/api/invitations')
      .set('Cookie', await sessionCookieFor(t, 'builder'))
      .send(invite);
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
    expect(String((mail!.data as { inviteUrl: string }).inviteUrl)).toMatch(
      /^https?:\/\/[^/]+\/backoffice\/accept-invite\?token=[A-Za-z0-9_-]{43}$/,
    );
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
    const me = await t
      .http()
      .get('/api/auth/me')
      .set('Cookie', asRequestCookie(sessionCookieOf(accepted)!))
      .expect(200);
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
    const res = await t
      .http()
      .post('/api/invitations')
      .set('Cookie', owner)
      .send({ ...invite, level: 'master', hourlyRate: '120' })
      .expect(201);
    expect(res.body.resent).toBe(true);
    const second = tokenOf((await inviteMails())[0]!.data);
    expect(second).not.toBe(first);
    expect(
      await t.db.selectFrom('builders').select(['level', 'hourly_rate']).where('id', '=', res.body.builderId).executeTakeFirst(),
    ).toEqual({
      level: 'master',
      hourly_rate: '120.00',
    });
    await t.http().post('/api/invitations/accept').send({ token: first, password: 'old-link-password' }).expect(400);
    await t.http().post('/api/invitations/accept').send({ token: second, password: 'new-link-password' }).expect(200);
  });

  it('Resend invitation (Team page) mails a fresh link and retires the old one; the person shows as invited and takes no builds until they join', async () => {
    const created = await t.http().post('/api/invitations').set('Cookie', owner).send(invite).expect(201);
    const builderId = created.body.builderId as string;
    const first = tokenOf((await inviteMails())[0]!.data);

    const member = async () =>
      ((await t.http().get('/api/team').set('Cookie', owner).expect(200)).body as Array<Record<string, unknown>>).find(
        (m) => m.id === builderId,
      )!;
    const invited = await member();
    expect(invited).toMatchObject({ status: 'invited', level: 'journeyman', hourlyRate: '85.00' });
    expect(Date.parse(String(invited.invitationExpiresAt))).toBeGreaterThan(Date.now());
    // Not offered as taking builds: absent from the bench and from a request's suggestions.
    const bench = await t.http().get('/api/bench').set('Cookie', owner).expect(200);
    expect(bench.body.builders.map((b: { builder: { id: string } }) => b.builder.id)).not.toContain(builderId);

    // Only the owner resends; a builder gets 403 in words and no mail goes out.
    const refused = await t
      .http()
      .post(`/api/invitations/${builderId}/resend`)
      .set('Cookie', await sessionCookieFor(t, 'builder'))
      .send({});
    expect(refused.status).toBe(403);
    expect(await inviteMails()).toHaveLength(1);

    const resent = await t.http().post(`/api/invitations/${builderId}/resend`).set('Cookie', owner).send({}).expect(201);
    expect(resent.body).toMatchObject({ builderId, email: 'marit.solberg@shop.example' });
    const mails = await inviteMails();
    expect(mails).toHaveLength(2);
    // The letter's data: what the invitation says (the level, who invited); the rate is on the Team page, not in the letter.
    expect(mails[0]!.data).toMatchObject({ level: 'journeyman', invitedBy: 'Odile Varga' });
    const second = tokenOf(mails[0]!.data);
    expect(second).not.toBe(first);

    // The old link is refused in words; the new one sets the password and signs in.
    const old = await t.http().post('/api/invitations/accept').send({ token: first, password: 'old-link-password' }).expect(400);
    expect(old.body.message).toMatch(/invitation link has expired or was already used/);
    await t.http().post('/api/invitations/accept').send({ token: second, password: 'new-link-password' }).expect(200);

    const joined = await member();
    expect(joined).toMatchObject({ status: 'active', invitationExpiresAt: null });
    const benchAfter = await t.http().get('/api/bench').set('Cookie', owner).expect(200);
    expect(benchAfter.body.builders.map((b: { builder: { id: string } }) => b.builder.id)).toContain(builderId);

    // Once joined there is nothing to resend: 409 in words, no mail.
    const done = await t.http().post(`/api/invitations/${builderId}/resend`).set('Cookie', owner).send({}).expect(409);
    expect(done.body.message).toBe(
      'Marit Solberg-Ames has already accepted the invitation and chosen a password, so there is nothing to resend.',
    );
    expect(await inviteMails()).toHaveLength(2);
    const unknown = await t.http().post('/api/invitations/00000000-0000-4000-8000-000000000000/resend').set('Cookie', owner).send({});
    expect(unknown.status).toBe(404);
    const bad = await t.http().post('/api/invitations/not-an-id/resend').set('Cookie', owner).send({});
    expect(bad.status).toBe(400);
    expect(bad.body.message).toBe('This address does not name a builder; open it again from its list');
  });

  it('refuses to turn a player into staff', async () => {
    const res = await t
      .http()
      .post('/api/invitations')
      .set('Cookie', owner)
      .send({ ...invite, email: 'player@mail.example' });
    expect(res.status).toBe(409);
    expect(res.body.message).toMatch(/already has an account/);
    const player = await t.db.selectFrom('users').select('role').where('email', '=', 'player@mail.example').executeTakeFirstOrThrow();
    expect(player.role).toBe('customer');
  });

  it('names each bad field in words', async () => {
    const res = await t
      .http()
      .post('/api/invitations')
      .set('Cookie', owner)
      .send({ email: 'x', name: '', level: 'wizard', hourlyRate: '0' })
      .expect(400);
    expect(res.body.details).toEqual(
      expect.arrayContaining([
        'Enter an e-mail address, like name@example.com',
        'Enter a name',
        'Choose a level: apprentice, journeyman or master',
        'Hourly rate must be an amount above 0 with at most two decimals, like 85.00',
      ]),
    );
    const accept = await t.http().post('/api/invitations/accept').send({ token: 'nope', password: 'x' }).expect(400);
    expect(JSON.stringify(accept.body.message)).toContain('This link is incomplete; open the link from the e-mail again');
    await t
      .http()
      .post('/api/invitations/accept')
      .send({ token: 'B'.repeat(43), password: 'a-long-password' })
      .expect(400);
  });
});
