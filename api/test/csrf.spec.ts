import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { registeredRoutes } from './support/routes';
import { sessionCookieFor } from './support/sessions';
import { createTestApp, type TestApp } from './support/test-app';

/**
 * Cross-site request forgery, on EVERY state-changing route: the list comes from Express after
 * app.init() (as in the authorization matrix), and each route's documented content type from the
 * app's own OpenAPI document, so a new route is covered the moment it exists.
 *
 * The attacks are the ones a page on another site can make without a CORS preflight: an HTML form
 * (application/x-www-form-urlencoded, multipart/form-data, text/plain) or a `fetch` with one of
 * those types or none ("CORS-safelisted request-header", Fetch Standard §2.2.2, WHATWG), and any
 * request whose `Origin` (RFC 6454) or `Sec-Fetch-Site` (Fetch Metadata Request Headers, W3C) names
 * another site. Each is sent as anonymous and with the owner's session cookie.
 */
const SHOP = 'https://bench.example';
const ALSO_ALLOWED = 'https://counter.bench.example';
const ATTACKER = 'https://attacker.example';
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';
const WEBHOOK = 'POST /api/payments/webhook';

type Verb = 'post' | 'put' | 'patch' | 'delete';
interface Route {
  key: string;
  verb: Verb;
  url: string;
  documented: 'application/json' | 'multipart/form-data';
}

