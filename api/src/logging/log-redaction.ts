import type { IncomingMessage, ServerResponse } from 'node:http';

/**
 * What never reaches a log line, in three parts:
 * - the request line's `req` and `res` are built field by field from the raw request and answer
 *   (requestSerializer, responseSerializer): method, URL with its secret query values blanked,
 *   request id, a short list of headers worth searching by, status. Any other header the request
 *   carries (Authorization, Cookie, the payment provider's signature, an unknown proxy's token) is
 *   named with its value blanked, so a line shows it was there without showing it;
 * - any object a line logs (`logger.info({ ... })`, an error's own fields) has the values of
 *   secret-named keys blanked at any depth up to four levels (blankSecretFields, pino's
 *   `formatters.log`);
 * - message strings are the caller's: never interpolate a secret into one.
 *
 * Pino's own `redact` paths did this before, with wildcards (`*.password`, `*.*.password`) for the
 * second part; wildcard paths clone and walk every value of every line, the request line's whole
 * request included (about 110 kB of garbage per request, half of a 404's allocations; DEVELOPERS.md,
 * "The API's young generation"). The walk below allocates only when it finds a secret.
 */
export const REDACTED = '[redacted]';

/** Keys whose values are secrets wherever they appear in a logged object (names compared without case). */
export const secretKey =
  /^(password|new_?password|current_?password|token|access_?token|refresh_?token|reset_?token|invite_?token|secret|client_?secret|api_?key|x-api-key|authorization|proxy-authorization|cookie|set-cookie|stripe-signature|signature|card|card_?number|cvc|cvv|expiry|iban|account|account_?number|routing|routing_?number|jwt|session)$/i;

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

/**
 * Request headers logged with their values: what a line is searched by or read for (the client, the
 * body's kind and size, the id a load balancer gave, where the request came from). Every other
 * header is named with its value blanked.
 */
const shownRequestHeaders = new Set([
  'host',
  'user-agent',
  'accept',
  'accept-encoding',
  'accept-language',
  'content-type',
  'content-length',
  'origin',
  'referer',
  'x-request-id',
  'x-forwarded-for',
  'x-forwarded-proto',
  'x-forwarded-host',
  'connection',
  'if-none-match',
  'if-modified-since',
  'sec-fetch-site',
  'sec-fetch-mode',
  'sec-fetch-dest',
]);

function loggedHeaders(headers: IncomingMessage['headers']): Record<string, unknown> {
  const logged: Record<string, unknown> = {};
  for (const name in headers) logged[name] = shownRequestHeaders.has(name) && !secretKey.test(name) ? headers[name] : REDACTED;
  return logged;
}

type LoggedRequest = IncomingMessage & { id?: unknown; originalUrl?: string };

/**
 * The request as the request line logs it, read from the raw request (pino-http's
 * `wrapSerializers: false`): its id, method, URL without secrets, headers (above) and the peer.
 * Not the parsed query (the URL carries it, blanked) nor the body.
 */
export function requestSerializer(req: LoggedRequest) {
  return {
    id: req.id,
    method: req.method,
    // Express keeps the URL as it arrived on originalUrl; req.url is rewritten under mounted routers.
    url: redactUrl(req.originalUrl ?? req.url),
    headers: loggedHeaders(req.headers),
    remoteAddress: req.socket?.remoteAddress,
    remotePort: req.socket?.remotePort,
  };
}

/** The answer as it is logged: its status and the few headers worth searching by (never Set-Cookie). */
export function responseSerializer(res: ServerResponse) {
  // getHeader on the raw answer; `res.getHeaders()` would copy every header to pick three.
  return {
    statusCode: res.statusCode,
    headers: {
      'content-type': res.getHeader?.('content-type'),
      'content-length': res.getHeader?.('content-length'),
      'x-request-id': res.getHeader?.('x-request-id'),
    },
  };
}

/** How deep blankSecretFields looks: the logged object's own keys are depth 1. */
const maxDepth = 4;

/**
 * `value` with every secret-named key's value blanked (secretKey), to `maxDepth` levels: plain
 * objects, arrays, errors and other objects JSON would print by their own fields. Returns `value`
 * itself when it holds no secret, and copies only the objects on the way to one, so a line
 * without secrets costs a walk and nothing else. Skipped: objects printed by their own `toJSON`
 * (dates, buffers, decimals), and the keys in `skip` at the top (the request line's raw request
 * and answer, which their serializers above reduce to chosen fields).
 */
export function blankSecretFields<T>(value: T, skip?: ReadonlySet<string>, depth = 1): T {
  if (depth > maxDepth || value === null || typeof value !== 'object') return value;
  if (typeof (value as { toJSON?: unknown }).toJSON === 'function' || ArrayBuffer.isView(value)) return value;
  if (Array.isArray(value)) {
    let copy: unknown[] | undefined;
    for (let i = 0; i < value.length; i++) {
      const next = blankSecretFields(value[i], undefined, depth + 1);
      if (next !== value[i]) (copy ??= [...value])[i] = next;
    }
    return (copy ?? value) as T;
  }
  let copy: Record<string, unknown> | undefined;
  const record = value as Record<string, unknown>;
  for (const key in record) {
    if (!Object.prototype.hasOwnProperty.call(record, key) || skip?.has(key)) continue;
    const field = record[key];
    const next = secretKey.test(key) ? (field === undefined ? field : REDACTED) : blankSecretFields(field, undefined, depth + 1);
    if (next !== field) {
      // The copy keeps the prototype and every own property, so an error still prints its type,
      // message and stack through pino's error serializer.
      copy ??= Object.create(Object.getPrototypeOf(record), Object.getOwnPropertyDescriptors(record)) as Record<string, unknown>;
      Object.defineProperty(copy, key, { value: next, enumerable: true, writable: true, configurable: true });
    }
  }
  return (copy ?? value) as T;
}
