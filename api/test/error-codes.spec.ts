import { apiErrorBodySchema, ERROR_CODES, errorCodes, type ErrorCode } from '@loomwright/shared';
import type { Request } from 'express';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { errorBody } from '../src/common/error-body';
import { builderId, createBooking, DEMO_PASSWORD, quietMondayWeeksAhead, signIn } from './support/bench-fixtures';
import { createTestApp, type TestApp } from './support/test-app';

/**
 * Every error answer is `{ statusCode, code, message, details?, requestId? }` with a code from the
 * one shared list (ERROR_CODES in @loomwright/shared). The fuzz test and the authorization matrix
 * check the shape on every route; this file checks that each kind of mistake gets its own code,
 * the same on every route that can make it.
 */
describe('error codes', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => t.close());

  const expectCode = (res: { status: number; body: unknown }, status: number, code: ErrorCode) => {
    expect(res.status, JSON.stringify(res.body)).toBe(status);
    const body = apiErrorBodySchema.parse(res.body);
    expect(body).toMatchObject({ statusCode: status, code });
    expect(body.message.length).toBeGreaterThan(10);
    return body;
  };

  it('names the body problems the parser and the input checks find', async () => {
    const json = (body: string) => t.http().post('/api/estimates').set('Content-Type', 'application/json').send(body);
    expectCode(await json('{"surfaceId": '), 400, 'invalid_json');
    expectCode(await json('"just text"'), 400, 'body_not_object');
    expectCode(await json(JSON.stringify({ pad: 'x'.repeat(1_100_000) })), 413, 'payload_too_large');
    let deep: unknown = {};
    for (let i = 0; i < 30; i += 1) deep = { a: deep };
    expectCode(await json(JSON.stringify(deep)), 400, 'body_too_deep');
    expectCode(await json('{"name": "\\ud800"}'), 400, 'invalid_unicode');
    expectCode(await t.http().post('/api/estimates').set('Content-Type', 'text/plain').send('x'), 415, 'unsupported_media_type');
  });

  it('gives one code to a field mistake on every route, with one line per field in details', async () => {
    const estimate = expectCode(await t.http().post('/api/estimates').send({}), 400, 'validation_failed');
    const signUp = expectCode(await t.http().post('/api/auth/sign-up').send({ email: 'not-an-address' }), 400, 'validation_failed');
    for (const body of [estimate, signUp]) {
      expect(body.details?.length).toBeGreaterThan(0);
      expect(body.message).toBe(body.details!.join('; '));
    }
    expect(signUp.details).toEqual(
      expect.arrayContaining(['Enter an e-mail address, like name@example.com', 'Choose a password of at least 10 characters']),
    );
    // Beside the words, each problem's field for programs.
    expect(signUp.issues?.map((i) => i.path)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('names who may not do what', async () => {
    expectCode(await t.http().get('/api/bookings'), 401, 'not_signed_in');
    expectCode(
      await t.http().post('/api/auth/sign-in').send({ email: 'player@mail.example', password: 'wrong-pass-2026' }),
      401,
      'invalid_credentials',
    );
    const player = await signIn(t.app, 'player@mail.example');
    expectCode(await player.get('/api/bench'), 403, 'role_not_allowed');
    expectCode(await t.http().post('/api/estimates').set('Origin', 'https://elsewhere.example').send({}), 403, 'cross_site_request');
    // The cookie of a session that was signed out (the agent's jar would drop it; a copy keeps it).
    const signedIn = await t.http().post('/api/auth/sign-in').send({ email: 'player@mail.example', password: DEMO_PASSWORD });
    const cookie = ([] as string[])
      .concat(signedIn.headers['set-cookie'] ?? [])
      .map((c) => c.split(';')[0])
      .join('; ');
    expect((await t.http().post('/api/auth/sign-out').set('Cookie', cookie).send({})).status).toBeLessThan(300);
    expectCode(await t.http().get('/api/bookings').set('Cookie', cookie), 401, 'session_ended');
  });

  it('tells a missing record from a missing route and a malformed id', async () => {
    const owner = await signIn(t.app, 'owner@shop.example');
    expectCode(await owner.get('/api/bookings/00000000-0000-4000-8000-000000000000'), 404, 'not_found');
    expectCode(await owner.get('/api/bookings/not-a-uuid'), 400, 'invalid_id');
    expectCode(await owner.get('/api/customers/not-a-uuid'), 400, 'invalid_id');
    const route = expectCode(await owner.get('/api/no-such-thing'), 404, 'route_not_found');
    expect(route.message).toContain('GET /api/no-such-thing');
    expectCode(await owner.get('/api/bookings?q=%00'), 400, 'value_not_storable');
  });

  it('names a taken address and a spent link', async () => {
    expectCode(
      await t.http().post('/api/auth/sign-up').send({ email: 'player@mail.example', password: 'a-long-test-pass', name: 'Second Player' }),
      409,
      'email_taken',
    );
    expectCode(
      await t
        .http()
        .post('/api/auth/password-reset/confirm')
        .send({ token: 'x'.repeat(43), password: 'a-long-test-pass' }),
      400,
      'link_invalid',
    );
  });

  it('tells a cancellation that comes too late, and a payment when nothing is due, from other conflicts', async () => {
    const [player, master] = await Promise.all([signIn(t.app, 'player@mail.example'), signIn(t.app, 'builder@shop.example')]);
    const b = await createBooking(t.db, { laborHours: '3.00' });
    await master
      .post(`/api/bookings/${b.id}/accept`)
      .send({ builderId: await builderId(t.db, 'builder@shop.example'), benchDate: quietMondayWeeksAhead(4) })
      .expect(200);
    // Scheduled: the player's own cancel is over (the shop cancels from here); nothing is due until the build is ready.
    const late = expectCode(
      await player.post(`/api/bookings/${b.id}/cancel`).send({ reason: 'Plans changed.' }),
      409,
      'too_late_to_cancel',
    );
    expect(late.message).toMatch(/until the shop schedules it/);
    expectCode(await player.post(`/api/bookings/${b.id}/checkout`).set('Content-Type', 'application/json'), 409, 'nothing_due');
    expect((await t.db.selectFrom('bookings').select('state').where('id', '=', b.id).executeTakeFirstOrThrow()).state).toBe('scheduled');
  });

  it('builds the body from any exception response, and never lets an unlisted code out', () => {
    const req = { id: 17 } as unknown as Request;
    expect(errorBody(409, { code: 'bench_time_taken', message: 'Taken.' }, req)).toEqual({
      statusCode: 409,
      code: 'bench_time_taken',
      message: 'Taken.',
      requestId: '17',
    });
    expect(errorBody(409, { code: 'made_up', message: 'Taken.' })).toEqual({ statusCode: 409, code: 'conflict', message: 'Taken.' });
    expect(errorBody(400, ['a: one', 'b: two'])).toEqual({
      statusCode: 400,
      code: 'bad_request',
      message: 'a: one; b: two',
      details: ['a: one', 'b: two'],
    });
    expect(errorBody(500, undefined).code).toBe('internal_error');
    // Every listed code says what it means.
    for (const code of errorCodes) expect(ERROR_CODES[code].length).toBeGreaterThan(20);
  });
});
