import { BadRequestException, ConflictException, Injectable, OnModuleInit, UnauthorizedException } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { authMessages, errorResponse, type AuthUser } from '@loomwright/shared';
import type { Request, Response } from 'express';
import type { AppConfig } from '../config/configuration';
import { Database, type Executor } from '../database/database';
import { MailService, type MessageToRenew } from '../mail/mail.service';
import { toAuthUser, UsersService } from '../users/users.service';
import { AuthTokensService } from './auth-tokens.service';
import { decoyPasswordHash, hashPassword, verifyPassword } from './password';
import { SESSION_COOKIE, sessionCookieOptions } from './session-cookie';
import { SESSION_ENDED, SessionsService, type SessionUser } from './sessions.service';

const UNIQUE_VIOLATION = '23505';

@Injectable()
export class AuthService implements OnModuleInit {
  constructor(
    private readonly db: Database,
    private readonly users: UsersService,
    private readonly tokens: AuthTokensService,
    private readonly mail: MailService,
    private readonly sessions: SessionsService,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  onModuleInit() {
    this.mail.renewLinksWith('password-reset', (trx, message) => this.renewResetLink(trx, message));
  }

  get sessionMs(): number {
    return this.sessions.sessionMs;
  }

  private get publicUrl(): string {
    return this.config.get('app', { infer: true }).publicUrl;
  }

  /** Players sign themselves up; staff accounts only come from the owner's invitation. */
  async signUp(input: { email: string; password: string; name: string }): Promise<AuthUser> {
    const passwordHash = await hashPassword(input.password);
    try {
      return await this.db.transaction().execute(async (trx) => {
        const row = await this.users.create({ email: input.email, name: input.name, role: 'customer', passwordHash }, trx);
        await this.mail.enqueue(trx, {
          template: 'welcome',
          to: row.email,
          userId: row.id,
          data: { name: row.name, configureUrl: `${this.publicUrl}/configure`, accountUrl: `${this.publicUrl}/account` },
          dedupeKey: `welcome:${row.id}`,
        });
        return toAuthUser(row);
      });
    } catch (error) {
      // Sign-up is the one place an address's use shows: a second account cannot share it. The
      // answer points to the reset, and the route is throttled like sign-in.
      if ((error as { code?: string }).code === UNIQUE_VIOLATION) {
        throw new ConflictException(
          errorResponse('email_taken', 'An account with this e-mail already exists. Sign in, or reset your password.'),
        );
      }
      throw error;
    }
  }

  /** One answer for "no such e-mail", "no password yet" and "wrong password", in about the same time. */
  async signIn(email: string, password: string): Promise<AuthUser> {
    const row = await this.users.findByEmail(email);
    const ok = await verifyPassword(password, row?.password_hash ?? (await decoyPasswordHash()));
    if (!row || !row.password_hash || !ok) {
      throw new UnauthorizedException(
        errorResponse('invalid_credentials', 'That e-mail and password do not match an account. Check them, or reset your password.'),
      );
    }
    await this.users.recordSignIn(row.id);
    return toAuthUser(row);
  }

  /**
   * Always the same outcome for the caller, registered or not (OWASP Forgot Password Cheat Sheet:
   * "return a consistent message for both existent and non-existent accounts"). For a known
   * address a single-use link is e-mailed; the e-mail is queued in the token's transaction.
   */
  async requestPasswordReset(email: string): Promise<void> {
    await this.db.transaction().execute(async (trx) => {
      const row = await this.users.findByEmail(email, trx);
      if (!row) return;
      await this.mail.enqueue(trx, {
        template: 'password-reset',
        to: row.email,
        userId: row.id,
        data: { name: row.name, ...(await this.resetLink(trx, row.id)) },
      });
    });
  }

  /** A new single-use reset link (older unused ones stop working). */
  private async resetLink(trx: Executor, userId: string) {
    const lifetimeMs = this.config.get('auth', { infer: true }).passwordResetMinutes * 60_000;
    const { token, expiresAt } = await this.tokens.issue(trx, userId, 'password_reset', lifetimeMs);
    return { resetUrl: `${this.publicUrl}/reset-password?token=${encodeURIComponent(token)}`, expiresAt: expiresAt.toISOString() };
  }

  /** The owner resends a reset message: a fresh link, and only to the address the account has now. */
  private async renewResetLink(trx: Executor, message: MessageToRenew) {
    const row = message.userId ? await this.users.findById(message.userId, trx) : undefined;
    if (!row) throw new ConflictException('The account this reset link was for no longer exists, so there is nothing to resend.');
    if (row.email.toLowerCase() !== message.to.toLowerCase()) {
      throw new ConflictException(
        'This account now uses a different e-mail address, and a reset link goes only to the current one. Ask them to request a new link from the sign-in page.',
      );
    }
    return { ...message.data, ...(await this.resetLink(trx, row.id)) };
  }

  /** Spends the token, sets the password and retires any other reset links of the account. */
  async confirmPasswordReset(token: string, password: string): Promise<AuthUser> {
    const passwordHash = await hashPassword(password);
    return this.db.transaction().execute(async (trx) => {
      const userId = await this.tokens.consume(trx, token, 'password_reset');
      if (!userId) throw new BadRequestException(errorResponse('link_invalid', authMessages.resetTokenInvalid));
      await this.tokens.retireUnused(trx, userId, 'password_reset');
      // Whoever held a session (the usual reason to reset) is signed out everywhere.
      await this.sessions.endAllFor(userId, 'password_changed', null, trx);
      const row = await this.users.setPassword(userId, passwordHash, trx);
      if (!row) throw new BadRequestException(errorResponse('link_invalid', authMessages.resetTokenInvalid));
      await this.users.recordSignIn(userId, trx);
      await this.tellPasswordChanged(trx, row, 'reset-link');
      return toAuthUser(row);
    });
  }

  /**
   * A signed-in person changes their password. The current password must be given again (a session
   * left open on a shared computer is not enough). Every session of the account ends, this one
   * included (the caller opens a fresh one for this device), any unused reset link stops working,
   * and the address on the account is told.
   */
  async changePassword(userId: string, currentPassword: string, password: string): Promise<AuthUser> {
    const current = await this.users.findById(userId);
    const ok = await verifyPassword(currentPassword, current?.password_hash ?? (await decoyPasswordHash()));
    if (!current) throw new UnauthorizedException(errorResponse('session_ended', SESSION_ENDED));
    if (!current.password_hash || !ok) {
      throw new BadRequestException(errorResponse('current_password_wrong', authMessages.currentPasswordWrong));
    }
    const passwordHash = await hashPassword(password);
    return this.db.transaction().execute(async (trx) => {
      await this.sessions.endAllFor(userId, 'password_changed', userId, trx);
      await this.tokens.retireUnused(trx, userId, 'password_reset');
      const row = await this.users.setPassword(userId, passwordHash, trx);
      if (!row) throw new UnauthorizedException(errorResponse('session_ended', SESSION_ENDED));
      await this.tellPasswordChanged(trx, row, 'signed-in');
      return toAuthUser(row);
    });
  }

  /** The account's address hears of every password change, with a way back in should it not have been its owner. */
  private tellPasswordChanged(trx: Executor, row: { id: string; email: string; name: string }, how: 'signed-in' | 'reset-link') {
    return this.mail.enqueue(trx, {
      template: 'password-changed',
      to: row.email,
      userId: row.id,
      data: { name: row.name, changedAt: new Date().toISOString(), how, forgotPasswordUrl: `${this.publicUrl}/forgot-password` },
    });
  }

  private setCookie(res: Response, token: string): void {
    const nodeEnv = this.config.get('app', { infer: true }).nodeEnv;
    res.cookie(SESSION_COOKIE, token, sessionCookieOptions(nodeEnv, this.sessionMs));
  }

  /** Opens a new server-side session for this person and sets (or replaces) the session cookie. */
  async startSession(res: Response, user: AuthUser, req?: Request): Promise<void> {
    this.setCookie(res, await this.sessions.open(user, req?.get('user-agent') ?? null));
  }

  /** A fresh token for the same session (sliding renewal); nothing when the session was ended meanwhile. */
  async renewSession(res: Response, user: SessionUser): Promise<void> {
    const token = await this.sessions.renew(user);
    if (token) this.setCookie(res, token);
  }

  /**
   * Clears the cookie, then ends the session on the server, so the token stops working even where
   * a copy of it survives. The cookie goes first: should the database be unreachable, this device
   * is still signed out and the answer (503) says the rest did not happen.
   */
  async endSession(res: Response, user: SessionUser | undefined): Promise<void> {
    const nodeEnv = this.config.get('app', { infer: true }).nodeEnv;
    const { maxAge: _maxAge, ...options } = sessionCookieOptions(nodeEnv, 0);
    res.clearCookie(SESSION_COOKIE, options);
    if (user?.sessionId) await this.sessions.end(user.sessionId, user.id);
  }

  async findUser(id: string): Promise<AuthUser | undefined> {
    const row = await this.users.findById(id);
    return row ? toAuthUser(row) : undefined;
  }

  async currentUser(id: string): Promise<AuthUser> {
    const user = await this.findUser(id);
    if (!user) throw new UnauthorizedException(errorResponse('session_ended', SESSION_ENDED));
    return user;
  }
}
