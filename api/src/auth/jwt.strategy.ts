import { Injectable, UnauthorizedException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { PassportStrategy } from '@nestjs/passport';
import type { AuthUser, UserRole } from '@loomwright/shared';
import type { Request } from 'express';
import { ExtractJwt, Strategy } from 'passport-jwt';
import type { AppConfig } from '../config/configuration';
import { toAuthUser, UsersService } from '../users/users.service';
import { SESSION_COOKIE } from './session-cookie';

export interface SessionPayload {
  sub: string;
  email: string;
  name: string;
  role: UserRole;
  iat?: number;
  exp?: number;
}

@Injectable()
export class JwtStrategy extends PassportStrategy(Strategy) {
  constructor(
    config: ConfigService<AppConfig, true>,
    private readonly users: UsersService,
  ) {
    super({
      jwtFromRequest: ExtractJwt.fromExtractors([(req: Request) => req?.cookies?.[SESSION_COOKIE] ?? null]),
      ignoreExpiration: false,
      secretOrKey: config.get('auth', { infer: true }).jwtSecret,
    });
  }

  /**
   * The person is read from the database on every request (one primary-key lookup), so a removed
   * account, a changed role or a password reset takes effect at once rather than when the token
   * runs out. A session issued before the password last changed is refused.
   */
  async validate(payload: SessionPayload): Promise<AuthUser & { issuedAt?: number }> {
    const row = await this.users.findById(payload.sub);
    if (!row) throw new UnauthorizedException('Your session has ended; please sign in again.');
    const changedAt = row.password_changed_at ? Math.floor(new Date(row.password_changed_at).getTime() / 1000) : undefined;
    if (changedAt !== undefined && (payload.iat ?? 0) < changedAt) {
      throw new UnauthorizedException('Your password was changed since you signed in; please sign in again.');
    }
    return { ...toAuthUser(row), issuedAt: payload.iat };
  }
}
