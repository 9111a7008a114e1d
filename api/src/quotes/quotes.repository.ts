import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { Database, type Executor } from '../database/database';

/** How many quotes a person had e-mailed (a booking's own quote is the bookings repository's `latestQuote`). */
@Injectable()
export class QuotesRepository {
  constructor(private readonly db: Database) {}

  /** One person's quote e-mails are counted one at a time, so two clicks cannot both pass the limit. */
  lockQuoteMail(trx: Executor, userId: string) {
    return sql`select pg_advisory_xact_lock(hashtext(${`quote-mail:${userId}`}))`.execute(trx);
  }

  quoteMailsInLastHour(trx: Executor, userId: string, template: string) {
    return trx
      .selectFrom('mail_outbox')
      .select((eb) => eb.fn.countAll<string>().as('n'))
      .where('user_id', '=', userId)
      .where('template', '=', template)
      .where('created_at', '>', sql<Date>`now() - interval '1 hour'`)
      .where('resent_from_id', 'is', null)
      .executeTakeFirstOrThrow()
      .then((r) => Number(r.n));
  }
}
