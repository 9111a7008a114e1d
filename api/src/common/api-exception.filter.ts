import { ArgumentsHost, Catch, ExceptionFilter, HttpException, HttpStatus, Logger, NotFoundException } from '@nestjs/common';
import { errorResponse, shopUnavailableMessage, type ErrorCode } from '@loomwright/shared';
import type { Request, Response } from 'express';
import { DatabaseError } from 'pg';
import { isDatabaseUnavailable, RETRY_AFTER_SECONDS } from './database-unavailable';
import { errorBody } from './error-body';

/**
 * PostgreSQL's class 22 errors ("data exception", PostgreSQL manual, Appendix A "Error Codes") are
 * about a value the request sent: a NUL byte in a text, a number out of range, a malformed date.
 * They answer 400 in words instead of 500.
 */
const databaseInputWords: Record<string, string> = {
  '22021': 'The text contains a character that cannot be stored (a NUL byte); remove it and send again.',
  '22P05': 'The text contains a character that cannot be stored; remove it and send again.',
  '22P02': 'A value is not written the way it should be (for example an id that does not name a record).',
  '22003': 'A number in the request is too large.',
  '22007': 'A date or time in the request is not valid.',
  '22008': 'A date or time in the request is out of range.',
  '22001': 'A text in the request is too long.',
};

/**
 * The one place an error becomes an answer: every error body is `{ statusCode, code, message,
 * details?, requestId? }` with a code from ERROR_CODES (`@loomwright/shared`). A database that
 * cannot be reached answers 503 in words with Retry-After (see database-unavailable.ts), as does
 * any other 503; a value PostgreSQL refuses as data answers 400; an error that is not an HTTP
 * exception is logged and answers 500 without its details.
 */
@Catch()
export class ApiExceptionFilter implements ExceptionFilter {
  private readonly logger = new Logger('ExceptionsHandler');

  catch(error: unknown, host: ArgumentsHost): void {
    const http = host.switchToHttp();
    const req = http.getRequest<Request>();
    const res = http.getResponse<Response>();
    const { status, response } = this.answerFor(error, req);
    if (res.headersSent) {
      res.end();
      return;
    }
    if (status === HttpStatus.SERVICE_UNAVAILABLE) res.setHeader('Retry-After', String(RETRY_AFTER_SECONDS));
    res.status(status).json(errorBody(status, response, req));
  }

  private answerFor(error: unknown, req: Request): { status: number; response: unknown } {
    if (error instanceof DatabaseError && error.code?.startsWith('22')) {
      const words = databaseInputWords[error.code] ?? 'A value in the request could not be stored as given.';
      return { status: HttpStatus.BAD_REQUEST, response: errorResponse('value_not_storable', words) };
    }
    if (isDatabaseUnavailable(error)) {
      return { status: HttpStatus.SERVICE_UNAVAILABLE, response: errorResponse('shop_unavailable', shopUnavailableMessage) };
    }
    if (error instanceof NotFoundException && !req.route) {
      // Express sets req.route only when a route matched: this is Nest's "no such route" answer.
      const words = `There is no ${req.method} ${req.path} in this API; the routes are listed at /api/docs.`;
      return { status: HttpStatus.NOT_FOUND, response: errorResponse('route_not_found', words) };
    }
    if (error instanceof HttpException) return { status: error.getStatus(), response: error.getResponse() };
    this.logger.error(error instanceof Error ? error.message : String(error), error instanceof Error ? error.stack : undefined);
    return {
      status: HttpStatus.INTERNAL_SERVER_ERROR,
      response: errorResponse('internal_error' satisfies ErrorCode, 'The shop’s server had a problem; please try again in a moment.'),
    };
  }
}
