import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sessionCookieFor } from './support/sessions';
import { createTestApp, type TestApp } from './support/test-app';

// A small limit so the test reaches it quickly; production defaults to 10 tries a minute per
// address and e-mail (and 30 per address), a common practice with no single published figure.
const LIMIT = 3;

describe('throttling of sign-in, sign-up and reset', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ env: { AUTH_THROTTLE_LIMIT: String(LIMIT), AUTH_THROTTLE_SECONDS: '60' } });
  });
  afterAll(async () => t.close());

  it('answers 429 in words once one account has had too many wrong passwords', async () => {
    for (let i = 0; i < LIMIT; i++) {
      await t
        .http()
        .post('/api/auth/sign-in')
        .send({ email: 'player@mail.example', password: `guess-${i}` })
        .expect(401);
    }
    const blocked = await t.http().post('/api/auth/sign-in').send({ email: 'player@mail.example', password: 'demo-pass-2026' });
    expect(blocked.status).toBe(429);
    expect(blocked.body.message).toMatch(/Too many attempts.*try again/);
    // RFC 6585 §4: a 429 may say how long to wait. @nestjs/throttler names the header after the
    // bucket that ran out (Retry-After-<name>), in seconds.
    expect(Number(blocked.headers['retry-after-address-and-email'])).toBeGreaterThan(0);
  });

  it('stalls guessing the current password when changing it, per signed-in account', async () => {
    const cookie = await sessionCookieFor(t, 'customerB');
    const statuses: number[] = [];
    for (let i = 0; i <= LIMIT; i++) {
      const res = await t
        .http()
        .post('/api/auth/password')
        .set('Cookie', cookie)
        .send({ currentPassword: `guess-${i}`, password: 'a-new-password-1' });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([...Array(LIMIT).fill(400), 429]);
    // The bucket is the account's: another person signed in from the same address is not stalled by it.
    const other = await t
      .http()
      .post('/api/auth/password')
      .set('Cookie', await sessionCookieFor(t, 'apprentice'))
      .send({ currentPassword: 'a-wrong-guess', password: 'a-new-password-1' });
    expect(other.status).toBe(400);
  });

  it('keeps counting per address too, so spraying many e-mails from one place also stalls', async () => {
    // The per-address bucket allows three times the per-account limit on this route.
    const statuses: number[] = [];
    for (let i = 0; i < LIMIT * 3; i++) {
      const res = await t
        .http()
        .post('/api/auth/sign-in')
        .send({ email: `sprayed-${i}@mail.example`, password: 'guess' });
      statuses.push(res.status);
    }
    // LIMIT requests were already spent on this route by the test above.
    expect(statuses.filter((s) => s === 401)).toHaveLength(LIMIT * 3 - LIMIT);
    expect(statuses.filter((s) => s === 429)).toHaveLength(LIMIT);
  });

  it('throttles reset requests on their own counter, with the same words', async () => {
    for (let i = 0; i < LIMIT; i++) {
      await t.http().post('/api/auth/password-reset').send({ email: 'cass@mail.example' }).expect(202);
    }
    const blocked = await t.http().post('/api/auth/password-reset').send({ email: 'cass@mail.example' });
    expect(blocked.status).toBe(429);
    expect(blocked.body.message).toMatch(/Too many attempts/);
    const sent = await t.db.selectFrom('mail_outbox').select('id').where('template', '=', 'password-reset').execute();
    expect(sent).toHaveLength(LIMIT);
  });

  it('does not throttle reading the current session', async () => {
    for (let i = 0; i < LIMIT * 4; i++) await t.http().get('/api/auth/me').expect(401);
  });
});
