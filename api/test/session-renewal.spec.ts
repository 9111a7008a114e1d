import { JwtService } from '@nestjs/jwt';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app';
import { sessionCookieOf } from './support/sessions';
import { SessionsService } from '../src/auth/sessions.service';

const SESSION_MINUTES = 30;

describe('short-lived sessions with renewal', () => {
  let t: TestApp;
  let player: { id: string; email: string; name: string; role: 'customer' };
  /** A token of a new, open session (a row in `sessions`), signed as if issued some minutes ago. */
  const tokenIssuedMinutesAgo = async (minutes: number) => {
    const { sid } = t.app.get(JwtService).decode<{ sid: string }>(await t.app.get(SessionsService).open(player));
    const iat = Math.floor(Date.now() / 1000) - minutes * 60;
    // jsonwebtoken honours an explicit iat and counts expiresIn from it.
    return t.app
      .get(JwtService)
      .sign({ sub: player.id, sid, email: player.email, name: player.name, role: player.role, iat }, { expiresIn: SESSION_MINUTES * 60 });
  };

  beforeAll(async () => {
    t = await createTestApp({ env: { SESSION_MINUTES: String(SESSION_MINUTES) } });
    const row = await t.db.selectFrom('users').selectAll().where('email', '=', 'player@mail.example').executeTakeFirstOrThrow();
    player = { id: row.id, email: row.email, name: row.name, role: 'customer' };
  });
  afterAll(async () => t.close());

  it('leaves a fresh session alone', async () => {
    const res = await t
      .http()
      .get('/api/auth/me')
      .set('Cookie', `lw_session=${await tokenIssuedMinutesAgo(2)}`)
      .expect(200);
    expect(sessionCookieOf(res)).toBeUndefined();
  });

  it('re-issues the cookie once more than half the lifetime has passed, with a full new lifetime', async () => {
    const res = await t
      .http()
      .get('/api/auth/me')
      .set('Cookie', `lw_session=${await tokenIssuedMinutesAgo(20)}`)
      .expect(200);
    const cookie = sessionCookieOf(res)!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(new RegExp(`Max-Age=${SESSION_MINUTES * 60}`));
    const token = cookie.split(';')[0]!.slice('lw_session='.length);
    const decoded = t.app.get(JwtService).decode<{ iat: number; exp: number; sub: string }>(token);
    expect(decoded.sub).toBe(player.id);
    expect(decoded.exp - decoded.iat).toBe(SESSION_MINUTES * 60);
    expect(Math.abs(decoded.iat - Date.now() / 1000)).toBeLessThan(5);
  });

  it('renews from the stored account, so a changed name reaches the new token', async () => {
    await t.db.updateTable('users').set({ name: 'Rowan A. Achterberg' }).where('id', '=', player.id).execute();
    const res = await t
      .http()
      .get('/api/auth/me')
      .set('Cookie', `lw_session=${await tokenIssuedMinutesAgo(25)}`)
      .expect(200);
    const token = sessionCookieOf(res)!.split(';')[0]!.slice('lw_session='.length);
    expect(t.app.get(JwtService).decode<{ name: string }>(token).name).toBe('Rowan A. Achterberg');
  });

  it('refuses an expired session with 401 and words, and does not renew it', async () => {
    const res = await t
      .http()
      .get('/api/auth/me')
      .set('Cookie', `lw_session=${await tokenIssuedMinutesAgo(31)}`);
    expect(res.status).toBe(401);
    expect(res.body.message).toBe('Please sign in to do this.');
    expect(sessionCookieOf(res)).toBeUndefined();
  });

  it('does not undo a sign-out by renewing on the way out', async () => {
    const res = await t
      .http()
      .post('/api/auth/sign-out')
      .set('Content-Type', 'application/json')
      .set('Cookie', `lw_session=${await tokenIssuedMinutesAgo(20)}`)
      .expect(200);
    const cookies = (res.headers['set-cookie'] as unknown as string[]).filter((c) => c.startsWith('lw_session='));
    expect(cookies).toHaveLength(1);
    expect(cookies[0]).toMatch(/^lw_session=;/);
  });
});
