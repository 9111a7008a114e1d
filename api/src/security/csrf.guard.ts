import { CanActivate, ExecutionContext, ForbiddenException, Injectable, UnsupportedMediaTypeException } from '@nestjs/common';
import { errorResponse } from '@loomwright/shared';
import { ConfigService } from '@nestjs/config';
import { Reflector } from '@nestjs/core';
import { DECORATORS } from '@nestjs/swagger';
import type { Request } from 'express';
import { is as mediaTypeIs } from 'type-is';
import type { AppConfig } from '../config/configuration';
import { ALLOW_CROSS_SITE } from './allow-cross-site.decorator';

/** Methods that change nothing (RFC 9110 §9.2.1, "safe methods"); every other one is checked. */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
/** What a route takes when its OpenAPI description (`@ApiConsumes`) says nothing else. */
const DEFAULT_BODY_TYPES = ['application/json'];

/**
 * Cross-site request forgery defence, in front of every other guard (so an anonymous forged call
 * is refused the same way as one carrying the owner's cookie), in two independent checks:
 *
 * 1. Origin. A browser names the page that sent a request in `Origin` (always on a cross-origin
 *    POST, PUT, PATCH or DELETE) and, in current browsers, says `Sec-Fetch-Site: cross-site` when
 *    another site sent it (Fetch Metadata, W3C). A foreign origin gets 403. Allowed: PUBLIC_URL's
 *    origin, ALLOWED_ORIGINS, and the origin the request itself was addressed to (scheme + Host),
 *    which a page on another site cannot produce. No Origin and no Sec-Fetch-Site is a non-browser
 *    client (curl, a server), which has no victim's cookie to ride on.
 * 2. Content type. A route accepts only the media types its OpenAPI description documents
 *    (`@ApiConsumes`; JSON when it says nothing), else 415. An HTML form can only send
 *    form-encoded, multipart or text/plain bodies, and a cross-site `fetch` may send those (or no
 *    content type at all) without a CORS preflight; `application/json` always needs one, and the
 *    API answers no preflight. So a bodiless POST must carry `Content-Type: application/json` too.
 *
 * The payment webhook opts out of (1) with `@AllowCrossSite()`: it is signed.
 */
@Injectable()
export class CsrfGuard implements CanActivate {
  constructor(
    private readonly reflector: Reflector,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  canActivate(context: ExecutionContext): boolean {
    if (context.getType() !== 'http') return true;
    const req = context.switchToHttp().getRequest<Request>();
    if (SAFE_METHODS.has(req.method)) return true;
    const targets = [context.getHandler(), context.getClass()];

    if (!this.reflector.getAllAndOverride<boolean>(ALLOW_CROSS_SITE, targets)) this.checkOrigin(req);

    const documented = this.reflector.getAllAndOverride<string[] | undefined>(DECORATORS.API_CONSUMES, targets) ?? DEFAULT_BODY_TYPES;
    const sent = req.headers['content-type'];
    if (!sent || !mediaTypeIs(sent, documented)) {
      throw new UnsupportedMediaTypeException(
        errorResponse(
          'unsupported_media_type',
          `This request must be sent as ${documented.join(' or ')} (the Content-Type header), even when it has no body; ` +
            (sent ? `it was sent as ${sent.split(';')[0]}.` : 'it had no Content-Type.'),
        ),
      );
    }
    return true;
  }

  private checkOrigin(req: Request): void {
    const origin = req.headers.origin;
    if (origin !== undefined) {
      if (!this.isOwnOrigin(origin, req)) {
        throw new ForbiddenException(
          errorResponse(
            'cross_site_request',
            `This request came from another site (${origin}) and was refused: changes are accepted only from the shop's own pages. ` +
              'If that address is yours, add it to ALLOWED_ORIGINS.',
          ),
        );
      }
      return;
    }
    if (req.headers['sec-fetch-site'] === 'cross-site') {
      throw new ForbiddenException(
        errorResponse(
          'cross_site_request',
          "This request came from another site (Sec-Fetch-Site: cross-site) and was refused: changes are accepted only from the shop's own pages.",
        ),
      );
    }
  }

  private isOwnOrigin(origin: string, req: Request): boolean {
    if (this.config.get('app', { infer: true }).allowedOrigins.includes(origin)) return true;
    // The address the browser sent this request to; cookies for it belong to this same host.
    return req.headers.host !== undefined && origin === `${req.protocol}://${req.headers.host}`;
  }
}
