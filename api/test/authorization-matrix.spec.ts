import { apiErrorBodySchema } from '@loomwright/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { registeredRoutes } from './support/routes';
import { createTestApp, type TestApp } from './support/test-app';
import { sessionCookieFor } from './support/sessions';
import { startPaymentFake, type PaymentFake } from '../fakes/payment/payment-fake';
import { createBooking } from './support/bench-fixtures';

/**
 * THE AUTHORIZATION MATRIX: every route the API registers, called as each kind of person, with
 * the status each must get. The route list is read from Express after app.init(), so a route
 * added anywhere without a line here FAILS this test, and so does a line for a route that is gone.
 *
 * HOW TO ADD YOUR ROUTE (one line in `matrix` below, key = "METHOD /api/path" exactly as registered):
 *
 *   'GET /api/bench': staff(200),
 *   'POST /api/bookings/:id/accept': { ...staff(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/accept` },
 *
 * Statuses are in the order [anonymous, customer A, customer B, builder, owner]. Helpers:
 *   open(s)       everyone gets s                       → [s, s, s, s, s]
 *   signedIn(s)   any signed-in person                  → [401, s, s, s, s]
 *   staff(s)      builders and the owner                → [401, 403, 403, s, s]
 *   ownerOnly(s)  the owner                             → [401, 403, 403, 403, s]
 *   ownedByA(s, other)  customer A's own thing: A and staff get s, B gets `other` (403 or 404)
 *   or write the five statuses yourself: { expect: [401, 200, 404, 200, 200] }.
 * A route with :params needs `path: (fx) => …` using the fixtures in `Fixtures` (add one there
 * if you need another row; create it in `makeFixtures`). POST/PUT/PATCH send `{}` unless you set
 * `body`: an empty body is the cheap way to reach the validation pipe, so "allowed" shows as 400
 * without changing data, and "not allowed" still shows as 401/403 because guards run before pipes.
 * (Every call is same-origin with the content type its route documents; csrf.spec.ts covers the rest.)
 * Anything that answers 500 for any caller fails, whatever the line says.
 */
type Status = number;
type Who = 'anonymous' | 'customerA' | 'customerB' | 'builder' | 'owner';
const callers: Who[] = ['anonymous', 'customerA', 'customerB', 'builder', 'owner'];

interface Fixtures {
  customerA: string;
  customerB: string;
  builderUser: string;
  builderId: string;
  /** A booking (state 'requested', priced by the API) that belongs to customer A. */
  bookingOfA: string;
  /** Another of A's requested bookings, for the calls that would end the first one (cancel). */
  spareBookingOfA: string;
  /** A person none of the callers is (the apprentice builder), for calls that end someone's sessions. */
  bystander: string;
  /** Two of A's saved configurations: one to read and change, one to delete. */
  configurationOfA: string;
  spareConfigurationOfA: string;
}

interface Entry {
  expect: [Status, Status, Status, Status, Status];
  path?: (fx: Fixtures) => string;
  body?: unknown;
  /** Call with a new session of the caller's, for a route that ends the session it is called with (sign-out). */
  freshSession?: boolean;
  /** Send a multipart form (no file) instead of JSON: for the routes that document multipart. */
  multipart?: boolean;
  /** The text fields of that form (default: an empty `caption`, the photo upload's). */
  fields?: Record<string, string>;
}

const open = (s: Status): Entry => ({ expect: [s, s, s, s, s] });
const signedIn = (s: Status): Entry => ({ expect: [401, s, s, s, s] });
const staff = (s: Status): Entry => ({ expect: [401, 403, 403, s, s] });
const ownerOnly = (s: Status): Entry => ({ expect: [401, 403, 403, 403, s] });
const ownedByA = (s: Status, other: 403 | 404 = 404): Entry => ({ expect: [401, s, other, s, s] });

/** A well-formed id that names nothing. */
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';

