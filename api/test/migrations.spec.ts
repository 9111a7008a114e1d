import { Migrator } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDatabase } from '../src/database/create-database';
import { migrateToLatest } from '../src/database/migrate';
import { migrations } from '../src/database/migrations';
import { seedDemoShop } from '../src/database/seed';
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
});
