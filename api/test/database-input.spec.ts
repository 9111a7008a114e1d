import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn } from './support/bench-fixtures';
import { createTestApp, type TestApp } from './support/test-app';

/**
 * Values PostgreSQL refuses as data are the caller's to fix. A NUL byte (U+0000) is legal in JSON
 * and in a URL (RFC 8259 §7 allows it escaped; RFC 3986 allows %00), but PostgreSQL text cannot
 * hold it (PostgreSQL manual, "Character Types": the character with code zero cannot be stored),
 * so it must come back as a 400 in words, never a 500.
 */
describe('values the database cannot store', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t.close());

  it('answers a NUL byte in a search with a 400 in words', async () => {
    const owner = await signIn(t.app, 'owner@shop.example');
    const res = await owner.get('/api/bookings?q=%00');
    expect(res.status).toBe(400);
    expect(res.body.message).toMatch(/cannot be stored/);
  });

  it('answers a NUL byte in a new account name with a 400, and stores nothing', async () => {
    const res = await request(t.app.getHttpServer())
      .post('/api/auth/sign-up')
      .send({ email: 'nul.byte@mail.example', password: 'a-long-test-pass', name: 'Nul\u0000Byte' });
    expect(res.status).toBe(400);
    const row = await t.db.selectFrom('users').select('id').where('email', '=', 'nul.byte@mail.example').executeTakeFirst();
    expect(row).toBeUndefined();
  });

  it('still answers a plain search', async () => {
    const owner = await signIn(t.app, 'owner@shop.example');
    expect((await owner.get('/api/bookings?q=Marlo')).status).toBe(200);
  });
});
