import { ExecutionContext, Injectable, UnauthorizedException } from '@nestjs/common';
import { Reflector } from '@nestjs/core';
import { AuthGuard } from '@nestjs/passport';
import { IS_PUBLIC_KEY } from './public.decorator';

/**
 * Global: every route needs a valid session unless marked @Public(). On a public route a valid
 * session is still read (so "who is asking" is known), but its absence is not an error.
 */
@Injectable()
export class JwtAuthGuard extends AuthGuard('jwt') {
  constructor(private readonly reflector: Reflector) {
    super();
  }

  private isPublic(context: ExecutionContext): boolean {
    return !!this.reflector.getAllAndOverride<boolean>(IS_PUBLIC_KEY, [context.getHandler(), context.getClass()]);
  }

  override async canActivate(context: ExecutionContext): Promise<boolean> {
    if (this.isPublic(context)) {
      try {
        await super.canActivate(context);
      } catch {
        // an anonymous visitor on an open route
      }
      return true;
    }
    return (await super.canActivate(context)) as boolean;
  }

  override handleRequest<TUser>(error: unknown, user: TUser | false): TUser {
    if (error instanceof UnauthorizedException) throw error; // a reason worth telling (password changed)
    if (error || !user) throw new UnauthorizedException('Please sign in to do this.');
    return user;
  }
}
