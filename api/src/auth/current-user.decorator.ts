import { createParamDecorator, ExecutionContext } from '@nestjs/common';
import type { AuthUser } from '@loomwright/shared';

/** The signed-in person (set by the JWT strategy); undefined on a public route without a session. */
export const CurrentUser = createParamDecorator(
  (_data: unknown, ctx: ExecutionContext): AuthUser | undefined => ctx.switchToHttp().getRequest().user,
);
