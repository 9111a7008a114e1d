import { JwtService } from '@nestjs/jwt';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SessionsService } from '../src/auth/sessions.service';
import { createTestApp, type TestApp } from './support/test-app';
import { asRequestCookie, sessionCookieFor, sessionCookieOf } from './support/sessions';

const PASSWORD = 'demo-pass-2026';

/**
 * Sessions the server can end. OWASP Session Management Cheat Sheet ("Manual Session Expiration":
 * the session must be invalidated on the server side on log out, not only the cookie removed) and
 * RFC 8725 §2 (a JWT alone cannot be withdrawn before it expires) are why each token names a row
 * of `sessions` that every request checks.
 */
describe('sessions end when asked', () => {
  let t: TestApp;
  let playerId: string;
  let ownerCookie: string;

  /** Signs in as a browser would and returns the cookie it would send back. */
  const signInAs = async (email: string, device = 'test-device') => {
    const res = await t.http().post('/api/auth/sign-in').set('User-Agent', device).send({ email, password: PASSWORD }).expect(200);
    return asRequestCookie(sessionCookieOf(res)!);
  };
  const me = (cookie: string) => t.http().get('/api/auth/me').set('Cookie', cookie);
  /** The demo player's row, as a session names them. */
  const thePlayer = () =>
    t.db.selectFrom('users').select(['id', 'email', 'name', 'role']).where('id', '=', playerId).executeTakeFirstOrThrow();

  beforeAll(async () => {
    t = await createTestApp();
    playerId = (await t.db.selectFrom('users').select('id').where('email', '=', 'player@mail.example').executeTakeFirstOrThrow()).id;
    ownerCookie = await sessionCookieFor(t, 'owner');
  });
  afterAll(async () => t.close());

  it('sign-out ends the session on the server: the very same cookie gets 401 afterwards', async () => {
    const cookie = await signInAs('player@mail.example');
    const otherDevice = await signInAs('player@mail.example', 'second-device');
    await me(cookie).expect(200);

    const out = await t.http().post('/api/auth/sign-out').set('Content-Type', 'application/json').set('Cookie', cookie).expect(200);
    expect(sessionCookieOf(out)).toMatch(/^lw_session=;/);

    // A copy of the token (kept by an attacker, or a second tab that missed the cleared cookie).
    const replay = await me(cookie);
    expect(replay.status).toBe(401);
    expect(replay.body.message).toBe('You signed out of this session; please sign in again.');
    // Only that session ended: the player's other device stays signed in.
    await me(otherDevice).expect(200);

    const { sid } = t.app.get(JwtService).decode<{ sid: string }>(cookie.slice('lw_session='.length));
    const row = await t.db.selectFrom('sessions').selectAll().where('id', '=', sid).executeTakeFirstOrThrow();
    expect(row.ended_reason).toBe('signed_out');
    expect(row.ended_by).toBe(playerId);
  });

  it('a renewed cookie keeps its session, so signing out ends the old and the new token together', async () => {
    const player = await thePlayer();
    const jwt = t.app.get(JwtService);
    const { sid } = jwt.decode<{ sid: string }>(await t.app.get(SessionsService).open(player));
    // Issued 20 of 30 minutes ago: past half its life, so the next request renews it.
    const aged = jwt.sign(
      { sub: player.id, sid, email: player.email, name: player.name, role: player.role, iat: Math.floor(Date.now() / 1000) - 20 * 60 },
      { expiresIn: 30 * 60 },
    );
    const renewed = asRequestCookie(sessionCookieOf(await me(`lw_session=${aged}`).expect(200))!);
    expect(jwt.decode<{ sid: string }>(renewed.slice('lw_session='.length)).sid).toBe(sid);

    await t.http().post('/api/auth/sign-out').set('Content-Type', 'application/json').set('Cookie', renewed).expect(200);
    await me(renewed).expect(401);
    await me(`lw_session=${aged}`).expect(401);
  });

  // RFC 8725 §2.1 and §3.1: a token's signature is checked with the server's own key and algorithm; one signed
  // with another secret, or sent unsigned ("alg": "none"), names an open session here and is still refused.
  it('refuses a token for an open session that the server did not sign', async () => {
    const player = await thePlayer();
    const jwt = t.app.get(JwtService);
    const claims = { ...jwt.decode<Record<string, unknown>>(await t.app.get(SessionsService).open(player)) };
    delete claims.exp;
    const otherSecret = jwt.sign(claims, { secret: 'not-the-shop-secret-'.repeat(3), expiresIn: 1800 });
    const segment = (value: unknown) => Buffer.from(JSON.stringify(value)).toString('base64url');
    const unsigned = `${segment({ alg: 'none', typ: 'JWT' })}.${segment({ ...claims, exp: Math.floor(Date.now() / 1000) + 1800 })}.`;
    await me(`lw_session=${otherSecret}`).expect(401);
    await me(`lw_session=${unsigned}`).expect(401);
    // The same claims signed by the shop pass, so the refusals above are the signature's.
    await me(`lw_session=${jwt.sign(claims, { expiresIn: 1800 })}`).expect(200);
  });

  it('refuses a token that names no session, even with a valid signature', async () => {
    const player = await thePlayer();
    const withoutSession = t.app
      .get(JwtService)
      .sign({ sub: player.id, email: player.email, name: player.name, role: player.role }, { expiresIn: 1800 });
    const res = await me(`lw_session=${withoutSession}`);
    expect(res.status).toBe(401);
    expect(res.body.message).toBe('Your session has ended; please sign in again.');
  });

  it('the owner sees where a person is signed in and signs them out of every device', async () => {
    const cass = (await t.db.selectFrom('users').select('id').where('email', '=', 'cass@mail.example').executeTakeFirstOrThrow()).id;
    const phone = await signInAs('cass@mail.example', 'phone browser');
    const laptop = await signInAs('cass@mail.example', 'laptop browser');
    const ownerStays = await signInAs('owner@shop.example');

    const listed = await t.http().get(`/api/users/${cass}/sessions`).set('Cookie', ownerCookie).expect(200);
    expect(listed.body.userId).toBe(cass);
    expect(listed.body.sessions.map((s: { device: string }) => s.device).sort()).toEqual(['laptop browser', 'phone browser']);

    const ended = await t
      .http()
      .delete(`/api/users/${cass}/sessions`)
      .set('Content-Type', 'application/json')
      .set('Cookie', ownerCookie)
      .expect(200);
    expect(ended.body).toEqual({ userId: cass, ended: 2 });
    for (const cookie of [phone, laptop]) {
      const res = await me(cookie);
      expect(res.status).toBe(401);
      expect(res.body.message).toBe('The shop signed this account out of every device; please sign in again.');
    }
    // Nobody else is touched, and the person can simply sign in again.
    await me(ownerStays).expect(200);
    await me(await signInAs('cass@mail.example')).expect(200);

    // History: who ended them and why.
    const ownerId = (await t.db.selectFrom('users').select('id').where('email', '=', 'owner@shop.example').executeTakeFirstOrThrow()).id;
    const rows = await t.db
      .selectFrom('sessions')
      .select(['ended_reason', 'ended_by'])
      .where('user_id', '=', cass)
      .where('ended_at', 'is not', null)
      .execute();
    expect(rows).toEqual([
      { ended_reason: 'signed_out_everywhere', ended_by: ownerId },
      { ended_reason: 'signed_out_everywhere', ended_by: ownerId },
    ]);
    const again = await t.http().get(`/api/users/${cass}/sessions`).set('Cookie', ownerCookie).expect(200);
    expect(again.body.sessions).toHaveLength(1);
  });

  it('only the owner may do it, for an account that exists', async () => {
    const builder = await sessionCookieFor(t, 'builder');
    const refused = await t.http().delete(`/api/users/${playerId}/sessions`).set('Content-Type', 'application/json').set('Cookie', builder);
    expect(refused.status).toBe(403);
    expect(refused.body.message).toBe('Only the shop owner can do this.');
    const unknown = await t
      .http()
      .delete('/api/users/00000000-0000-4000-8000-000000000000/sessions')
      .set('Content-Type', 'application/json')
      .set('Cookie', ownerCookie);
    expect(unknown.status).toBe(404);
    expect(unknown.body.message).toBe('There is no account with that id.');
    const malformed = await t
      .http()
      .delete('/api/users/not-an-id/sessions')
      .set('Content-Type', 'application/json')
      .set('Cookie', ownerCookie);
    expect(malformed.status).toBe(400);
    expect(malformed.body.message).toBe('This address does not name an account; open it again from its list');
  });

  it('a password change ends every session of the account, and the new one works', async () => {
    const first = await signInAs('player@mail.example', 'old phone');
    const second = await signInAs('player@mail.example', 'old laptop');
    await t.http().post('/api/auth/password-reset').send({ email: 'player@mail.example' }).expect(202);
    const mail = await t.db
      .selectFrom('mail_outbox')
      .select('data')
      .where('template', '=', 'password-reset')
      .orderBy('created_at', 'desc')
      .executeTakeFirstOrThrow();
    const token = new URL(String((mail.data as { resetUrl: string }).resetUrl)).searchParams.get('token')!;
    const done = await t.http().post('/api/auth/password-reset/confirm').send({ token, password: 'a-fresh-password-2026' }).expect(200);

    for (const cookie of [first, second]) {
      const res = await me(cookie);
      expect(res.status).toBe(401);
      expect(res.body.message).toBe('Your password was changed since you signed in; please sign in again.');
    }
    await me(asRequestCookie(sessionCookieOf(done)!)).expect(200);
    const live = await t.http().get(`/api/users/${playerId}/sessions`).set('Cookie', ownerCookie).expect(200);
    expect(live.body.sessions).toHaveLength(1);
  });
});
