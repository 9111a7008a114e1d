import { ExecutionContext, Injectable, SetMetadata } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Response } from 'express';
import { AuthService } from './auth.service';
import type { SessionUser } from './sessions.service';

export const SKIP_SESSION_RENEWAL = 'skipSessionRenewal';
/** For routes that end or replace the session themselves (sign-out, sign-in). */
export const SkipSessionRenewal = () => SetMetadata(SKIP_SESSION_RENEWAL, true);

/**
 * Sliding sessions: the token is short-lived, and once more than half its lifetime has passed a
 * request that carries it gets a fresh one. An active player stays signed in; an idle one is
 * signed out when the token runs out.
 *
 * JwtAuthGuard calls this as soon as it knows who is asking, before the route runs (as an
 * interceptor did before it). It is not a global interceptor any more: any interceptor puts every
 * route of the API, the anonymous estimate included, through Nest's RxJS chain, which measured
 * about a sixth of that route's CPU time (DEVELOPERS.md, "Speed at scale").
 */
@Injectable()
export class SessionRenewal {
  constructor(
    private readonly auth: AuthService,
    private readonly reflector: Reflector,
  ) {}

  async renewIfDue(context: ExecutionContext): Promise<void> {
    if (context.getType() !== 'http') return;
    const req = context.switchToHttp().getRequest<{ user?: SessionUser }>();
    const issuedAt = req.user?.issuedAt;
    if (!req.user || issuedAt === undefined) return;
    if (this.reflector.getAllAndOverride<boolean>(SKIP_SESSION_RENEWAL, [context.getHandler(), context.getClass()])) return;
    const ageMs = Date.now() - issuedAt * 1000;
    if (ageMs <= this.auth.sessionMs / 2) return;
    // req.user was read from the database by the JWT strategy, so the new token carries today's name
    // and role; it keeps the session's id, so signing out later still ends it.
    await this.auth.renewSession(context.switchToHttp().getResponse<Response>(), req.user);
  }
}
