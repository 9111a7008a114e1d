import { createServer, request, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { blankSecretFields, REDACTED } from './log-redaction';
import { createHttpLogger } from './logging.module';

// What must never reach a line: OWASP Logging Cheat Sheet, "Data to exclude" (session identifiers,
// access tokens, passwords, encryption keys and other primary secrets, payment card data, bank
// account data). The card number is the Stripe testing documentation's "4242 4242 4242 4242".
const CARD = '4242424242424242';
const PASSWORD = 'orchid-Patch-58-ladder';
const TOKEN = 'tok-0f9e8d7c6b5a';

function capture() {
  const lines: string[] = [];
  const logger = createHttpLogger('trace', { write: (line: string) => void lines.push(line) });
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- pino's JSON lines have no published type
  const records = () => lines.map((l) => JSON.parse(l) as Record<string, any>);
  return { logger, lines, records };
}

describe('secret fields in logged objects', () => {
  it('blanks secret-named keys at the top and up to four levels down, in arrays and errors, names compared without case', () => {
    const { logger, lines, records } = capture();
    const failure = Object.assign(new Error('provider refused'), { request: { headers: { Authorization: `Bearer ${TOKEN}` } } });
    logger.logger.info(
      {
        password: PASSWORD,
        booking: { reference: 'LW-2026-0042', payment: { card: CARD, last4: '4242' } },
        attempts: [{ accessToken: TOKEN }, { note: 'second try' }],
        deep: { a: { b: { newPassword: PASSWORD } } },
        err: failure,
      },
      'checkout step',
    );
    const text = lines.join('');
    expect(text).not.toContain(PASSWORD);
    expect(text).not.toContain(CARD);
    expect(text).not.toContain(TOKEN);
    const [line] = records();
    expect(line.password).toBe(REDACTED);
    expect(line.booking).toEqual({ reference: 'LW-2026-0042', payment: { card: REDACTED, last4: '4242' } });
    expect(line.attempts).toEqual([{ accessToken: REDACTED }, { note: 'second try' }]);
    expect(line.deep.a.b.newPassword).toBe(REDACTED);
    // The error keeps what pino's error serializer prints (type, message, stack) besides the blanked field.
    expect(line.err.type).toBe('Error');
    expect(line.err.message).toBe('provider refused');
    expect(line.err.stack).toContain('provider refused');
    expect(line.err.request.headers.Authorization).toBe(REDACTED);
    // The caller's objects are not changed.
    expect(failure.request.headers.Authorization).toBe(`Bearer ${TOKEN}`);
  });

  it('returns the very object it was given when nothing in it is secret (no copy, no garbage)', () => {
    const clean = { booking: { reference: 'LW-2026-0042', pedals: [{ name: 'Fuzz', price: '129.00' }] }, responseTime: 3 };
    expect(blankSecretFields(clean)).toBe(clean);
    expect(blankSecretFields(clean.booking.pedals)).toBe(clean.booking.pedals);
  });

  it('stops at four levels, and leaves objects JSON prints by their own toJSON', () => {
    const tooDeep = { a: { b: { c: { d: { password: PASSWORD } } } } };
    expect(blankSecretFields(tooDeep)).toBe(tooDeep);
    const when = new Date('2026-12-03T08:00:00Z');
    expect(blankSecretFields({ when }).when).toBe(when);
  });
});

describe('the request line', () => {
  let server: Server;
  let url: string;
  const { logger, lines, records } = capture();

  beforeAll(async () => {
    server = createServer((req, res) => logger(req, res, () => res.setHeader('set-cookie', `lw_session=${TOKEN}`).end('ok')));
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    url = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  });
  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

  it('logs method, URL, id, chosen headers and status; blanks every other header and secret query values', async () => {
    await new Promise<void>((resolve, reject) => {
      const sent = request(
        `${url}/reset-password?token=${TOKEN}&step=2`,
        {
          headers: {
            authorization: `Bearer ${TOKEN}`,
            cookie: `lw_session=${TOKEN}`,
            'stripe-signature': `t=1,v1=${TOKEN}`,
            'x-api-key': TOKEN,
            // A header no list names (a proxy's own credential): shown as present, value blanked.
            'x-upstream-credential': TOKEN,
            'user-agent': 'log-check/1.0',
            'x-request-id': 'lb-1.2:reset',
          },
        },
        (res) => res.resume().on('end', resolve),
      );
      sent.on('error', reject).end();
    });
    expect(lines.join('')).not.toContain(TOKEN);
    const line = records().find((r) => r.req && r.res)!;
    expect(line.requestId).toBe('lb-1.2:reset');
    expect(line.req).toMatchObject({ id: 'lb-1.2:reset', method: 'GET', url: '/reset-password?token=%5Bredacted%5D&step=2' });
    expect(line.req.headers).toMatchObject({
      authorization: REDACTED,
      cookie: REDACTED,
      'stripe-signature': REDACTED,
      'x-api-key': REDACTED,
      'x-upstream-credential': REDACTED,
      'user-agent': 'log-check/1.0',
    });
    expect(line.req.query).toBeUndefined();
    expect(line.res.statusCode).toBe(200);
    expect(line.res.headers['x-request-id']).toBe('lb-1.2:reset');
    expect(JSON.stringify(line.res)).not.toContain('set-cookie');
    expect(typeof line.responseTime).toBe('number');
  });
});
