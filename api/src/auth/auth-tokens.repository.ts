import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { AuthTokensTable, Database, Executor } from '../database/database';

type Purpose = AuthTokensTable['purpose'];

@Injectable()
export class AuthTokensRepository {
  constructor(private readonly db: Database) {}

  insert(values: { userId: string; purpose: Purpose; tokenHash: string; expiresAt: Date }, trx: Executor = this.db) {
    return trx
      .insertInto('auth_tokens')
      .values({ user_id: values.userId, purpose: values.purpose, token_hash: values.tokenHash, expires_at: values.expiresAt })
      .returning(['id', 'expires_at'])
      .executeTakeFirstOrThrow();
  }

  /**
   * Marks the token used and returns its owner, in one statement: of two requests racing with the
   * same token only one gets the row back, so a token can never be spent twice.
   */
  consume(tokenHash: string, purpose: Purpose, trx: Executor = this.db) {
    return this.spendUnused(trx, purpose)
      .where('token_hash', '=', tokenHash)
      .where('expires_at', '>', sql<Date>`now()`)
      .returning(['user_id'])
      .executeTakeFirst();
  }

  /** Retires every unused token of one purpose for a user (a newer link, or the password changed). */
  retireUnused(userId: string, purpose: Purpose, trx: Executor = this.db) {
    return this.spendUnused(trx, purpose).where('user_id', '=', userId).execute();
  }

  /** Marks used the unused tokens of one purpose that the caller's filters pick. */
  private spendUnused(trx: Executor, purpose: Purpose) {
    return trx
      .updateTable('auth_tokens')
      .set({ used_at: sql`now()` })
      .where('purpose', '=', purpose)
      .where('used_at', 'is', null);
  }
}
