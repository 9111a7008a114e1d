import { defaultErrorCode, ERROR_CODES, type ApiErrorBody, type ErrorCode } from '@loomwright/shared';
import type { Request, Response } from 'express';

/** The request id pino-http (or any logger that sets `req.id`) gave this request, when there is one. */
export function requestIdOf(req: Request | undefined): string | undefined {
  const id = (req as (Request & { id?: unknown }) | undefined)?.id;
  return typeof id === 'string' || typeof id === 'number' ? String(id) : undefined;
}

const isErrorCode = (value: unknown): value is ErrorCode => typeof value === 'string' && Object.hasOwn(ERROR_CODES, value);

type FieldIssue = { path: string; message: string };
const isIssue = (value: unknown): value is FieldIssue =>
  !!value &&
  typeof value === 'object' &&
  typeof (value as FieldIssue).path === 'string' &&
  typeof (value as FieldIssue).message === 'string';

/**
 * The one error body of the API, `{ statusCode, code, message, details?, issues?, requestId? }`, from what
 * an HTTP exception carries: a string, a list of field messages (validation), or `{ code, message }`
 * (see `errorResponse` in `@loomwright/shared`). A code that is not in ERROR_CODES is replaced by
 * the status's own, so nothing unlisted ever leaves the server.
 */
export function errorBody(status: number, response: unknown, req?: Request): ApiErrorBody {
  let code: ErrorCode = defaultErrorCode(status);
  let raw: unknown = response;
  let issues: FieldIssue[] | undefined;
  if (response && typeof response === 'object' && !Array.isArray(response)) {
    const given = response as { code?: unknown; message?: unknown; issues?: unknown };
    if (isErrorCode(given.code)) code = given.code;
    raw = given.message;
    if (Array.isArray(given.issues)) issues = given.issues.filter(isIssue);
  }
  const lines = Array.isArray(raw) ? raw.map(String) : [];
  const message = typeof raw === 'string' && raw ? raw : lines.length > 0 ? lines.join('; ') : fallbackWords(status);
  const requestId = requestIdOf(req);
  return {
    statusCode: status,
    code,
    message,
    ...(lines.length > 0 && { details: lines }),
    ...(issues?.length && { issues }),
    ...(requestId && { requestId }),
  };
}

function fallbackWords(status: number): string {
  return status >= 500 ? 'The shop’s server had a problem; please try again in a moment.' : `The request was refused (HTTP ${status}).`;
}

/** Writes an error answer from Express middleware, which runs outside Nest's exception filters. */
export function sendError(req: Request, res: Response, status: number, code: ErrorCode, message: string): void {
  res.status(status).json(errorBody(status, { code, message }, req));
}
