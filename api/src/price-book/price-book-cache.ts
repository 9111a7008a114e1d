import { Injectable, Logger, OnApplicationShutdown, OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { Client } from 'pg';
import type { AppConfig } from '../config/configuration';
import type { PublishedPriceBook } from './price-book.service';

/** The channel a trigger on `price_book_versions` notifies on every change (migration 20261202_0614). */
export const PRICE_BOOK_CHANNEL = 'price_book_changed';

/**
 * Keeps the published price book in memory, so an estimate does not read it from the database.
 *
 * A replica may hold the book only while it is listening: a dedicated connection runs
 * `LISTEN price_book_changed`, and a statement trigger on `price_book_versions` notifies on any
 * insert, update, delete or truncate, whoever makes it (this replica, another, a migration, psql).
 * PostgreSQL delivers a notification to every listener when the writing transaction commits, so a
 * new version reaches every replica at once. While the listening connection is down (database
 * restarted, network cut) nothing is cached and every call reads the database, as before; the
 * connection is tried again every few seconds and the cache starts empty once it is back.
 */
@Injectable()
export class PriceBookCache implements OnModuleInit, OnApplicationShutdown {
  private readonly logger = new Logger('PriceBookCache');
  private client?: Client;
  private listening = false;
  private stopped = false;
  private retry?: NodeJS.Timeout;
  private cached?: Promise<PublishedPriceBook>;

  constructor(private readonly config: ConfigService<AppConfig, true>) {}

  onModuleInit() {
    void this.listen();
  }

  async onApplicationShutdown() {
    this.stopped = true;
    if (this.retry) clearTimeout(this.retry);
    this.listening = false;
    this.cached = undefined;
    await this.client?.end().catch(() => undefined);
  }

  /** True while this replica hears every change, so what it holds is the current book. */
  get isListening(): boolean {
    return this.listening;
  }

  /**
   * The cached value, or `load()`'s answer (kept while listening). The promise is stored before it
   * settles, so a notification that arrives during the read drops it as well; a failed read is not kept.
   */
  get(load: () => Promise<PublishedPriceBook>): Promise<PublishedPriceBook> {
    if (this.listening && this.cached) return this.cached;
    const pending = load();
    if (this.listening) {
      this.cached = pending;
      pending.catch(() => {
        if (this.cached === pending) this.cached = undefined;
      });
    }
    return pending;
  }

  /** Forgets the held book (on a notification, and at once on this replica after it publishes). */
  invalidate(): void {
    this.cached = undefined;
  }

  private async listen(): Promise<void> {
    if (this.stopped) return;
    const { url } = this.config.get('database', { infer: true });
    const client = new Client({ connectionString: url, connectionTimeoutMillis: 3_000 });
    this.client = client;
    const lost = (why: string) => {
      if (this.client !== client) return;
      const wasListening = this.listening;
      this.listening = false;
      this.cached = undefined;
      this.client = undefined;
      void client.end().catch(() => undefined);
      if (this.stopped) return;
      if (wasListening) this.logger.warn(`Price book cache off until the database answers again (${why}).`);
      this.retry = setTimeout(() => void this.listen(), 5_000);
      this.retry.unref();
    };
    client.on('error', (error) => lost(error.message));
    client.on('end', () => lost('connection ended'));
    client.on('notification', (message) => {
      if (message.channel === PRICE_BOOK_CHANNEL) this.cached = undefined;
    });
    try {
      await client.connect();
      await client.query(`listen ${PRICE_BOOK_CHANNEL}`);
      if (this.client !== client) return;
      this.cached = undefined;
      this.listening = true;
    } catch (error) {
      lost((error as Error).message);
    }
  }
}
