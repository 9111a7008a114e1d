import { randomUUID } from 'node:crypto';
import type { IncomingMessage, ServerResponse } from 'node:http';

export const REQUEST_ID_HEADER = 'X-Request-Id';

/**
 * An id a load balancer or the caller already gave the request is kept when it looks like an id
 * (letters, digits and . _ : - only, at most 128 characters), so one request can be followed from
 * the proxy's log to ours; anything else (empty, too long, spaces, control characters that could
 * forge a log line) is replaced by a fresh UUID.
 */
const saneRequestId = /^[A-Za-z0-9._:-]{1,128}$/;

export function requestIdFor(req: IncomingMessage, res: ServerResponse): string {
  const incoming = req.headers['x-request-id'];
  const given = Array.isArray(incoming) ? incoming[0] : incoming;
  const id = given && saneRequestId.test(given) ? given : randomUUID();
  // Echoed on every answer, errors included, so a player's error report finds its log lines.
  res.setHeader(REQUEST_ID_HEADER, id);
  return id;
}