describe('CSRF: every state-changing route refuses forms, text and other sites', () => {
  let t: TestApp;
  let routes: Route[];
  let ownerCookie: string;

  beforeAll(async () => {
    t = await createTestApp({ env: { PUBLIC_URL: SHOP, ALLOWED_ORIGINS: ALSO_ALLOWED } });
    ownerCookie = await sessionCookieFor(t, 'owner');
    const openApi = (await t.http().get('/api/docs-json').expect(200)).body as {
      paths: Record<string, Record<string, { requestBody?: { content?: Record<string, unknown> } }>>;
    };
    routes = registeredRoutes(t)
      .filter((key) => !/^(GET|HEAD|OPTIONS) /.test(key))
      .map((key) => {
        const [method, pattern] = key.split(' ') as [string, string];
        const operation = openApi.paths[pattern.replace(/:(\w+)/g, '{$1}')]?.[method.toLowerCase()];
        const multipart = Object.keys(operation?.requestBody?.content ?? {}).includes('multipart/form-data');
        return {
          key,
          verb: method.toLowerCase() as Verb,
          url: pattern.replace(/:\w+/g, UNKNOWN_ID),
          documented: multipart ? 'multipart/form-data' : 'application/json',
        };
      });
  });
  afterAll(async () => t?.close());

  const call = (route: Route, cookie?: string) => {
    const req = t.http()[route.verb](route.url);
    return cookie ? req.set('Cookie', cookie) : req;
  };
  /** The request as the shop's own page sends it, with extra headers. */
  const documentedCall = (route: Route, headers: Record<string, string>, cookie?: string) => {
    const req = call(route, cookie).set(headers);
    return route.documented === 'multipart/form-data'
      ? req.field('caption', 'from the shop')
      : req.set('Content-Type', 'application/json').send({});
  };

  it('finds the state-changing routes, uploads among them', () => {
    expect(routes.length).toBeGreaterThan(30);
    expect(routes.filter((r) => r.documented === 'multipart/form-data').map((r) => r.key)).toContain('POST /api/bookings/:id/photos');
    expect(routes.map((r) => r.key)).toContain('POST /api/invitations');
  });

  it('answers a form-encoded, text/plain or type-less body with 415 in words, before anything else runs', async () => {
    const problems: string[] = [];
    for (const route of routes) {
      for (const cookie of [undefined, ownerCookie]) {
        const who = cookie ? 'owner' : 'anonymous';
        const attempts = {
          'form-encoded': call(route, cookie)
            .set('Origin', SHOP)
            .type('form')
            .send('email=outsider%40attacker.example&name=Outsider&level=master&hourlyRate=1'),
          'text/plain': call(route, cookie).set('Origin', SHOP).set('Content-Type', 'text/plain').send('{"reason":"forged"}'),
          'no content type': call(route, cookie).set('Origin', SHOP),
          ...(route.documented === 'multipart/form-data'
            ? { 'JSON to an upload': call(route, cookie).set('Origin', SHOP).send({ file: 'x' }) }
            : {}),
        };
        for (const [what, pending] of Object.entries(attempts)) {
          const res = await pending;
          if (res.status !== 415 || !/must be sent as (application\/json|multipart\/form-data)/.test(res.body.message)) {
            problems.push(`${route.key} as ${who}, ${what}: ${res.status} ${JSON.stringify(res.body.message)}`);
          }
        }
      }
    }
    expect(problems).toEqual([]);
  });

  it('answers a request from another site with 403 in words, by Origin or by Sec-Fetch-Site; the signed webhook is exempt', async () => {
    const problems: string[] = [];
    for (const route of routes) {
      for (const cookie of [undefined, ownerCookie]) {
        for (const headers of [{ Origin: ATTACKER }, { Origin: 'null' }, { 'Sec-Fetch-Site': 'cross-site' }] as Record<string, string>[]) {
          const res = await documentedCall(route, headers, cookie);
          const label = `${route.key} as ${cookie ? 'owner' : 'anonymous'} with ${JSON.stringify(headers)}`;
          if (route.key === WEBHOOK) {
            // Exempt from the origin rule; still refused, by its missing signature.
            if (res.status !== 400 || !/Stripe-Signature/.test(res.body.message))
              problems.push(`${label}: ${res.status} ${JSON.stringify(res.body.message)}`);
          } else if (res.status !== 403 || !/came from another site .* and was refused/.test(res.body.message)) {
            problems.push(`${label}: ${res.status} ${JSON.stringify(res.body.message)}`);
          }
        }
      }
    }
    expect(problems).toEqual([]);
  });

  it("lets the shop's own pages through (the control: the same calls, same-origin, reach the route)", async () => {
    const problems: string[] = [];
    for (const route of routes) {
      // Anonymous, so nothing changes: each answer comes from the route's own guards, pipes or handler.
      for (const headers of [
        { Origin: SHOP, 'Sec-Fetch-Site': 'same-origin' },
        { Origin: ALSO_ALLOWED, 'Sec-Fetch-Site': 'same-site' },
        {},
      ] as Record<string, string>[]) {
        const res = await documentedCall(route, headers);
        if (res.status === 415 || res.status >= 500 || /came from another site/.test(String(res.body.message))) {
          problems.push(`${route.key} with ${JSON.stringify(headers)}: ${res.status} ${JSON.stringify(res.body.message)}`);
        }
      }
    }
    expect(problems).toEqual([]);
  });

  it('accepts the origin a request was addressed to, e.g. the shop opened at 127.0.0.1 instead of PUBLIC_URL', async () => {
    const res = await t
      .http()
      .post('/api/auth/sign-in')
      .set('Host', '127.0.0.1:3000')
      .set('Origin', 'http://127.0.0.1:3000')
      .send({ email: 'player@mail.example', password: 'demo-pass-2026' });
    expect(res.status).toBe(200);
    const other = await t
      .http()
      .post('/api/auth/sign-in')
      .set('Host', '127.0.0.1:3000')
      .set('Origin', 'http://127.0.0.1:3001')
      .send({ email: 'player@mail.example', password: 'demo-pass-2026' });
    expect(other.status).toBe(403);
  });

  it('stops the attacks as reported: a forged staff invitation and a text/plain cancel change nothing', async () => {
    const player = await sessionCookieFor(t, 'customerA');
    const catalog = (await t.http().get('/api/catalog').expect(200)).body;
    const configuration = {
      surfaceId: catalog.surfaces[0].id,
      caseId: catalog.cases[0].id,
      routing: { mode: 'serial' },
      pedalCount: 4,
      functions: [],
      level: 'journeyman',
    };
    const booking = (await t.http().post('/api/bookings').set('Cookie', player).send({ configuration }).expect(201)).body as { id: string };

    const invite = await t
      .http()
      .post('/api/invitations')
      .set('Cookie', ownerCookie)
      .set('Origin', ATTACKER)
      .type('form')
      .send({ email: 'outsider@attacker.example', name: 'Outsider', level: 'master', hourlyRate: '1' });
    expect(invite.status).toBe(403);
    const sameSiteForm = await t
      .http()
      .post('/api/invitations')
      .set('Cookie', ownerCookie)
      .type('form')
      .send({ email: 'outsider@attacker.example', name: 'Outsider', level: 'master', hourlyRate: '1' });
    expect(sameSiteForm.status).toBe(415);
    expect(await t.db.selectFrom('users').select('id').where('email', '=', 'outsider@attacker.example').execute()).toEqual([]);

    const cancel = await t
      .http()
      .post(`/api/bookings/${booking.id}/cancel`)
      .set('Cookie', player)
      .set('Content-Type', 'text/plain')
      .send('{}');
    expect(cancel.status).toBe(415);
    expect((await t.db.selectFrom('bookings').select('state').where('id', '=', booking.id).executeTakeFirstOrThrow()).state).toBe(
      'requested',
    );

    // The same cancel, as the storefront sends it, works: the refusals above were the defence, not a broken route.
    const real = await t.http().post(`/api/bookings/${booking.id}/cancel`).set('Cookie', player).set('Origin', SHOP).send({});
    expect(real.status).toBe(200);
    expect((await t.db.selectFrom('bookings').select('state').where('id', '=', booking.id).executeTakeFirstOrThrow()).state).toBe(
      'cancelled',
    );
  });
});