const matrix: Record<string, Entry> = {
  // API documentation (served by @nestjs/swagger outside the guards: open by design).
  'GET /api/docs': open(200),
  'GET /api/docs/': open(200),
  'GET /api/docs/index.html': open(200),
  'GET /api/docs/swagger-ui-init.js': open(200),
  'GET /api/docs/docs/swagger-ui-init.js': open(200),
  'GET /api/docs/LICENSE': open(404), // registered by swagger-ui, but the file is not shipped
  'GET /api/docs-json': open(200),
  'GET /api/docs-yaml': open(200),
  // health and shop profile
  'GET /api/health': open(200),
  'GET /api/health/live': open(200),
  'GET /api/health/ready': open(200),
  // Guarded by where the caller is (loopback) or METRICS_TOKEN, not by who signed in; the tests call from loopback.
  'GET /api/metrics': open(200),
  'GET /api/shop': open(200),
  // accounts
  'POST /api/auth/sign-up': open(400),
  'POST /api/auth/sign-in': open(400),
  'POST /api/auth/sign-out': { ...open(200), freshSession: true },
  'GET /api/auth/me': signedIn(200),
  'GET /api/auth/session': open(200),
  'POST /api/auth/password-reset': open(400),
  'POST /api/auth/password-reset/confirm': open(400),
  // Any signed-in person changes their own password (the empty body stops at validation).
  'POST /api/auth/password': signedIn(400),
  'GET /api/users/:userId/sessions': { ...ownerOnly(200), path: (fx) => `/api/users/${fx.bystander}/sessions` },
  'DELETE /api/users/:userId/sessions': { ...ownerOnly(200), path: (fx) => `/api/users/${fx.bystander}/sessions` },
  'POST /api/invitations': ownerOnly(400),
  'POST /api/invitations/accept': open(400),
  // the fixture builder has joined, so there is nothing to resend: 409 in words for the owner
  'POST /api/invitations/:builderId/resend': { ...ownerOnly(409), path: (fx) => `/api/invitations/${fx.builderId}/resend` },
  // price book and estimates
  'GET /api/catalog': open(200),
  'POST /api/estimates': open(400),
  'POST /api/quotes/pdf': open(400),
  'POST /api/quotes/email': signedIn(400),
  // saved configurations: each person's own; another's id is a 404, staff included
  'GET /api/configurations': signedIn(200),
  'POST /api/configurations': signedIn(400),
  'GET /api/configurations/:id': { expect: [401, 200, 404, 404, 404], path: (fx) => `/api/configurations/${fx.configurationOfA}` },
  'PATCH /api/configurations/:id': {
    expect: [401, 200, 404, 404, 404],
    body: { name: 'Renamed by the matrix' },
    path: (fx) => `/api/configurations/${fx.configurationOfA}`,
  },
  'POST /api/configurations/:id/duplicate': {
    expect: [401, 201, 404, 404, 404],
    path: (fx) => `/api/configurations/${fx.configurationOfA}/duplicate`,
  },
  'DELETE /api/configurations/:id': { expect: [401, 204, 404, 404, 404], path: (fx) => `/api/configurations/${fx.spareConfigurationOfA}` },
  'POST /api/configuration-links': open(400),
  'GET /api/configuration-links/:code': { ...open(404), path: () => '/api/configuration-links/Zz9Zz9Zz' },
  'GET /api/price-book': staff(200),
  'POST /api/price-book': ownerOnly(400),
  // bookings (players own theirs; staff see all)
  'GET /api/bookings': signedIn(200),
  'POST /api/bookings': { expect: [401, 400, 400, 403, 403] },
  'GET /api/bookings/:id': { ...ownedByA(200), path: (fx) => `/api/bookings/${fx.bookingOfA}` },
  // Cancelling is the player's own act; staff decline instead.
  'POST /api/bookings/:id/cancel': { expect: [401, 200, 404, 403, 403], path: (fx) => `/api/bookings/${fx.spareBookingOfA}/cancel` },
  'POST /api/bookings/:id/shipment': { expect: [401, 400, 400, 403, 403], path: (fx) => `/api/bookings/${fx.bookingOfA}/shipment` },
  'POST /api/bookings/:id/photos': { ...ownedByA(400), multipart: true, path: (fx) => `/api/bookings/${fx.bookingOfA}/photos` },
  'GET /api/bookings/:id/photos/:photoId': {
    expect: [401, 404, 404, 404, 404],
    path: (fx) => `/api/bookings/${fx.bookingOfA}/photos/${UNKNOWN_ID}`,
  },
  'GET /api/bookings/:id/photos/:photoId/thumbnail': {
    expect: [401, 404, 404, 404, 404],
    path: (fx) => `/api/bookings/${fx.bookingOfA}/photos/${UNKNOWN_ID}/thumbnail`,
  },
  // payments
  'POST /api/bookings/:id/checkout': { expect: [401, 200, 404, 403, 403], path: (fx) => `/api/bookings/${fx.bookingOfA}/checkout` },
  'POST /api/bookings/:id/refund': { ...ownerOnly(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/refund` },
  'POST /api/bookings/:id/balance/record': { ...ownerOnly(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/balance/record` },
  'POST /api/bookings/:id/balance/request': { ...staff(409), path: (fx) => `/api/bookings/${fx.bookingOfA}/balance/request` },
  'POST /api/bookings/:id/dispute/release': { ...ownerOnly(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/dispute/release` },
  'POST /api/payments/webhook': open(400),
  // the bench and builds
  'GET /api/bench': staff(200),
  'GET /api/bench/suggest': staff(400),
  // the queue's next free date, for players before they pay: public, no query is a 400
  'GET /api/bench/lead-time': open(400),
  'POST /api/bookings/:id/accept': { ...staff(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/accept` },
  'POST /api/bookings/:id/decline': { ...staff(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/decline` },
  'GET /api/bench/preview': staff(400),
  'POST /api/bookings/:id/reschedule': { ...staff(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/reschedule` },
  'GET /api/bookings/:id/cancellation': { ...ownerOnly(200), path: (fx) => `/api/bookings/${fx.bookingOfA}/cancellation` },
  'POST /api/bookings/:id/cancel-scheduled': { ...ownerOnly(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/cancel-scheduled` },
  'POST /api/bookings/:id/price-consent': {
    expect: [401, 400, 400, 403, 403],
    path: (fx) => `/api/bookings/${fx.bookingOfA}/price-consent`,
  },
  'POST /api/bookings/:id/state': { ...staff(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/state` },
  'POST /api/bookings/:id/waive-balance': { ...ownerOnly(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/waive-balance` },
  'GET /api/bookings/:id/time-entries': { ...staff(200), path: (fx) => `/api/bookings/${fx.bookingOfA}/time-entries` },
  'POST /api/bookings/:id/time-entries': { ...staff(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/time-entries` },
  'PATCH /api/bookings/:id/time-entries/:entryId': {
    ...staff(400),
    path: (fx) => `/api/bookings/${fx.bookingOfA}/time-entries/${UNKNOWN_ID}`,
  },
  'DELETE /api/bookings/:id/time-entries/:entryId': {
    ...staff(409),
    path: (fx) => `/api/bookings/${fx.bookingOfA}/time-entries/${UNKNOWN_ID}`,
  },
  'POST /api/bookings/:id/notes': { ...staff(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/notes` },
  // Messages on a build: its player, the owner, and the builder it is assigned to. The fixture
  // booking is assigned to nobody, so the builder gets the same 404 as another player
  // (messages.spec.ts covers the assigned builder). An empty message is a 400 in words.
  'GET /api/bookings/:id/messages': { expect: [401, 200, 404, 404, 200], path: (fx) => `/api/bookings/${fx.bookingOfA}/messages` },
  'POST /api/bookings/:id/messages': {
    expect: [401, 400, 404, 404, 400],
    multipart: true,
    fields: { body: '' },
    path: (fx) => `/api/bookings/${fx.bookingOfA}/messages`,
  },
  'GET /api/messages/unread': signedIn(200),
  'GET /api/bookings/:id/intake': { ...staff(200), path: (fx) => `/api/bookings/${fx.bookingOfA}/intake` },
  'POST /api/bookings/:id/intake': { ...staff(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/intake` },
  'PATCH /api/bookings/:id/intake/:itemId': { ...staff(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/intake/${UNKNOWN_ID}` },
  'GET /api/bookings/:id/extras': { ...ownedByA(200), path: (fx) => `/api/bookings/${fx.bookingOfA}/extras` },
  'POST /api/bookings/:id/extras': { ...ownerOnly(400), path: (fx) => `/api/bookings/${fx.bookingOfA}/extras` },
  'POST /api/bookings/:id/extras/:extraId/decision': {
    expect: [401, 400, 400, 403, 403],
    path: (fx) => `/api/bookings/${fx.bookingOfA}/extras/${UNKNOWN_ID}/decision`,
  },
  'POST /api/bookings/:id/layout/request': { ...staff(409), path: (fx) => `/api/bookings/${fx.bookingOfA}/layout/request` },
  'POST /api/bookings/:id/extras/:extraId/recorded-decision': {
    ...staff(400),
    path: (fx) => `/api/bookings/${fx.bookingOfA}/extras/${UNKNOWN_ID}/recorded-decision`,
  },
  'POST /api/bookings/:id/layout/approve': {
    expect: [401, 409, 404, 403, 403],
    path: (fx) => `/api/bookings/${fx.bookingOfA}/layout/approve`,
  },
  'POST /api/bookings/:id/layout/decision': {
    expect: [401, 400, 400, 403, 403],
    path: (fx) => `/api/bookings/${fx.bookingOfA}/layout/decision`,
  },
  'POST /api/bookings/:id/layout/recorded-decision': {
    ...staff(400),
    path: (fx) => `/api/bookings/${fx.bookingOfA}/layout/recorded-decision`,
  },
  'GET /api/bookings/:id/build-sheet': { ...staff(200), path: (fx) => `/api/bookings/${fx.bookingOfA}/build-sheet` },
  'GET /api/bookings/:id/quote.pdf': { ...ownedByA(200), path: (fx) => `/api/bookings/${fx.bookingOfA}/quote.pdf` },
  // team, settings, customers, mail log
  'GET /api/team': staff(200),
  'PATCH /api/team/:builderId': { ...ownerOnly(400), path: (fx) => `/api/team/${fx.builderId}` },
  'GET /api/team/absences': staff(200),
  'POST /api/team/:builderId/absences': { ...ownerOnly(400), path: (fx) => `/api/team/${fx.builderId}/absences` },
  'DELETE /api/team/absences/:absenceId': { ...ownerOnly(404), path: () => `/api/team/absences/${UNKNOWN_ID}` },
  'GET /api/settings': staff(200),
  'PATCH /api/settings': ownerOnly(400),
  'GET /api/settings/closures': ownerOnly(200),
  'POST /api/settings/closures': ownerOnly(400),
  'DELETE /api/settings/closures/:id': { ...ownerOnly(404), path: () => `/api/settings/closures/${UNKNOWN_ID}` },
  'PUT /api/settings/holidays/:day': { ...ownerOnly(400), path: () => '/api/settings/holidays/2030-01-08' },
  'GET /api/settings/reminders': staff(200),
  'PATCH /api/settings/reminders': ownerOnly(400),
  'GET /api/customers': staff(200),
  'GET /api/customers/:id': { ...staff(200), path: (fx) => `/api/customers/${fx.customerA}` },
  'GET /api/mail': staff(200),
  'POST /api/mail/:id/resend': { ...ownerOnly(404), path: () => `/api/mail/${UNKNOWN_ID}/resend` },
  // the shop's office: CSV exports (owner; without ?from=&to= the owner gets the 400)
  'GET /api/exports/bookings.csv': ownerOnly(400),
  'GET /api/exports/payments.csv': ownerOnly(400),
  'GET /api/exports/hours.csv': ownerOnly(400),
  'GET /api/reports/revenue': ownerOnly(400),
  'GET /api/reports/outstanding': ownerOnly(200),
  'GET /api/reports/hours': ownerOnly(400),
  'GET /api/reports/utilisation': ownerOnly(400),
  'GET /api/calendar-feeds': ownerOnly(200),
  'GET /api/calendar-feeds/mine': staff(200),
  'GET /api/today': staff(200),
  'POST /api/calendar-feeds/:id/rotate': { ...ownerOnly(404), path: () => `/api/calendar-feeds/${UNKNOWN_ID}/rotate` },
  'GET /api/calendar-feeds/:id/:token/bench.ics': {
    ...open(404),
    path: () => `/api/calendar-feeds/${UNKNOWN_ID}/not-the-secret/bench.ics`,
  },
};

async function makeFixtures(t: TestApp, cookieOfA: string): Promise<Fixtures> {
  const idOf = async (email: string) =>
    (await t.db.selectFrom('users').select('id').where('email', '=', email).executeTakeFirstOrThrow()).id;
  const customerA = await idOf('player@mail.example');
  const builderUser = await idOf('builder@shop.example');
  const builder = await t.db.selectFrom('builders').select('id').where('user_id', '=', builderUser).executeTakeFirstOrThrow();
  // Real bookings, requested through the API, so every route sees the rows it would in use.
  const catalog = (await t.http().get('/api/catalog').expect(200)).body;
  const configuration = {
    surfaceId: catalog.surfaces[0].id,
    caseId: catalog.cases[0].id,
    routing: { mode: 'serial' },
    pedalCount: 6,
    functions: [],
    level: 'journeyman',
  };
  const request = async () =>
    (await t.http().post('/api/bookings').set('Cookie', cookieOfA).send({ configuration }).expect(201)).body.id as string;
  const save = async (name: string) =>
    (await t.http().post('/api/configurations').set('Cookie', cookieOfA).send({ name, configuration }).expect(201)).body.id as string;
  return {
    configurationOfA: await save('Matrix board'),
    spareConfigurationOfA: await save('Matrix spare'),
    customerA,
    customerB: await idOf('cass@mail.example'),
    builderUser,
    builderId: builder.id,
    bookingOfA: await request(),
    spareBookingOfA: await request(),
    bystander: await idOf('junior@shop.example'),
  };
}

describe('authorization matrix: every route, every kind of caller', () => {
  let t: TestApp;
  let fx: Fixtures;
  let cookies: Record<Who, string | undefined>;

  let fake: PaymentFake;

  beforeAll(async () => {
    // The payment fake runs in-process so checkout and refund reach a provider, as in use.
    fake = await startPaymentFake({ port: 0, webhookSecret: 'whsec_matrix_0123456789' });
    // The matrix calls each throttled route five times; keep the limit out of its way.
    t = await createTestApp({
      env: {
        AUTH_THROTTLE_LIMIT: '1000',
        STRIPE_API_HOST: '127.0.0.1',
        STRIPE_API_PORT: String(fake.port),
        STRIPE_API_PROTOCOL: 'http',
        STRIPE_WEBHOOK_SECRET: 'whsec_matrix_0123456789',
      },
    });
    cookies = {
      anonymous: undefined,
      customerA: await sessionCookieFor(t, 'customerA'),
      customerB: await sessionCookieFor(t, 'customerB'),
      builder: await sessionCookieFor(t, 'builder'),
      owner: await sessionCookieFor(t, 'owner'),
    };
    fx = await makeFixtures(t, cookies.customerA!);
  });
  afterAll(async () => {
    await t.close();
    await fake.close();
  });

  it('has exactly one line for every registered route', () => {
    const routes = registeredRoutes(t);
    const missing = routes.filter((r) => !(r in matrix));
    const stale = Object.keys(matrix).filter((r) => !routes.includes(r));
    expect(missing, `add a line to the matrix in ${__filename} for: ${missing.map((m) => `'${m}': staff(200),`).join(' ')}`).toEqual([]);
    expect(stale, 'these matrix lines name routes the API no longer registers').toEqual([]);
    expect(routes.length).toBeGreaterThan(10);
  });

  it('answers every caller as the matrix says', async () => {
    const problems: string[] = [];
    for (const route of registeredRoutes(t)) {
      const entry = matrix[route];
      if (!entry) continue; // reported by the test above
      const [method, pattern] = route.split(' ') as [string, string];
      const url = entry.path ? entry.path(fx) : pattern;
      if (url.includes('/:')) {
        problems.push(`${route}: give the line a path: (fx) => … that fills its :params`);
        continue;
      }
      for (const [index, who] of callers.entries()) {
        let req = t.http()[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](url);
        const cookie = entry.freshSession && who !== 'anonymous' ? await sessionCookieFor(t, who) : cookies[who];
        if (cookie) req = req.set('Cookie', cookie);
        const sendsBody = ['POST', 'PUT', 'PATCH'].includes(method);
        // A DELETE has no body but, like every state-changing call, says it speaks JSON.
        if (method === 'DELETE') req = req.set('Content-Type', 'application/json');
        const res = await (!sendsBody
          ? req
          : entry.multipart
            ? Object.entries(entry.fields ?? { caption: '' }).reduce((r, [name, value]) => r.field(name, value), req)
            : req.send((entry.body ?? {}) as object));
        const expected = entry.expect[index]!;
        if (res.status !== expected || res.status >= 500) {
          problems.push(`${route} as ${who}: expected ${expected}, got ${res.status} ${JSON.stringify(res.body?.message ?? '')}`);
        }
        // A refusal always says why in words.
        if (res.status >= 400 && res.status < 500 && !pattern.startsWith('/api/docs')) {
          const message = res.body?.message;
          if (!message || (typeof message === 'string' && message.length < 8))
            problems.push(`${route} as ${who}: ${res.status} without a message in words`);
        }
        if (res.status >= 400 && !pattern.startsWith('/api/docs') && !apiErrorBodySchema.safeParse(res.body).success) {
          problems.push(
            `${route} as ${who}: ${res.status} without the error body { statusCode, code, message }: ${JSON.stringify(res.body)}`,
          );
        }
      }
    }
    expect(problems).toEqual([]);
    // Every route times five callers, one after another: on a loaded machine this passes 30 s.
  }, 120_000);

  /**
   * WHO MAY SEE WHAT: the lines of the permissions table in DEVELOPERS.md ("Who may see and do
   * what"), each with the check that proves it. The statuses above say who may call a route; these
   * say what the answer holds for each role, where a builder may call a route but not see all of it.
   * (The product brief's "Who may see and do what" table is the outside source of the rules.)
   */
  describe('permissions table (DEVELOPERS.md "Who may see and do what")', () => {
    let apprentice: string;
    let mine: { id: string; reference: string };
    let notMine: { id: string; reference: string };
    const as = (cookie: string | undefined) => ({
      get: (url: string) => t.http().get(url).set('Cookie', cookie!),
    });

    beforeAll(async () => {
      apprentice = await sessionCookieFor(t, 'apprentice');
      // customer B's build is the master builder's; customer A's request is nobody's yet.
      mine = await createBooking(t.db, { customerEmail: 'cass@mail.example', laborHours: '6.00' });
      await t.db
        .updateTable('bookings')
        .set({ builder_id: fx.builderId, state: 'scheduled', bench_date: '2031-03-03' })
        .where('id', '=', mine.id)
        .execute();
      notMine = await createBooking(t.db, { customerEmail: 'player@mail.example', laborHours: '4.00' });
      await t.db
        .insertInto('mail_outbox')
        .values([
          {
            message_id: '<perm-mine@test>',
            template: 'shop-note',
            to_address: 'cass@mail.example',
            data: JSON.stringify({}) as never,
            booking_id: mine.id,
            user_id: fx.customerB,
          },
          {
            message_id: '<perm-other@test>',
            template: 'shop-note',
            to_address: 'player@mail.example',
            data: JSON.stringify({}) as never,
            booking_id: notMine.id,
            user_id: fx.customerA,
          },
        ])
        .execute();
    });

    it('hourly rates: a builder sees their own only, the owner every one (team and bench)', async () => {
      const rates = (members: Array<{ name: string; hourlyRate: string | null; isMe?: boolean; status?: string }>) =>
        Object.fromEntries(members.map((m) => [m.name, m.hourlyRate]));
      // Seeded rates (seed-people.ts): Teodor Lind (master) 125.00, Pip Okonkwo-Hale (apprentice) 45.00.
      const asMaster = rates((await as(cookies.builder).get('/api/team').expect(200)).body);
      expect(asMaster['Teodor Lind']).toBe('125.00');
      expect(asMaster['Pip Okonkwo-Hale']).toBeNull();
      expect(Object.values(asMaster).filter((r) => r !== null)).toEqual(['125.00']);
      const asApprentice = rates((await as(apprentice).get('/api/team').expect(200)).body);
      expect(asApprentice['Pip Okonkwo-Hale']).toBe('45.00');
      expect(Object.values(asApprentice).filter((r) => r !== null)).toEqual(['45.00']);
      const asOwner = rates((await as(cookies.owner).get('/api/team').expect(200)).body);
      expect(asOwner['Teodor Lind']).toBe('125.00');
      expect(asOwner['Pip Okonkwo-Hale']).toBe('45.00');

      const bench = (await as(apprentice).get('/api/bench?from=2031-03-03&to=2031-03-04').expect(200)).body.builders as Array<{
        builder: { name: string; hourlyRate: string | null };
      }>;
      expect(bench.filter((b) => b.builder.hourlyRate !== null).map((b) => b.builder.name)).toEqual(['Pip Okonkwo-Hale']);
      const ownerBench = (await as(cookies.owner).get('/api/bench?from=2031-03-03&to=2031-03-04').expect(200)).body.builders as Array<{
        builder: { hourlyRate: string | null };
      }>;
      expect(ownerBench.every((b) => b.builder.hourlyRate !== null)).toBe(true);
    });

    it("customer e-mail: a builder sees it on builds assigned to them, not on others' or on unassigned requests; the owner always", async () => {
      const emailIn = async (cookie: string | undefined, id: string) =>
        (await as(cookie).get(`/api/bookings/${id}`).expect(200)).body.customer.email;
      expect(await emailIn(cookies.builder, mine.id)).toBe('cass@mail.example');
      expect(await emailIn(cookies.builder, notMine.id)).toBeNull();
      expect(await emailIn(apprentice, mine.id)).toBeNull();
      expect(await emailIn(cookies.owner, notMine.id)).toBe('player@mail.example');
      expect(await emailIn(cookies.customerA, notMine.id)).toBe('player@mail.example');

      const listed = (await as(apprentice).get('/api/bookings?pageSize=100').expect(200)).body.items as Array<{
        customer: { email: string | null };
      }>;
      expect(listed.length).toBeGreaterThan(1);
      expect(listed.every((b) => b.customer.email === null)).toBe(true);
      // Nor can a builder find a request by an address they may not see; the owner can.
      expect((await as(apprentice).get('/api/bookings?q=player%40mail.example').expect(200)).body.total).toBe(0);
      expect((await as(cookies.owner).get('/api/bookings?q=player%40mail.example').expect(200)).body.total).toBeGreaterThan(0);
      expect(
        (await as(cookies.builder).get('/api/bookings?q=cass%40mail.example').expect(200)).body.items.map((b: { id: string }) => b.id),
      ).toContain(mine.id);
      // A change answered with the booking (a state move here, refused) cannot hand the address back either.
      const moved = await t
        .http()
        .post(`/api/bookings/${notMine.id}/notes`)
        .set('Cookie', apprentice)
        .send({ note: 'Checked the queue for this one.' });
      expect(moved.status).toBeLessThan(300);
      expect(JSON.stringify(moved.body)).not.toContain('player@mail.example');

      const customers = (await as(cookies.builder).get('/api/customers?pageSize=100').expect(200)).body.items as Array<{
        name: string;
        email: string | null;
      }>;
      const byEmail = customers.map((c) => c.email).filter(Boolean);
      expect(byEmail).toEqual(['cass@mail.example']);
      const detailA = (await as(cookies.builder).get(`/api/customers/${fx.customerA}`).expect(200)).body;
      expect(detailA.email).toBeNull();
      expect(detailA.phone).toBeNull();
      expect(JSON.stringify(detailA)).not.toContain('player@mail.example');
      // Searching by address finds nobody for a builder (it would tell them who has an account).
      expect((await as(apprentice).get('/api/customers?search=player%40mail').expect(200)).body.total).toBe(0);
      expect((await as(cookies.owner).get('/api/customers?search=player%40mail').expect(200)).body.total).toBe(1);
    });

    it('mail log: a builder sees mail to them and about their builds, never resend; the owner every message', async () => {
      const log = async (cookie: string | undefined) => (await as(cookie).get('/api/mail?pageSize=100').expect(200)).body;
      const master = await log(cookies.builder);
      expect(master.canResend).toBe(false);
      expect(master.items.map((m: { to: string }) => m.to)).toContain('cass@mail.example');
      expect(master.items.some((m: { bookingId: string | null }) => m.bookingId === notMine.id)).toBe(false);
      expect(master.items.some((m: { to: string }) => m.to === 'player@mail.example')).toBe(false);
      const junior = await log(apprentice);
      expect(junior.items.some((m: { to: string }) => m.to !== 'junior@shop.example')).toBe(false);
      const owner = await log(cookies.owner);
      expect(owner.canResend).toBe(true);
      expect(owner.items.some((m: { bookingId: string | null }) => m.bookingId === notMine.id)).toBe(true);
    });

    it('a paid request is declined (and its deposit refunded) by the owner only: refused to a builder in words', async () => {
      const paid = await createBooking(t.db, { customerEmail: 'player@mail.example', laborHours: '3.00', state: 'deposit_paid' });
      const res = await t.http().post(`/api/bookings/${paid.id}/decline`).set('Cookie', apprentice).send({ reason: 'Queue is full.' });
      expect(res.status).toBe(403);
      expect(res.body.message).toBe('Only the owner can decline a paid request, because it refunds the deposit.');
    });
  });
});
