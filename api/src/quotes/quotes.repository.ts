import { Injectable } from '@nestjs/common';
import { sql } from 'kysely';
import { Database, type Executor } from '../database/database';

/** The queries of quotes the player keeps: a booking's quote, and how many quotes a person had e-mailed. */
@Injectable()
export class QuotesRepository {
  constructor(private readonly db: Database) {}

  /** The newest quote of a booking: a firm one once a builder accepted, else the estimate requested on. */
  latestOf(bookingId: string, trx: Executor = this.db) {
    return trx
      .selectFrom('quotes as q')
      .innerJoin('bookings as b', 'b.id', 'q.booking_id')
      .select([
        'b.reference',
        'q.kind',
        'q.price_book_version',
        'q.configuration',
        'q.estimate',
        'q.hourly_rate',
        'q.total',
        'q.created_at',
      ])
      .where('q.booking_id', '=', bookingId)
      .orderBy('q.created_at', 'desc')
      .orderBy('q.kind', 'desc')
      .limit(1)
      .executeTakeFirst();
  }

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
