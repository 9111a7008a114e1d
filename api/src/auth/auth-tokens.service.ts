import { createHash, randomBytes } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import type { AuthTokensTable, Executor } from '../database/database';
import { AuthTokensRepository } from './auth-tokens.repository';

export type TokenPurpose = AuthTokensTable['purpose'];

/**
 * Single-use, expiring tokens for links sent by e-mail. Only a SHA-256 of the token is stored
 * (OWASP Forgot Password Cheat Sheet: store tokens hashed; a 256-bit random token needs no slow
 * hash), so a copy of the database cannot be used to reset anyone's password.
 */
@Injectable()
export class AuthTokensService {
  constructor(private readonly tokens: AuthTokensRepository) {}

  static hash(token: string): string {
    return createHash('sha256').update(token, 'utf8').digest('hex');
  }

  /** Issues a new token and retires the user's older unused ones of the same purpose. */
  async issue(trx: Executor, userId: string, purpose: TokenPurpose, lifetimeMs: number) {
    await this.tokens.retireUnused(userId, purpose, trx);
    const token = randomBytes(32).toString('base64url');
    const row = await this.tokens.insert(
      { userId, purpose, tokenHash: AuthTokensService.hash(token), expiresAt: new Date(Date.now() + lifetimeMs) },
      trx,
    );
    return { token, expiresAt: new Date(row.expires_at) };
  }

  /** The token's user when it is unused and unexpired (and marks it used); otherwise undefined. */
  async consume(trx: Executor, token: string, purpose: TokenPurpose): Promise<string | undefined> {
    const row = await this.tokens.consume(AuthTokensService.hash(token), purpose, trx);
    return row?.user_id;
  }

  retireUnused(trx: Executor, userId: string, purpose: TokenPurpose) {
    return this.tokens.retireUnused(userId, purpose, trx);
  }
}
