import { Injectable } from '@nestjs/common';
import { Database, Executor } from '../database/database';

/** Reads what a build sheet prints: the booking, its people and its latest quote. Nothing else. */
@Injectable()
export class BuildSheetsRepository {
  constructor(private readonly db: Database) {}

  findBooking(id: string, trx: Executor = this.db) {
    return trx
      .selectFrom('bookings as b')
      .innerJoin('users as c', 'c.id', 'b.customer_id')
      .leftJoin('builders as bu', 'bu.id', 'b.builder_id')
      .leftJoin('users as bu_user', 'bu_user.id', 'bu.user_id')
      .select([
        'b.id',
        'b.reference',
        'b.state',
        'b.configuration',
        'b.customer_notes',
        'b.bench_date',
        'b.expected_completion',
        'c.name as customer_name',
        'c.email as customer_email',
        'bu_user.name as builder_name',
        'bu.level as builder_level',
      ])
      .where('b.id', '=', id)
      .executeTakeFirst();
  }

  /** The newest quote: a firm one once a builder accepted, else the estimate the player paid on. */
  findLatestQuote(bookingId: string, trx: Executor = this.db) {
    return trx
      .selectFrom('quotes')
      .select(['id', 'kind', 'price_book_version', 'currency', 'configuration', 'estimate', 'hourly_rate', 'total', 'created_at'])
      .where('booking_id', '=', bookingId)
      .orderBy('created_at', 'desc')
      .orderBy('kind', 'desc')
      .limit(1)
      .executeTakeFirst();
  }

  /** The shop's name, voice (locale, currency, time zone) and country (its paper size): the sheet writes money and moments as the shop does. */
  findShop(trx: Executor = this.db) {
    return trx
      .selectFrom('shop_settings')
      .select([
        'name',
        'locale',
        'currency',
        'timezone',
        'country_code',
        'address_line1',
        'address_line2',
        'address_city',
        'address_region',
        'address_postal_code',
      ])
      .where('id', '=', 1)
      .executeTakeFirst();
  }
}
