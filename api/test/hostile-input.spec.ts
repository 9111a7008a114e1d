import { apiErrorBodySchema, type ErrorCode } from '@loomwright/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { builderId, createBooking, quietMondayWeeksAhead, signIn } from './support/bench-fixtures';
import { createTestApp, type TestApp } from './support/test-app';

type Agent = Awaited<ReturnType<typeof signIn>>;

/** `[[[…]]]` nested `depth` levels deep, as text (JSON.stringify itself would recurse). */
const nestedArray = (depth: number) => '['.repeat(depth) + ']'.repeat(depth);

/** The one error body, with the code a client branches on (shared/src/error-codes.ts). */
const expectRefusal = (res: { status: number; body: unknown }, code: ErrorCode, what = '') => {
  expect(res.status, what).toBe(400);
  expect(apiErrorBodySchema.parse(res.body), what).toMatchObject({ statusCode: 400, code });
};

/**
 * The inputs a hostile or careless client sends that once answered 500: each must now be a 400
 * whose message says what is wrong, and a good value next to it must still be taken.
 */
describe('hostile input answers 400 in words, never 500', () => {
  let t: TestApp;
  let owner: Agent;
  let master: Agent;
  let masterId: string;

  beforeAll(async () => {
    t = await createTestApp();
    [owner, master] = await Promise.all(['owner@shop.example', 'builder@shop.example'].map((e) => signIn(t.app, e)));
    masterId = await builderId(t.db, 'builder@shop.example');
  });
  afterAll(async () => t.close());

  it.each(['/api/auth/sign-in', '/api/estimates', '/api/bookings'])('refuses a JSON array nested 3,000 deep sent to %s', async (path) => {
    const res = await owner
      .post(path)
      .set('Content-Type', 'application/json')
      .send(`{"configuration": ${nestedArray(3000)}, "email": ${nestedArray(3000)}}`);
    expectRefusal(res, 'body_too_deep');
    expect(res.body.message).toMatch(/nested more than 20 levels deep/);
  });

  it('still takes a body nested as deep as a real price book', async () => {
    // surfaceId … pedals[0].name is three levels; the limit leaves room for every real body.
    const res = await t
      .http()
      .post('/api/estimates')
      .send({
        surfaceId: 'x',
        caseId: 'y',
        routing: { mode: 'serial' },
        pedals: [{ name: 'Fuzz', powered: true, inLoop: false }],
        level: 'master',
      });
    expect(res.status).not.toBe(500);
    expect(JSON.stringify(res.body)).not.toMatch(/nested more than/);
  });

  it.each([
    ['/api/auth/sign-up', { email: 'x\ud800@mail.example', password: 'long-enough-pass', name: 'Lone Surrogate' }],
    ['/api/auth/sign-in', { email: 'player@mail.example', password: 'pass\udfff' }],
    ['/api/auth/password-reset', { email: '\ud800' }],
  ])('refuses a lone surrogate in the text sent to %s', async (path, body) => {
    // JSON.stringify escapes a lone surrogate as \ud800 (ECMA-262 well-formed JSON.stringify), which is how it travels.
    const res = await t.http().post(path).set('Content-Type', 'application/json').send(JSON.stringify(body));
    expectRefusal(res, 'invalid_unicode');
    expect(res.body.message).toMatch(/not valid Unicode/);
  });

  it('takes a well-formed astral character (a surrogate pair) in a name', async () => {
    const res = await t
      .http()
      .post('/api/auth/sign-up')
      .send({ email: 'astral@mail.example', password: 'long-enough-pass', name: 'Rook 🎸 Vale' });
    expect(res.status).toBe(201);
    const row = await t.db.selectFrom('users').select('name').where('email', '=', 'astral@mail.example').executeTakeFirstOrThrow();
    expect(row.name).toBe('Rook 🎸 Vale');
  });

  it('refuses {"hourlyRate": null} on PATCH /api/team/:id and leaves the rate as it was', async () => {
    const before = await t.db.selectFrom('builders').select('hourly_rate').where('id', '=', masterId).executeTakeFirstOrThrow();
    for (const hourlyRate of [null, 'NaN', 'Infinity', '-5', '1e3', 1e-308, '0.00']) {
      const res = await owner.patch(`/api/team/${masterId}`).send({ hourlyRate });
      expectRefusal(res, 'validation_failed', JSON.stringify(hourlyRate));
      expect(JSON.stringify(res.body.message)).toContain('Hourly rate must be an amount above 0');
    }
    const after = await t.db.selectFrom('builders').select('hourly_rate').where('id', '=', masterId).executeTakeFirstOrThrow();
    expect(after.hourly_rate).toBe(before.hourly_rate);
  });

  it('refuses hours of 1e-308 (and other non-hours) on a time entry, and takes 2.3 h', async () => {
    const monday = quietMondayWeeksAhead(3);
    const b = await createBooking(t.db, { laborHours: '4.00' });
    await master.post(`/api/bookings/${b.id}/accept`).send({ builderId: masterId, benchDate: monday }).expect(200);
    await master
      .post(`/api/bookings/${b.id}/intake`)
      .send({ items: [{ item: 'Fuzz', condition: 'working' }] })
      .expect(201);
    await master.post(`/api/bookings/${b.id}/state`).send({ to: 'pedals_received' }).expect(200);

    const cases: Array<[unknown, string]> = [
      [1e-308, 'Hours must be more than 0'],
      [1e308, 'Hours can be at most 24 for one day'],
      [null, 'Hours must be a number of hours'],
      ['NaN', 'Hours must be a number of hours'],
      ['2.5', 'Hours must be a number of hours'],
      [2.345, 'Hours takes at most two decimals'],
    ];
    for (const [hours, words] of cases) {
      const res = await master.post(`/api/bookings/${b.id}/time-entries`).send({ workedOn: '2026-11-30', hours });
      expectRefusal(res, 'validation_failed', JSON.stringify(hours));
      expect(JSON.stringify(res.body.message), JSON.stringify(hours)).toContain(words);
    }
    // 2.3 × 100 is 229.99999999999997 in IEEE 754 binary64, yet 2.3 h has two decimals and is taken.
    const ok = await master.post(`/api/bookings/${b.id}/time-entries`).send({ workedOn: '2026-11-30', hours: 2.3 });
    expect(ok.status).toBe(201);
    expect(ok.body.totalHours).toBe(2.3);
    expect(await t.db.selectFrom('time_entries').select('hours').where('booking_id', '=', b.id).execute()).toEqual([{ hours: '2.30' }]);
  });

  it('names an unknown field instead of dropping it', async () => {
    const res = await owner.patch(`/api/team/${masterId}`).send({ hourlyRat: '90.00' });
    expectRefusal(res, 'validation_failed');
    expect(JSON.stringify(res.body.message)).toContain('\\"hourlyRat\\" is not a field this request takes');
  });
});
