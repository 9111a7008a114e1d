import { ServiceUnavailableException } from '@nestjs/common';
import { shopUnavailableMessage } from '@loomwright/shared';

/** Socket errors Node raises when PostgreSQL cannot be reached or drops the connection. */
const networkCodes = new Set(['ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EHOSTUNREACH', 'ENETUNREACH', 'ENOTFOUND', 'EAI_AGAIN', 'EPIPE']);

/**
 * SQLSTATEs that mean "the server is not there or not taking work", from the PostgreSQL manual,
 * Appendix A "PostgreSQL Error Codes": class 08 (connection exception), 57P01 admin_shutdown,
 * 57P02 crash_shutdown, 57P03 cannot_connect_now (starting up or shutting down), 53300
 * too_many_connections.
 */
const unavailableStates = new Set(['57P01', '57P02', '57P03', '53300']);

/** What node-postgres says when a connection dies or cannot be made in time (not coded). */
const poolMessages =
  /Connection terminated|timeout exceeded when trying to connect|Client has encountered a connection error|Connection ended unexpectedly|the database system is (starting up|shutting down|in recovery mode)/i;

/** True when an error means the database is out of reach, as opposed to a bad query or bad input. */
export function isDatabaseUnavailable(error: unknown, depth = 0): boolean {
  if (!error || typeof error !== 'object' || depth > 3) return false;
  const { code, message, errors, cause } = error as { code?: unknown; message?: unknown; errors?: unknown; cause?: unknown };
  if (typeof code === 'string' && (networkCodes.has(code) || unavailableStates.has(code) || code.startsWith('08'))) return true;
  if (typeof message === 'string' && poolMessages.test(message)) return true;
  // Node reports a refused connection to every address of a host as one AggregateError.
  if (Array.isArray(errors) && errors.some((e) => isDatabaseUnavailable(e, depth + 1))) return true;
  return cause !== undefined && isDatabaseUnavailable(cause, depth + 1);
}

/** Seconds a client should wait before trying again (RFC 9110 §10.2.3 Retry-After). */
export const RETRY_AFTER_SECONDS = 30;

/** The 503 every route answers while the database is out of reach: in words, never 401 or 500. */
export const databaseUnavailable = () => new ServiceUnavailableException(shopUnavailableMessage);
