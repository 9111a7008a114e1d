import type { IncomingMessage } from 'node:http';

/**
 * What never reaches a log line. Pino's redaction (fast-redact paths) blanks these wherever the
 * request logger or a `logger.info({ ... })` call would print them; the URL serializer below
 * blanks secrets that travel in a query string (a reset link opened in the storefront, say).
 */
export const REDACTED = '[redacted]';

export const redactPaths = [
  // Sign-in state and credentials in headers, both ways.
  'req.headers.authorization',
  'req.headers.cookie',
  'req.headers["proxy-authorization"]',
  'req.headers["x-api-key"]',
  // The payment provider's webhook signature (an HMAC over the body).
  'req.headers["stripe-signature"]',
  'res.headers["set-cookie"]',
  // Any object a service logs: passwords, tokens, secrets and card data, one or two levels down.
  ...[
    'password',
    'newPassword',
    'currentPassword',
    'token',
    'accessToken',
    'refreshToken',
    'secret',
    'apiKey',
    'authorization',
    'cookie',
    'card',
    'cardNumber',
    'cvc',
    'cvv',
    'expiry',
    'iban',
    'account',
    'routing',
  ].flatMap((key) => [key, `*.${key}`, `*.*.${key}`]),
];

/** Query parameters whose values are secrets (names compared without case). */
const secretParameter = /^(token|reset_?token|invite_?token|code|key|api_?key|secret|signature|sig|password|session|jwt|access_?token)$/i;

export function redactUrl(url: string | undefined): string | undefined {
  if (!url) return url;
  const q = url.indexOf('?');
  if (q < 0) return url;
  const params = new URLSearchParams(url.slice(q + 1));
  let changed = false;
  for (const name of [...params.keys()]) {
    if (secretParameter.test(name)) {
      params.set(name, REDACTED);
      changed = true;
    }
  }
  return changed ? `${url.slice(0, q)}?${params.toString()}` : url;
}

/** The request as it is logged: method, URL without secrets, the headers pino-http keeps (redacted above). */
export function requestSerializer(req: IncomingMessage & { query?: unknown }) {
  const query =
    req.query && typeof req.query === 'object'
      ? Object.fromEntries(Object.entries(req.query).map(([k, v]) => [k, secretParameter.test(k) ? REDACTED : v]))
      : req.query;
  return { ...req, url: redactUrl(req.url), query };
}

/** The answer as it is logged: its status and the few headers worth searching by (never Set-Cookie). */
export function responseSerializer(res: { statusCode?: number; headers?: Record<string, unknown> }) {
  const headers = res.headers ?? {};
  return {
    statusCode: res.statusCode,
    headers: {
      'content-type': headers['content-type'],
      'content-length': headers['content-length'],
      'x-request-id': headers['x-request-id'],
    },
  };
}
