import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app';

describe('request bodies that cannot be read', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t.close());

  it.each(['/api/estimates', '/api/auth/sign-in', '/api/payments/webhook'])(
    'answers malformed JSON sent to %s with a 400 in words',
    async (path) => {
      const res = await t.http().post(path).set('Content-Type', 'application/json').send('{"surfaceId": "slate-61",');
      expect(res.status).toBe(400);
      expect(res.body.message).toMatch(/not valid JSON/);
    },
  );

  // RFC 8259 §2: a JSON text may be any value, so `null` and `"text"` are valid JSON; the API
  // takes objects only and must say that, not call them malformed.
  it.each(['null', '"text"', '42'])('answers the bare JSON value %s with a 400 asking for an object', async (body) => {
    const res = await t.http().post('/api/estimates').set('Content-Type', 'application/json').send(body);
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/must be a JSON object/);
  });

  it('answers a body over the size limit with a 413 in words', async () => {
    const res = await t
      .http()
      .post('/api/estimates')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ pad: 'x'.repeat(1_100_000) }));
    expect(res.status).toBe(413);
    expect(res.body.message).toMatch(/larger than 1 MB/);
  });

  it('still parses a good body', async () => {
    const res = await t.http().post('/api/auth/sign-in').send({ email: 'player@mail.example', password: 'demo-pass-2026' });
    expect(res.status).toBe(200);
  });
});
