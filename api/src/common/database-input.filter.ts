import { ArgumentsHost, BadRequestException, Catch, HttpStatus, ServiceUnavailableException } from '@nestjs/common';
import { BaseExceptionFilter } from '@nestjs/core';
import type { Response } from 'express';
import { DatabaseError } from 'pg';
import { databaseUnavailable, isDatabaseUnavailable, RETRY_AFTER_SECONDS } from './database-unavailable';

/**
 * PostgreSQL's class 22 errors ("data exception", PostgreSQL manual, Appendix A "Error Codes") are
 * about a value the request sent: a NUL byte in a text, a number out of range, a malformed date.
 * They answer 400 in words instead of 500. A database that cannot be reached at all answers 503
 * in words with Retry-After (see database-unavailable.ts). Every other error goes on to Nest's own
 * handling.
 */
const words: Record<string, string> = {
  '22021': 'The text contains a character that cannot be stored (a NUL byte); remove it and send again.',
  '22P05': 'The text contains a character that cannot be stored; remove it and send again.',
  '22P02': 'A value is not written the way it should be (for example an id that is not a UUID).',
  '22003': 'A number in the request is too large.',
  '22007': 'A date or time in the request is not valid.',
  '22008': 'A date or time in the request is out of range.',
  '22001': 'A text in the request is too long.',
};

@Catch()
export class DatabaseInputFilter extends BaseExceptionFilter {
  override catch(error: unknown, host: ArgumentsHost) {
    if (error instanceof DatabaseError && error.code?.startsWith('22')) {
      return super.catch(new BadRequestException(words[error.code] ?? 'A value in the request could not be stored as given.'), host);
    }
    const unavailable = isDatabaseUnavailable(error);
    if (unavailable || (error instanceof ServiceUnavailableException && error.getStatus() === HttpStatus.SERVICE_UNAVAILABLE)) {
      const res = host.switchToHttp().getResponse<Response>();
      if (!res.headersSent) res.setHeader('Retry-After', String(RETRY_AFTER_SECONDS));
      return super.catch(unavailable ? databaseUnavailable() : error, host);
    }
    return super.catch(error, host);
  }
}
