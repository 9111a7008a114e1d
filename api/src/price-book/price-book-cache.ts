import { Injectable } from '@nestjs/common';
import { DatabaseChanges, HeldWhileListening } from '../database/change-notifications';
import type { PublishedPriceBook } from './price-book.service';

/** The channel a trigger on `price_book_versions` notifies on every change (migration 20261202_0614). */
export const PRICE_BOOK_CHANNEL = 'price_book_changed';

/**
 * Keeps the published price book in memory, so an estimate does not read it from the database.
 *
 * A replica may hold the book only while it is listening (`DatabaseChanges`): a statement trigger
 * on `price_book_versions` notifies on any insert, update, delete or truncate, whoever makes it
 * (this replica, another, a migration, psql), so a new version reaches every replica at once; the
 * publishing replica drops its own copy as soon as it commits. While
 * the listening connection is down nothing is held and every call reads the database, as before;
 * the held book starts empty once the connection is back.
 */
@Injectable()
export class PriceBookCache extends HeldWhileListening<PublishedPriceBook> {
  constructor(changes: DatabaseChanges) {
    super(changes, PRICE_BOOK_CHANNEL, ['price_book_versions']);
  }
}
