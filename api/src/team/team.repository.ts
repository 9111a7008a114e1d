import { Injectable } from '@nestjs/common';
import { BenchRepository } from '../bench/bench.repository';
import { Database, type Executor } from '../database/database';

/** The team page's list: the bench's builders with when a pending invitation runs out (auth's tokens). */
@Injectable()
export class TeamRepository {
  constructor(
    private readonly db: Database,
    private readonly bench: BenchRepository,
  ) {}

  list(trx: Executor = this.db) {
    return this.bench
      .buildersWithAccounts(trx)
      .select((eb) =>
        eb
          .selectFrom('auth_tokens')
          .select((t) => t.fn.max('auth_tokens.expires_at').as('expires_at'))
          .whereRef('auth_tokens.user_id', '=', 'users.id')
          .where('auth_tokens.purpose', '=', 'staff_invite')
          .where('auth_tokens.used_at', 'is', null)
          .as('invitation_expires_at'),
      )
      .orderBy('builders.active', 'desc')
      .orderBy('users.name')
      .execute();
  }
}
