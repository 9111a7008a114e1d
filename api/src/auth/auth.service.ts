import { ConflictException, Injectable, UnauthorizedException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { JwtService } from '@nestjs/jwt';
import type { AuthUser } from '@loomwright/shared';
import type { AppConfig } from '../config/configuration';
import { toAuthUser, UsersService } from '../users/users.service';
import type { SessionPayload } from './jwt.strategy';
import { decoyPasswordHash, hashPassword, verifyPassword } from './password';

const UNIQUE_VIOLATION = '23505';

@Injectable()
export class AuthService {
  constructor(
    private readonly users: UsersService,
    private readonly jwt: JwtService,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  get sessionMs(): number {
    return this.config.get('auth', { infer: true }).sessionMinutes * 60_000;
  }

  /** Players sign themselves up; staff accounts only come from the owner's invitation. */
  async signUp(input: { email: string; password: string; name: string }): Promise<AuthUser> {
    const passwordHash = await hashPassword(input.password);
    try {
      const row = await this.users.create({ email: input.email, name: input.name, role: 'customer', passwordHash });
      return toAuthUser(row);
    } catch (error) {
      if ((error as { code?: string }).code === UNIQUE_VIOLATION) {
        throw new ConflictException('An account with this e-mail already exists. Sign in, or reset your password.');
      }
      throw error;
    }
  }

  /** One answer for "no such e-mail" and "wrong password", in about the same time. */
  async signIn(email: string, password: string): Promise<AuthUser> {
    const row = await this.users.findByEmail(email);
    const ok = await verifyPassword(password, row?.password_hash ?? (await decoyPasswordHash()));
    if (!row || !row.password_hash || !ok) {
      throw new UnauthorizedException('That e-mail and password do not match an account. Check them, or reset your password.');
    }
    await this.users.recordSignIn(row.id);
    return toAuthUser(row);
  }

  issueToken(user: AuthUser): string {
    const payload: SessionPayload = { sub: user.id, email: user.email, name: user.name, role: user.role };
    return this.jwt.sign(payload, { expiresIn: Math.floor(this.sessionMs / 1000) });
  }

  async currentUser(id: string): Promise<AuthUser> {
    const row = await this.users.findById(id);
    if (!row) throw new UnauthorizedException('Your session has ended; please sign in again.');
    return toAuthUser(row);
  }
}
