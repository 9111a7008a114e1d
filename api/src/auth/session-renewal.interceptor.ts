import { CallHandler, ExecutionContext, Injectable, NestInterceptor, SetMetadata } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import type { Response } from 'express';
import { from, Observable, switchMap } from 'rxjs';
import { AuthService } from './auth.service';

export const SKIP_SESSION_RENEWAL = 'skipSessionRenewal';
/** For routes that end or replace the session themselves (sign-out, sign-in). */
export const SkipSessionRenewal = () => SetMetadata(SKIP_SESSION_RENEWAL, true);

/**
 * Sliding sessions: the token is short-lived, and once more than half its lifetime has passed a
 * request that carries it gets a fresh one. An active player stays signed in; an idle one is
 * signed out when the token runs out. The fresh token is built from the stored account, so a
 * changed name or role, or a removed account, takes effect at the next renewal.
 */
@Injectable()
export class SessionRenewalInterceptor implements NestInterceptor {
  constructor(
    private readonly auth: AuthService,
    private readonly reflector: Reflector,
  ) {}

  intercept(context: ExecutionContext, next: CallHandler): Observable<unknown> {
    return from(this.renewIfDue(context)).pipe(switchMap(() => next.handle()));
  }

  private async renewIfDue(context: ExecutionContext): Promise<void> {
    if (context.getType() !== 'http') return;
    if (this.reflector.getAllAndOverride<boolean>(SKIP_SESSION_RENEWAL, [context.getHandler(), context.getClass()])) return;
    const req = context.switchToHttp().getRequest<{ user?: { id: string; issuedAt?: number } }>();
    const issuedAt = req.user?.issuedAt;
    if (!req.user || issuedAt === undefined) return;
    const ageMs = Date.now() - issuedAt * 1000;
    if (ageMs <= this.auth.sessionMs / 2) return;
    const user = await this.auth.findUser(req.user.id);
    if (user) this.auth.startSession(context.switchToHttp().getResponse<Response>(), user);
  }
}
