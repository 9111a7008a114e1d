import { ConflictException, Injectable, ServiceUnavailableException } from '@nestjs/common';
import { errorResponse } from '@loomwright/shared';
import type { Catalog, PriceBook, PriceBookOverview, PriceBookVersionSummary } from '@loomwright/shared';
import { Database, Executor } from '../database/database';
import { PriceBookCache } from './price-book-cache';
import { PriceBookRepository } from './price-book.repository';

export interface PublishedPriceBook {
  version: number;
  publishedAt: Date;
  book: PriceBook;
}

const UNIQUE_VIOLATION = '23505';

/** `Generated<Timestamp>` columns come back typed as the column wrapper; pg hands us a Date. */
const asDate = (value: unknown): Date => (value instanceof Date ? value : new Date(String(value)));

@Injectable()
export class PriceBookService {
  constructor(
    private readonly db: Database,
    private readonly books: PriceBookRepository,
    private readonly cache: PriceBookCache,
  ) {}

  /**
   * The version every new estimate is priced from. Without a transaction it comes from memory
   * (PriceBookCache: every replica drops it when any version is published); inside one it is read
   * there, so a booking and its quote see the same version as the rest of that transaction.
   */
  current(trx: Executor = this.db): Promise<PublishedPriceBook> {
    if (trx === this.db) return this.cache.get(() => this.readCurrent(this.db));
    return this.readCurrent(trx);
  }

  private async readCurrent(trx: Executor): Promise<PublishedPriceBook> {
    const row = await this.books.findCurrent(trx);
    if (!row)
      throw new ServiceUnavailableException(
        errorResponse('price_book_missing', 'No price book has been published yet; the owner publishes one in the backoffice.'),
      );
    return { version: row.version, publishedAt: asDate(row.published_at), book: row.book };
  }

  /** A stored version, for re-reading an old quote exactly as it was priced. */
  async version(version: number, trx: Executor = this.db): Promise<PublishedPriceBook | undefined> {
    const row = await this.books.findVersion(version, trx);
    return row ? { version: row.version, publishedAt: asDate(row.published_at), book: row.book } : undefined;
  }

  async catalog(): Promise<Catalog> {
    const { version, publishedAt, book } = await this.current();
    return {
      priceBookVersion: version,
      publishedAt: publishedAt.toISOString(),
      currency: book.currency,
      surfaces: book.surfaces,
      cases: book.cases,
      functions: book.functions,
      levels: book.levels,
      depositPolicy: book.depositPolicy,
      materials: book.materials,
      labor: book.labor,
      ...(book.power ? { power: book.power } : {}),
    };
  }

  async overview(): Promise<PriceBookOverview> {
    const [row, versions] = await Promise.all([this.books.findCurrent(), this.books.listVersions()]);
    if (!row) throw new ServiceUnavailableException(errorResponse('price_book_missing', 'No price book has been published yet.'));
    const summaries: PriceBookVersionSummary[] = versions.map((v) => ({
      version: v.version,
      currency: v.currency.trim(),
      notes: v.notes,
      publishedAt: asDate(v.published_at).toISOString(),
      publishedBy: v.published_by_name,
    }));
    return { current: { ...summaries.find((s) => s.version === row.version)!, book: row.book }, versions: summaries };
  }

  /**
   * Publishes a whole book as the next version. Versions are never edited, so quotes priced from
   * an older one keep it. Two owners publishing at once: one wins, the other gets a 409.
   */
  async publish(book: PriceBook, notes: string, publishedBy: string | null): Promise<PriceBookVersionSummary> {
    try {
      const row = await this.db.transaction().execute(async (trx) => {
        await this.books.lockPublishing(trx);
        const next = (await this.books.latestVersionNumber(trx)) + 1;
        return this.books.insert({ version: next, book, notes, publishedBy }, trx);
      });
      // This replica forgets the old book now; the others as their notification arrives.
      this.cache.invalidate();
      return {
        version: row.version,
        currency: row.currency.trim(),
        notes: row.notes,
        publishedAt: asDate(row.published_at).toISOString(),
        publishedBy: null,
      };
    } catch (error) {
      if ((error as { code?: string }).code === UNIQUE_VIOLATION) {
        throw new ConflictException('Another version was published at the same moment; reload the price book and try again.');
      }
      throw error;
    }
  }
}
