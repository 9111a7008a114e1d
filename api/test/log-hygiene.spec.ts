import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApiProcess, Visitor, type ApiProcess } from './support/api-process';
import { eventually, payDepositAs } from './support/payment-harness';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';
import { startProcessFakes } from './support/fakes-env';

const JWT_SECRET = 'log-hygiene-jwt-secret-7f3a9c21d4';
const STRIPE_SECRET_KEY = 'sk_test_log_hygiene_5e8b1d0c9a';
const WEBHOOK_SECRET = 'whsec_log_hygiene_44c0a7e2b9';
const SIGN_UP_PASSWORD = 'marigold-Cable-73-snake';
const NEW_PASSWORD = 'quiet-Treadle-19-lantern';
// Stripe testing documentation, "Test card numbers": 4242 4242 4242 4242 succeeds.
const CARD = '4242424242424242';
const board = countedBoard(6);

/**
 * A whole journey through a real API process (the built one, as `npm start` runs it) with its
 * stdout and stderr captured at the most talkative level: sign-up, sign-in, an estimate, a
 * booking, checkout on the payment fake, the signed webhook, a password reset from the e-mailed
 * link. No secret may appear in any line: passwords, session cookies (the JWTs), the reset token,
 * the payment secret key, the webhook secret or any webhook signature, the JWT secret, the card.
 * (OWASP Logging Cheat Sheet, "Data to exclude": session ids, access tokens, passwords,
 * payment card data, encryption keys.)
 */
