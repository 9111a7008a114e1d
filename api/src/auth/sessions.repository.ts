import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { Database, Executor, SessionEndReason } from '../database/database';

@Injectable()
export class SessionsRepository {
  constructor(private readonly db: Database) {}

  open(values: { userId: string; expiresAt: Date; userAgent: string | null }, trx: Executor = this.db) {
    return trx
      .insertInto('sessions')
      .values({ user_id: values.userId, expires_at: values.expiresAt, user_agent: values.userAgent })
      .returning(['id'])
      .executeTakeFirstOrThrow();
  }

  /** The session with its person, in one lookup: every signed-in request runs this. */
  findWithUser(sessionId: string, trx: Executor = this.db) {
    return trx
      .selectFrom('sessions')
      .innerJoin('users', 'users.id', 'sessions.user_id')
      .selectAll('users')
      .select(['sessions.id as session_id', 'sessions.ended_at as session_ended_at', 'sessions.ended_reason as session_ended_reason'])
      .where('sessions.id', '=', sessionId)
      .executeTakeFirst();
  }

  renew(sessionId: string, expiresAt: Date, trx: Executor = this.db) {
    return trx
      .updateTable('sessions')
      .set({ renewed_at: sql`now()`, expires_at: expiresAt })
      .where('id', '=', sessionId)
      .where('ended_at', 'is', null)
      .returning('id')
      .executeTakeFirst();
  }

  end(sessionId: string, reason: SessionEndReason, endedBy: string | null, trx: Executor = this.db) {
    return trx
      .updateTable('sessions')
      .set({ ended_at: sql`now()`, ended_reason: reason, ended_by: endedBy })
      .where('id', '=', sessionId)
      .where('ended_at', 'is', null)
      .executeTakeFirst();
  }

  /** Ends every open session of a person; returns how many were still running (not yet expired). */
  async endAllFor(userId: string, reason: SessionEndReason, endedBy: string | null, trx: Executor = this.db): Promise<number> {
    const rows = await trx
      .updateTable('sessions')
      .set({ ended_at: sql`now()`, ended_reason: reason, ended_by: endedBy })
      .where('user_id', '=', userId)
      .where('ended_at', 'is', null)
      .returning(sql<boolean>`expires_at > now()`.as('was_live'))
      .execute();
    return rows.filter((r) => r.was_live).length;
  }

  listLive(userId: string, trx: Executor = this.db) {
    return trx
      .selectFrom('sessions')
      .select(['id', 'created_at', 'renewed_at', 'expires_at', 'user_agent'])
      .where('user_id', '=', userId)
      .where('ended_at', 'is', null)
      .where('expires_at', '>', sql<Date>`now()`)
      .orderBy('renewed_at', 'desc')
      .execute();
  }

  /** Rows a day past their end are only clutter: a token can no longer name them. */
  pruneFor(userId: string, trx: Executor = this.db) {
    return trx
      .deleteFrom('sessions')
      .where('user_id', '=', userId)
      .where('expires_at', '<', sql<Date>`now() - interval '1 day'`)
      .execute();
  }
}
