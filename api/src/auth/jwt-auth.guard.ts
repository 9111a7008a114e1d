import { ExecutionContext, HttpException, Injectable, UnauthorizedException } from '@nestjs/common';
import { errorResponse } from '@loomwright/shared';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import { databaseUnavailable, isDatabaseUnavailable } from '../common/database-unavailable';
import { IS_PUBLIC_KEY } from './public.decorator';
import { SESSION_COOKIE } from './session-cookie';
import { SessionRenewal } from './session-renewal';

/**
 * Global: every route needs a valid session unless marked @Public(). On a public route a valid
 * session is still read (so "who is asking" is known), but its absence is not an error.
 * A database that cannot be reached while the session is checked is the shop's trouble, not the
 * caller's: 503, never "please sign in" (which would make the apps sign the person out).
 */
@Injectable()
export class JwtAuthGuard extends AuthGuard('jwt') {
  constructor(
    private readonly reflector: Reflector,
    private readonly renewal: SessionRenewal,
  ) {
    super();
  }

  private isPublic(context: ExecutionContext): boolean {
    return !!this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, [context.getHandler(), context.getClass()]);
  }

  override async canActivate(context: ExecutionContext): Promise<boolean> {
    if (this.isPublic(context)) {
      // No session cookie at all: an anonymous visitor, nothing to read. Passport would only fail
      // its way to the same answer, building and throwing away an exception on every call of an
      // open route such as POST /api/estimates.
      if (!hasSessionCookie(context)) return true;
      let signedIn = false;
      try {
        signedIn = (await super.canActivate(context)) as boolean;
      } catch (error) {
        // An anonymous visitor (or a stale cookie) on an open route is fine; an outage is not.
        if (error instanceof HttpException && error.getStatus() >= 500) throw error;
      }
      if (signedIn) await this.renewal.renewIfDue(context);
      return true;
    }
    const allowed = (await super.canActivate(context)) as boolean;
    if (allowed) await this.renewal.renewIfDue(context);
    return allowed;
  }

  override handleRequest<TUser>(error: unknown, user: TUser | false): TUser {
    if (isDatabaseUnavailable(error)) throw databaseUnavailable();
    if (error instanceof HttpException) throw error; // a reason worth telling (signed out, password changed)
    if (error || !user) throw new UnauthorizedException(errorResponse('not_signed_in', 'Please sign in to do this.'));
    return user;
  }
}

function hasSessionCookie(context: ExecutionContext): boolean {
  const req = context.switchToHttp().getRequest<{ cookies?: Record<string, unknown> }>();
  return typeof req.cookies?.[SESSION_COOKIE] === 'string';
}
