import { Migrator, sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDatabase } from '../src/database/create-database';
import { migrateToLatest } from '../src/database/migrate';
import { migrations } from '../src/database/migrations';
import { seedDemoShop, seedSteps } from '../src/database/seed';
import { seedBookings } from '../src/database/seed/seed-bookings';
import { createEmptyDatabase } from './support/test-app';

describe('migrations and seed', () => {
  let fresh: Awaited<ReturnType<typeof createEmptyDatabase>>;
  beforeAll(async () => {
    fresh = await createEmptyDatabase('lw_migrate');
  });
  afterAll(async () => fresh.drop());

  it('run from an empty database, and a second start applies nothing and fails on nothing', async () => {
    const db = createDatabase(fresh.url);
    try {
      const first = await migrateToLatest(db);
      expect(first).toEqual(Object.keys(migrations));
      const second = await migrateToLatest(db);
      expect(second).toEqual([]);
    } finally {
      await db.destroy();
    }
  });

  it('moves old "outcome unknown" failures to unknown and removes links from finished link messages', async () => {
    const other = await createEmptyDatabase('lw_migrate_mail');
    const db = createDatabase(other.url);
    try {
      const migrator = new Migrator({ db, provider: { getMigrations: async () => migrations } });
      expect((await migrator.migrateTo('20261202_0217_photo_variants')).error).toBeUndefined();
      const link = 'http://shop.test/reset-password?token=' + 'A'.repeat(43);
      const row = (template: string, state: 'queued' | 'sent' | 'failed', data: object, lastError: string | null = null) => ({
        message_id: `<${template}-${state}-${Math.random()}@shop.test>`,
        template,
        to_address: 'p@mail.example',
        data: JSON.stringify(data),
        state,
        last_error: lastError,
      });
      await db
        .insertInto('mail_outbox')
        .values([
          row('password-reset', 'sent', { name: 'P', resetUrl: link, expiresAt: 'x' }),
          row('password-reset', 'queued', { name: 'Q', resetUrl: link, expiresAt: 'x' }),
          row('staff-invite', 'failed', { name: 'S', acceptUrl: link }),
          row(
            'welcome',
            'failed',
            { name: 'W' },
            'Delivery outcome unknown: the sender stopped while handing the message to the mail server.',
          ),
        ])
        .execute();
      await migrateToLatest(db);
      const rows = await db.selectFrom('mail_outbox').select(['template', 'state', 'data']).orderBy('template').orderBy('state').execute();
      expect(rows).toEqual([
        { template: 'password-reset', state: 'queued', data: { name: 'Q', resetUrl: link, expiresAt: 'x' } },
        { template: 'password-reset', state: 'sent', data: { name: 'P', expiresAt: 'x' } },
        { template: 'staff-invite', state: 'failed', data: { name: 'S' } },
        { template: 'welcome', state: 'unknown', data: { name: 'W' } },
      ]);
    } finally {
      await db.destroy();
      await other.drop();
    }
  });

  it('seeds the demo shop idempotently: two runs leave one copy of each row', async () => {
    const db = createDatabase(fresh.url);
    try {
      await seedDemoShop(db);
      await seedDemoShop(db);
      const shops = await db.selectFrom('shop_settings').select(['name']).execute();
      expect(shops).toHaveLength(1);
    } finally {
      await db.destroy();
    }
  });

  it('upgrades a shop database that already holds quotes, and leaves every stored quote as the player saw it', async () => {
    // A quote is a snapshot (a trigger refuses any UPDATE); a migration that rewrote stored quotes
    // once stopped the upgrade of every shop that had taken a booking.
    const other = await createEmptyDatabase('lw_migrate_quotes');
    const db = createDatabase(other.url);
    try {
      const migrator = new Migrator({ db, provider: { getMigrations: async () => migrations } });
      expect((await migrator.migrateTo('20261202_0957_holiday_choices')).error).toBeUndefined();
      for (const step of seedSteps) await (step.name === 'bookings' ? seedBookings(db, { evenInTests: true }) : step.run(db));
      // One more quote in the shape stored before labor lines carried a basis (copied through a
      // temporary table, since quotes cannot be updated in place).
      const [first] = await db.selectFrom('quotes').select(['id', 'estimate']).limit(1).execute();
      const estimate = first.estimate as { lines: { kind: string; explanation?: string; basis?: string }[] };
      const oldShape = {
        ...estimate,
        lines: estimate.lines.map(({ basis: _basis, ...line }) =>
          line.kind === 'labor' ? { ...line, explanation: '6 pedals at 1 h each, at 80.00–100.00 per hour' } : line,
        ),
      };
      await sql`create temporary table old_quote as select * from quotes where id = ${first.id}`.execute(db);
      await sql`update old_quote set id = gen_random_uuid(), estimate = ${JSON.stringify(oldShape)}::jsonb`.execute(db);
      await sql`insert into quotes select * from old_quote`.execute(db);
      const before = await db.selectFrom('quotes').select(['id', 'estimate']).orderBy('id').execute();

      const { error } = await migrator.migrateToLatest();
      expect(error).toBeUndefined();
      const after = await db.selectFrom('quotes').select(['id', 'estimate']).orderBy('id').execute();
      expect(after).toEqual(before);
    } finally {
      await db.destroy();
      await other.drop();
    }
  });
});