describe('log hygiene over a whole journey', () => {
  let api: ApiProcess;
  let fakes: Awaited<ReturnType<typeof startProcessFakes>>;
  const signatures: string[] = [];
  const realFetch = globalThis.fetch;

  beforeAll(async () => {
    // The fake signs each webhook as the provider does; every signature it sends is kept to grep for.
    globalThis.fetch = (async (input: Parameters<typeof fetch>[0], init?: RequestInit) => {
      const headers = new Headers(init?.headers);
      const signature = headers.get('stripe-signature');
      if (signature) signatures.push(signature);
      return realFetch(input, init);
    }) as typeof fetch;
    fakes = await startProcessFakes('lw_logs', { secretKey: STRIPE_SECRET_KEY, webhookSecret: WEBHOOK_SECRET });
    api = await startApiProcess({ ...fakes.env, SEED_DEMO: 'true', RUN_WORKERS: 'true', LOG_LEVEL: 'trace', JWT_SECRET });
    fakes.payments.webhooks.url = `${api.url}/api/payments/webhook`;
  }, 90_000);

  afterAll(async () => {
    globalThis.fetch = realFetch;
    await api?.stop();
    await fakes?.close();
  });

  it('logs one JSON line per request with its id, and no secret anywhere', async () => {
    const player = new Visitor(api.url);
    const email = 'lena.hygiene@mail.example';
    const signUp = await player.call('POST', '/api/auth/sign-up', { name: 'Lena Hygiene', email, password: SIGN_UP_PASSWORD });
    expect(signUp.status, signUp.text).toBe(201);
    const cookies = [player.cookies.get('lw_session')!];
    await player.call('POST', '/api/auth/sign-out', {});
    const signIn = await player.call('POST', '/api/auth/sign-in', { email, password: SIGN_UP_PASSWORD });
    expect(signIn.status, signIn.text).toBe(200);
    cookies.push(player.cookies.get('lw_session')!);
    // A wrong password is logged as a 401 line, without the password tried; the error body names
    // the request id the answer header carries, so a player's report finds its line.
    const refused = await new Visitor(api.url).call('POST', '/api/auth/sign-in', { email, password: `${SIGN_UP_PASSWORD}x` });
    expect(refused.status).toBe(401);
    expect(refused.body.requestId).toBe(refused.headers.get('x-request-id'));

    const estimate = await player.call('POST', '/api/estimates', board);
    expect(estimate.status, estimate.text).toBe(200);
    // An id from a load balancer is kept and echoed; a malformed one is replaced.
    const booking = await player.call(
      'POST',
      '/api/bookings',
      { configuration: board, notes: 'Tuner first.' },
      { 'x-request-id': 'lb-7d1e.42:booking' },
    );
    expect(booking.status, booking.text).toBe(201);
    expect(booking.headers.get('x-request-id')).toBe('lb-7d1e.42:booking');
    const forged = await player.call('GET', '/api/auth/me', undefined, { 'x-request-id': 'a b {"level":60} '.repeat(12) });
    expect(forged.headers.get('x-request-id')).toMatch(/^[0-9a-f-]{36}$/);

    await payDepositAs(player, booking.body.id, CARD);
    expect(signatures.length).toBeGreaterThan(0);

    const reset = await new Visitor(api.url).call('POST', '/api/auth/password-reset', { email });
    expect(reset.status).toBe(202);
    const resetMail = await eventually(
      async () => fakes.mail.messages.find((m) => m.to.includes(email) && /token=/.test(m.text)),
      'the reset e-mail',
      15_000,
    );
    const link = resetMail.text.match(/https?:\/\/\S*token=[^\s)>\]]+/)![0];
    const token = new URL(link).searchParams.get('token')!;
    // The player opens the link: the storefront's page is asked for with the token in its query.
    await new Visitor(api.url).call('GET', `/reset-password?token=${encodeURIComponent(token)}`);
    const confirm = await new Visitor(api.url).call('POST', '/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD });
    expect(confirm.status, confirm.text).toBe(200);
    const resetCookie = confirm.headers
      .getSetCookie()
      .find((c) => c.startsWith('lw_session='))!
      .split(';')[0]!
      .slice('lw_session='.length);
    cookies.push(resetCookie);

    // Let the last lines (mail worker, webhook) be written.
    await new Promise((r) => setTimeout(r, 1_500));
    const output = api.output();
    const secrets: Record<string, string> = {
      'sign-up password': SIGN_UP_PASSWORD,
      'new password': NEW_PASSWORD,
      'reset token': token,
      'payment secret key': STRIPE_SECRET_KEY,
      'webhook secret': WEBHOOK_SECRET,
      'JWT secret': JWT_SECRET,
      'card number': CARD,
      'card number, spaced': '4242 4242 4242 4242',
    };
    cookies.forEach((c, i) => {
      secrets[`session cookie ${i + 1}`] = c;
      // A JWT's signature part alone would still let no one in, but its payload+signature would.
      secrets[`session JWT signature ${i + 1}`] = c.split('.').pop()!;
    });
    signatures.forEach((s, i) => {
      secrets[`webhook signature ${i + 1}`] = s;
      for (const part of s.split(',')) if (part.startsWith('v1=')) secrets[`webhook HMAC ${i + 1}`] = part.slice(3);
    });
    const leaks = Object.entries(secrets)
      .filter(([, value]) => value && output.includes(value))
      .map(([name]) => name);
    expect(leaks, `secrets found in the API's logs`).toEqual([]);

    // Every stdout line is one JSON object; every request line names its request id.
    // eslint-disable-next-line @typescript-eslint/no-explicit-any -- pino's JSON lines have no published type; the checks below read them loosely
    const records = api.lines.filter((l) => l.trim()).map((l) => JSON.parse(l) as Record<string, any>);
    const requestLines = records.filter((r) => r.req && r.res);
    expect(requestLines.length).toBeGreaterThan(10);
    for (const r of requestLines) expect(r.requestId, JSON.stringify(r)).toBe(r.req.id);
    expect(requestLines.some((r) => r.requestId === refused.body.requestId && r.res.statusCode === 401)).toBe(true);
    const bookingLines = records.filter((r) => r.requestId === 'lb-7d1e.42:booking');
    expect(bookingLines.some((r) => r.req?.url === '/api/bookings' && r.res?.statusCode === 201)).toBe(true);
    // Headers are logged with their secrets blanked, not left out silently.
    const withCookie = requestLines.find((r) => r.req.headers?.cookie);
    expect(withCookie?.req.headers.cookie).toBe('[redacted]');
    const webhookLine = requestLines.find((r) => r.req.url === '/api/payments/webhook');
    expect(webhookLine?.req.headers['stripe-signature']).toBe('[redacted]');
    expect(requestLines.find((r) => String(r.req.url).startsWith('/reset-password'))?.req.url).toBe('/reset-password?token=%5Bredacted%5D');
  });
});
