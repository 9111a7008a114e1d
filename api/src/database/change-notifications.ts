import { Injectable, Logger, OnApplicationShutdown, OnModuleInit } from '@nestjs/common';
import { ConfigService } from '@nestjs/config';
import { Client } from 'pg';
import type { AppConfig } from '../config/configuration';

/**
 * One dedicated pg connection per API process that LISTENs on the channels the in-memory copies
 * of the database depend on (the published price book, the bench). Triggers NOTIFY those channels
 * on every change, whoever makes it (this replica, another, a migration, psql), and PostgreSQL
 * delivers a notification to every listener when the writing transaction commits.
 *
 * Whoever subscribes to a channel hears every notification on it, and also every moment at which
 * notifications may have been missed: the connection lost, and the connection (re)established.
 * While the connection is down `isListening` is false, so nothing may be held; it is tried again
 * every few seconds.
 */
@Injectable()
export class DatabaseChanges implements OnModuleInit, OnApplicationShutdown {
  private readonly logger = new Logger('DatabaseChanges');
  private readonly subscribers = new Map<string, Set<() => void>>();
  private readonly byTable = new Map<string, Set<() => void>>();
  private client?: Client;
  private listening = false;
  private stopped = false;
  private retry?: NodeJS.Timeout;

  constructor(private readonly config: ConfigService<AppConfig, true>) {}

  onModuleInit() {
    void this.listen();
  }

  async onApplicationShutdown() {
    this.stopped = true;
    if (this.retry) clearTimeout(this.retry);
    this.setListening(false);
    await this.client?.end().catch(() => undefined);
  }

  /** True while this process hears every change on its channels. */
  get isListening(): boolean {
    return this.listening;
  }

  /**
   * Calls `onChange` on every notification on `channel`, whenever this process may have missed one
   * (the connection lost or made again), and as soon as this process itself commits a write to one
   * of `tables` (the tables whose triggers notify the channel), before its notification comes round.
   */
  subscribe(channel: string, onChange: () => void, tables: readonly string[] = []): void {
    if (!/^[a-z_]+$/.test(channel)) throw new Error(`Not a channel name: ${channel}`);
    for (const table of tables) {
      const set = this.byTable.get(table) ?? new Set();
      set.add(onChange);
      this.byTable.set(table, set);
    }
    const known = this.subscribers.get(channel);
    if (known) {
      known.add(onChange);
      return;
    }
    this.subscribers.set(channel, new Set([onChange]));
    // A channel added while listening is not heard until the next connection: start that one now.
    if (this.client) this.reconnect('a channel was added');
  }

  /** This process committed writes to `tables` (the database driver tells, see create-database.ts). */
  committedHere(tables: ReadonlySet<string>): void {
    const called = new Set<() => void>();
    for (const table of tables) {
      for (const onChange of this.byTable.get(table) ?? []) {
        if (called.has(onChange)) continue;
        called.add(onChange);
        onChange();
      }
    }
  }

  private notifyAll(): void {
    for (const set of this.subscribers.values()) for (const onChange of set) onChange();
  }

  private setListening(on: boolean): void {
    this.listening = on;
    this.notifyAll();
  }

  private reconnect(why: string): void {
    const client = this.client;
    this.client = undefined;
    this.setListening(false);
    void client?.end().catch(() => undefined);
    this.logger.log(`Listening again (${why}).`);
    void this.listen();
  }

  private async listen(): Promise<void> {
    if (this.stopped) return;
    const { url } = this.config.get('database', { infer: true });
    const client = new Client({ connectionString: url, connectionTimeoutMillis: 3_000 });
    this.client = client;
    const lost = (why: string) => {
      if (this.client !== client) return;
      const wasListening = this.listening;
      this.client = undefined;
      this.setListening(false);
      void client.end().catch(() => undefined);
      if (this.stopped) return;
      if (wasListening) this.logger.warn(`In-memory copies off until the database answers again (${why}).`);
      this.retry = setTimeout(() => void this.listen(), 5_000);
      this.retry.unref();
    };
    client.on('error', (error) => lost(error.message));
    client.on('end', () => lost('connection ended'));
    client.on('notification', (message) => {
      for (const onChange of this.subscribers.get(message.channel) ?? []) onChange();
    });
    try {
      await client.connect();
      for (const channel of this.subscribers.keys()) await client.query(`listen ${channel}`);
      if (this.client !== client) return;
      this.setListening(true);
    } catch (error) {
      lost((error as Error).message);
    }
  }
}

/**
 * A value read from the database and held in memory only while this process hears every change to
 * what it was read from (`DatabaseChanges`, one channel). A notification, a lost connection or
 * `invalidate()` drops it; the next `get` reads it again.
 */
export class HeldWhileListening<T> {
  private held?: Promise<T>;

  constructor(
    private readonly changes: DatabaseChanges,
    channel: string,
    tables: readonly string[],
  ) {
    changes.subscribe(channel, () => this.invalidate(), tables);
  }

  /** True while this process hears every change, so what it holds is current. */
  get isListening(): boolean {
    return this.changes.isListening;
  }

  /**
   * The held value, or `load()`'s answer (kept while listening). The promise is stored before it
   * settles, so a notification that arrives during the read drops it as well; a failed read is not kept.
   */
  get(load: () => Promise<T>): Promise<T> {
    if (this.changes.isListening && this.held) return this.held;
    const pending = load();
    if (this.changes.isListening) {
      this.held = pending;
      pending.catch(() => {
        if (this.held === pending) this.held = undefined;
      });
    }
    return pending;
  }

  /** Forgets the held value (on a notification, and at once in this process after it writes). */
  invalidate(): void {
    this.held = undefined;
  }
}
