import { Injectable, NotFoundException, UnauthorizedException } from '@nestjs/common';
import { errorResponse } from '@loomwright/shared';
import { ConfigService } from '@nestjs/config';
import { JwtService } from '@nestjs/jwt';
import type { AuthUser, PersonSessions, SessionsEnded } from '@loomwright/shared';
import type { AppConfig } from '../config/configuration';
import type { Executor, SessionEndReason } from '../database/database';
import { toAuthUser, UsersService } from '../users/users.service';
import { SessionsRepository } from './sessions.repository';

/** The session token's claims: who, and which row of `sessions` it belongs to. */
export interface SessionPayload {
  sub: string;
  sid: string;
  email: string;
  name: string;
  role: AuthUser['role'];
  iat?: number;
  exp?: number;
}

/** The signed-in person on a request, with the session it came through. */
export interface SessionUser extends AuthUser {
  sessionId: string;
  issuedAt?: number;
}

const endedWords: Record<SessionEndReason, string> = {
  signed_out: 'You signed out of this session; please sign in again.',
  signed_out_everywhere: 'The shop signed this account out of every device; please sign in again.',
  password_changed: 'Your password was changed since you signed in; please sign in again.',
};
export const SESSION_ENDED = 'Your session has ended; please sign in again.';

/**
 * Server-side sessions behind the JWT cookie. The token stays short-lived and signed, but it also
 * names a row of `sessions`, and a request is let in only while that row is open: signing out,
 * the owner's "sign out everywhere" and a password change end rows, and the token dies with them.
 */
@Injectable()
export class SessionsService {
  constructor(
    private readonly sessions: SessionsRepository,
    private readonly users: UsersService,
    private readonly jwt: JwtService,
    private readonly config: ConfigService<AppConfig, true>,
  ) {}

  get sessionMs(): number {
    return this.config.get('auth', { infer: true }).sessionMinutes * 60_000;
  }

  private sign(user: AuthUser, sessionId: string): string {
    const payload: SessionPayload = { sub: user.id, sid: sessionId, email: user.email, name: user.name, role: user.role };
    return this.jwt.sign(payload, { expiresIn: Math.floor(this.sessionMs / 1000) });
  }

  /** Opens a session for the person and returns its token. */
  async open(user: AuthUser, userAgent: string | null = null, trx?: Executor): Promise<string> {
    await this.sessions.pruneFor(user.id, trx);
    const row = await this.sessions.open(
      { userId: user.id, expiresAt: new Date(Date.now() + this.sessionMs), userAgent: userAgent?.slice(0, 300) ?? null },
      trx,
    );
    return this.sign(user, row.id);
  }

  /** A fresh token for the same session, or undefined when the session was ended meanwhile. */
  async renew(user: SessionUser): Promise<string | undefined> {
    const row = await this.sessions.renew(user.sessionId, new Date(Date.now() + this.sessionMs));
    return row ? this.sign(user, user.sessionId) : undefined;
  }

  /**
   * The person behind a verified token, read from the database on every request (one lookup), so
   * an ended session, a removed account, a changed role or a changed password applies at once.
   */
  async personFor(payload: SessionPayload): Promise<SessionUser> {
    if (typeof payload.sid !== 'string') throw new UnauthorizedException(errorResponse('session_ended', SESSION_ENDED));
    const row = await this.sessions.findWithUser(payload.sid);
    if (!row || row.id !== payload.sub) throw new UnauthorizedException(errorResponse('session_ended', SESSION_ENDED));
    if (row.session_ended_at)
      throw new UnauthorizedException(errorResponse('session_ended', endedWords[row.session_ended_reason ?? 'signed_out']));
    const changedAt = row.password_changed_at ? Math.floor(new Date(row.password_changed_at).getTime() / 1000) : undefined;
    if (changedAt !== undefined && (payload.iat ?? 0) < changedAt)
      throw new UnauthorizedException(errorResponse('session_ended', endedWords.password_changed));
    return { ...toAuthUser(row), sessionId: row.session_id, issuedAt: payload.iat };
  }

  end(sessionId: string, endedBy: string | null) {
    return this.sessions.end(sessionId, 'signed_out', endedBy);
  }

  /** Ends every session of a person (a password change, or the owner's "sign out everywhere"). */
  endAllFor(userId: string, reason: Exclude<SessionEndReason, 'signed_out'>, endedBy: string | null, trx?: Executor) {
    return this.sessions.endAllFor(userId, reason, endedBy, trx);
  }

  async listFor(userId: string): Promise<PersonSessions> {
    await this.requirePerson(userId);
    const rows = await this.sessions.listLive(userId);
    return {
      userId,
      sessions: rows.map((r) => ({
        id: r.id,
        startedAt: new Date(r.created_at).toISOString(),
        lastRenewedAt: new Date(r.renewed_at).toISOString(),
        expiresAt: new Date(r.expires_at).toISOString(),
        device: r.user_agent,
      })),
    };
  }

  async signOutEverywhere(userId: string, by: AuthUser): Promise<SessionsEnded> {
    await this.requirePerson(userId);
    return { userId, ended: await this.endAllFor(userId, 'signed_out_everywhere', by.id) };
  }

  private async requirePerson(userId: string) {
    if (!(await this.users.findById(userId))) throw new NotFoundException('There is no account with that id.');
  }
}
