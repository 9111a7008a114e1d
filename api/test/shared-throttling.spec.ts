import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app';

// A small limit so the test reaches it quickly (production: 10 a minute per address and e-mail,
// common practice with no single published figure).
const LIMIT = 3;
const wrongPassword = (t: TestApp, email: string, forwardedFor?: string) => {
  const req = t.http().post('/api/auth/sign-in');
  if (forwardedFor) req.set('X-Forwarded-For', forwardedFor);
  return req.send({ email, password: 'not-the-password' });
};

/**
 * Two API processes behind one load balancer share one PostgreSQL. Sign-in throttling must count
 * across both, or every replica multiplies the limit: the counts live in the `rate_limits` table
 * (rate-limiter-flexible's PostgreSQL store), not in each process's memory.
 */
describe('throttling shared by two API instances on one database', () => {
  let first: TestApp;
  let second: TestApp;

  beforeAll(async () => {
    first = await createTestApp({ env: { AUTH_THROTTLE_LIMIT: String(LIMIT), AUTH_THROTTLE_SECONDS: '60' } });
    const sharedUrl = process.env.DATABASE_URL!;
    // A second Nest application (its own pool, its own throttler), on the first one's database.
    second = await createTestApp({
      seed: false,
      databaseUrlOverride: () => sharedUrl,
      env: { AUTH_THROTTLE_LIMIT: String(LIMIT), AUTH_THROTTLE_SECONDS: '60' },
    });
  }, 60_000);
  afterAll(async () => {
    await second?.close();
    await first?.close();
  });

  it('counts attempts made through either instance against one limit', async () => {
    const statuses: number[] = [];
    // Alternating, as a load balancer would spread them: 1st, 2nd, 1st are let through (wrong password) …
    for (const app of [first, second, first]) statuses.push((await wrongPassword(app, 'player@mail.example')).status);
    // … and the fourth is over the limit on whichever instance it reaches.
    const onSecond = await wrongPassword(second, 'player@mail.example');
    const onFirst = await wrongPassword(first, 'player@mail.example');
    expect(statuses).toEqual([401, 401, 401]);
    expect(onSecond.status).toBe(429);
    expect(onSecond.body.message).toMatch(/Too many attempts/);
    expect(onFirst.status).toBe(429);

    const counts = await first.db.selectFrom('rate_limits').select(['key', 'points']).where('key', 'like', 'address-and-email:%').execute();
    expect(counts).toHaveLength(1);
    expect(counts[0]!.points).toBeGreaterThanOrEqual(LIMIT + 1);
  });

  it('without TRUST_PROXY a client cannot dodge the limit by sending X-Forwarded-For', async () => {
    for (let i = 0; i < LIMIT; i++) await wrongPassword(first, 'cass@mail.example', '203.0.113.7').expect(401);
    // RFC 5737 documentation addresses: a made-up "client" the API must not believe.
    const res = await wrongPassword(first, 'cass@mail.example', '203.0.113.8');
    expect(res.status).toBe(429);
  });
});

describe('TRUST_PROXY: the client address behind a load balancer', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ env: { AUTH_THROTTLE_LIMIT: String(LIMIT), AUTH_THROTTLE_SECONDS: '60', TRUST_PROXY: '1' } });
  }, 60_000);
  afterAll(async () => t?.close());

  it('counts each client named by the one trusted proxy separately', async () => {
    // RFC 7239 §5.2 / X-Forwarded-For: the proxy appends the address it saw; with one trusted hop
    // Express takes the last entry. RFC 5737 documentation addresses stand in for two clients.
    for (let i = 0; i < LIMIT; i++) await wrongPassword(t, 'player@mail.example', '203.0.113.7').expect(401);
    expect((await wrongPassword(t, 'player@mail.example', '203.0.113.7')).status).toBe(429);
    // Another client behind the same balancer is not held back by the first one's attempts.
    expect((await wrongPassword(t, 'player@mail.example', '203.0.113.8')).status).toBe(401);
  });
});

describe('TRUST_PROXY values', () => {
  it("takes Express's forms and refuses anything else in words", async () => {
    const { validateEnvironment } = await import('../src/config/configuration');
    expect(validateEnvironment({}).TRUST_PROXY).toBe(false);
    expect(validateEnvironment({ TRUST_PROXY: '2' }).TRUST_PROXY).toBe(2);
    expect(validateEnvironment({ TRUST_PROXY: 'true' }).TRUST_PROXY).toBe(true);
    expect(validateEnvironment({ TRUST_PROXY: '10.0.0.0/8, loopback, fd00::/8' }).TRUST_PROXY).toBe('10.0.0.0/8, loopback, fd00::/8');
    expect(() => validateEnvironment({ TRUST_PROXY: 'the-balancer' })).toThrow(/TRUST_PROXY: "the-balancer" is not a proxy address/);
    expect(() => validateEnvironment({ TRUST_PROXY: '10.0.0.0/33' })).toThrow(/"10.0.0.0\/33" is not a proxy address/);
  });
});
