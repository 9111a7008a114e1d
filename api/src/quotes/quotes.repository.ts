import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { Database, type Executor } from '../database/database';

/** The quote e-mail's lock (the count is the outbox's `sentInLastHour`; a booking's own quote is the bookings repository's `latestQuote`). */
@Injectable()
export class QuotesRepository {
  constructor(private readonly db: Database) {}

  /** One person's quote e-mails are counted one at a time, so two clicks cannot both pass the limit. */
  lockQuoteMail(trx: Executor, userId: string) {
    return sql`select pg_advisory_xact_lock(hashtext(${`quote-mail:${userId}`}))`.execute(trx);
  }
}
