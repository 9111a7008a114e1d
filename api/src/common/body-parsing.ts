import { requestWords } from '@loomwright/shared';
import type { INestApplication } from '@nestjs/common';
import { json, type NextFunction, type Request, type Response } from 'express';
import { sendError } from './error-body';
import { refuseHostileInput } from './json-limits';

type WithRawBody = Request & { rawBody?: Buffer };
const keepRawBody = (req: Request, _res: Response, buf: Buffer) => {
  // Webhook signatures are computed over the exact bytes, so keep them beside the parsed body.
  (req as WithRawBody).rawBody = buf;
};

function isBareJsonValue(body: string | undefined): boolean {
  if (body === undefined) return false;
  try {
    const value: unknown = JSON.parse(body);
    return value === null || typeof value !== 'object';
  } catch {
    return false;
  }
}

/**
 * JSON bodies, parsed by Express's own parser with the raw bytes kept (as Nest's `rawBody: true`
 * would), and a body that cannot be parsed answered with a 400 in words. Form-encoded and text
 * bodies are not parsed at all: no route takes them, and CsrfGuard answers them 415
 * (multipart uploads are read by multer on the route that documents them).
 * Nest's built-in parser is switched off (`bodyParser: false`) because its parse errors left the
 * router and came back as "404 Cannot POST", which tells the caller nothing.
 */
export function applyBodyParsing(app: INestApplication): void {
  app.use(json({ limit: '1mb', verify: keepRawBody }));
  app.use((error: { type?: string; status?: number; body?: string } | undefined, req: Request, res: Response, next: NextFunction) => {
    if (error?.type === 'entity.parse.failed') {
      // The parser is strict: valid JSON that is a bare string, number or null is refused too.
      if (isBareJsonValue(error.body)) {
        sendError(req, res, 400, 'body_not_object', requestWords.bodyNotAnObject);
      } else {
        sendError(
          req,
          res,
          400,
          'invalid_json',
          'The request body is not valid JSON; check its quotes, commas and brackets, and send it again.',
        );
      }
      return;
    }
    if (error?.type === 'entity.too.large') {
      sendError(req, res, 413, 'payload_too_large', 'The request body is larger than 1 MB; send less.');
      return;
    }
    if (error && typeof error.status === 'number' && error.status >= 400 && error.status < 500) {
      // Express's parser says 415 for an unknown charset, 400 for a body it cannot decode.
      sendError(
        req,
        res,
        error.status,
        error.status === 415 ? 'unsupported_media_type' : 'body_unreadable',
        'The request body could not be read; check its format and send it again.',
      );
      return;
    }
    next(error);
  });
  app.use(refuseHostileInput);
}
