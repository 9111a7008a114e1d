import type { DB } from './database';

/**
 * Who owns each table: the one module whose repository writes it, and the modules allowed to read
 * it in their own repositories. Everyone else reaches the table through the owner's repository,
 * injected. `api/test/table-ownership.spec.ts` scans `api/src` and fails on a write by anyone but
 * the owner, on a read by a module not listed, and on a query outside a `*.repository.ts` file;
 * it also checks that DEVELOPERS.md holds `tableOwnershipMarkdown()` word for word.
 *
 * A module is a folder directly under `api/src`. Migrations and the demo seed (`api/src/database`)
 * are the schema's own and stand outside this map.
 */

export type TableName = keyof DB;

export interface TableOwnership {
  /** The module whose repository writes the table (insert, update, delete). */
  owner: string;
  /** Modules that may read it in a query of their own (a join, a count); all others go through the owner. */
  readers: readonly string[];
  /** What the table holds, in a few words. */
  holds: string;
}

export const TABLE_OWNERS: Readonly<Record<TableName, TableOwnership>> = {
  users: {
    owner: 'users',
    holds: 'accounts: players, builders, the owner',
    readers: ['auth', 'bench', 'bookings', 'builds', 'calendar-feeds', 'customers', 'exports', 'messages', 'payments', 'price-book'],
  },
  auth_tokens: { owner: 'auth', holds: 'one-use links (reset, invitation)', readers: ['team'] },
  sessions: { owner: 'auth', holds: 'signed-in sessions', readers: [] },
  rate_limits: { owner: 'auth', holds: 'throttling counters (the throttler storage speaks pg directly)', readers: [] },

  builders: {
    owner: 'bench',
    holds: "a builder's level, rate and weekly hours",
    readers: ['bookings', 'builds', 'calendar-feeds', 'customers', 'exports', 'mail', 'messages', 'today'],
  },
  builder_absences: { owner: 'bench', holds: 'days a builder is away', readers: [] },
  bench_allocations: {
    owner: 'bench',
    holds: 'booked bench hours per builder and day',
    readers: ['exports', 'reminders'],
  },
  shop_closures: { owner: 'bench', holds: 'days the shop is shut', readers: [] },
  shop_holiday_choices: { owner: 'bench', holds: 'public holidays the shop works or keeps', readers: [] },

  shop_settings: {
    owner: 'settings',
    holds: "the shop's name, address, locale, currency, time zone",
    readers: ['bench', 'calendar-feeds', 'exports', 'payments', 'reminders', 'shop'],
  },
  price_book_versions: { owner: 'price-book', holds: 'published price books', readers: [] },
  saved_configurations: { owner: 'configurations', holds: "a player's saved rigs", readers: [] },
  configuration_links: { owner: 'configurations', holds: 'shared links to a rig', readers: [] },

  bookings: {
    owner: 'bookings',
    holds: 'a build request and its state',
    readers: ['bench', 'customers', 'exports', 'mail', 'messages'],
  },
  quotes: { owner: 'bookings', holds: 'estimate and firm quotes of a booking', readers: ['exports'] },
  booking_events: { owner: 'bookings', holds: "a booking's history (both timelines)", readers: ['reminders'] },
  photos: { owner: 'bookings', holds: "a booking's photos and a message's", readers: ['messages'] },

  intake_items: { owner: 'builds', holds: 'the intake checklist of a build', readers: [] },
  time_entries: { owner: 'builds', holds: 'hours worked on a build', readers: ['bench', 'exports', 'today'] },
  booking_extras: { owner: 'builds', holds: 'extras proposed and their answers', readers: ['bookings', 'exports', 'today'] },
  layout_approvals: { owner: 'builds', holds: 'layout approvals and their answers', readers: ['bookings', 'today'] },

  payments: {
    owner: 'payments',
    holds: 'deposits, balances, refunds, disputes',
    readers: ['bookings', 'customers', 'exports', 'reminders'],
  },
  payment_events: { owner: 'payments', holds: 'provider events seen once each', readers: [] },

  mail_outbox: { owner: 'mail', holds: 'every e-mail, queued to sent', readers: ['customers'] },
  build_messages: { owner: 'messages', holds: 'messages on a build', readers: [] },
  message_read_markers: { owner: 'messages', holds: 'how far each side has read', readers: [] },
  message_notices: { owner: 'messages', holds: 'batched message mails', readers: [] },
  calendar_feeds: { owner: 'calendar-feeds', holds: 'private calendar feed links', readers: [] },
  reminder_settings: { owner: 'reminders', holds: 'which reminders run and when', readers: [] },
  reminders: { owner: 'reminders', holds: 'reminders sent, once each', readers: [] },
};

/** Files outside a repository allowed to speak SQL, each with why. Everything else queries through a repository. */
export const QUERIES_OUTSIDE_REPOSITORIES: Readonly<Record<string, string>> = {
  'health/health.service.ts': 'the readiness probe runs `select 1`, which names no table',
};

/** May `module` read `table` in a query of its own? */
export function mayRead(module: string, table: TableName): boolean {
  const t = TABLE_OWNERS[table];
  return t.owner === module || t.readers.includes(module);
}

/** The permissions table DEVELOPERS.md carries (the test checks the two are the same). */
export function tableOwnershipMarkdown(): string {
  const rows = (Object.keys(TABLE_OWNERS) as TableName[])
    .slice()
    .sort((a, b) => TABLE_OWNERS[a].owner.localeCompare(TABLE_OWNERS[b].owner) || a.localeCompare(b))
    .map((table) => {
      const t = TABLE_OWNERS[table];
      const readers = t.readers.length ? [...t.readers].sort().join(', ') : 'none';
      return `| \`${table}\` | ${t.holds} | ${t.owner} | ${readers} |`;
    });
  return [
    '| table | holds | owner (reads and writes) | may also read it in their own queries |',
    '| --- | --- | --- | --- |',
    ...rows,
  ].join('\n');
}
