import { CanActivate, ExecutionContext, ForbiddenException, Injectable } from '@nestjs/common';
import { errorResponse } from '@loomwright/shared';
import { Reflector } from '@nestjs/core';
import type { AuthUser } from '@loomwright/shared';
import { ROLES_KEY, type Role } from './roles.decorator';

@Injectable()
export class RolesGuard implements CanActivate {
  constructor(private readonly reflector: Reflector) {}

  canActivate(context: ExecutionContext): boolean {
    const roles = this.reflector.getAllAndOverride<Role[] | undefined>(ROLES_KEY, [context.getHandler(), context.getClass()]);
    if (!roles || roles.length === 0) return true;
    const user: AuthUser | undefined = context.switchToHttp().getRequest().user;
    if (!user || !roles.includes(user.role)) {
      throw new ForbiddenException(
        errorResponse(
          'role_not_allowed',
          roles.includes('customer')
            ? 'Your account cannot do this.'
            : roles.includes('builder')
              ? 'This is for the shop’s staff only.'
              : 'Only the shop owner can do this.',
        ),
      );
    }
    return true;
  }
}
