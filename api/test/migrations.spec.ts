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
