import { Client } from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoPriceBook, type PriceBook } from '@loomwright/shared';
import { PriceBookCache } from '../src/price-book/price-book-cache';
import { benchBoard } from '../src/database/seed/year-of-data';
import { sessionCookieFor } from './support/sessions';
import { createTwoReplicas, type TestApp } from './support/test-app';

/**
 * Two API processes on one database, each holding the published price book in memory. A new
 * version must reach both at once: publishing through either, or writing the table by hand.
 */
describe('the price book held in memory by every replica', () => {
  let first: TestApp;
  let second: TestApp;
  let databaseUrl: string;
  const dearer = (rateLow: string): PriceBook => ({
    ...demoPriceBook,
    levels: demoPriceBook.levels.map((l) => (l.code === 'journeyman' ? { ...l, rateLow } : l)),
  });
  const journeymanLow = async (t: TestApp) =>
    (await t.http().get('/api/catalog').expect(200)).body.levels.find((l: { code: string }) => l.code === 'journeyman').rateLow as string;

  beforeAll(async () => {
    ({ first, second, databaseUrl } = await createTwoReplicas());
  }, 60_000);
  afterAll(async () => {
    await second?.close();
    await first?.close();
  });

  it('answers from memory: an estimate is priced while the table is locked against every reader', async () => {
    expect(first.app.get(PriceBookCache).isListening).toBe(true);
    expect(second.app.get(PriceBookCache).isListening).toBe(true);
    await first.http().post('/api/estimates').send(benchBoard()).expect(200);
    const locker = new Client({ connectionString: databaseUrl });
    await locker.connect();
    try {
      await locker.query('begin');
      await locker.query('lock table price_book_versions in access exclusive mode');
      // A read of the table would wait for the lock; the held book does not.
      const res = await first.http().post('/api/estimates').send(benchBoard());
      expect(res.status).toBe(200);
      expect(res.body.priceBookVersion).toBe(1);
    } finally {
      await locker.query('rollback');
      await locker.end();
    }
  });

  it('a version published through one replica is what both price from next', async () => {
    expect(await journeymanLow(first)).toBe(await journeymanLow(second));
    const owner = await sessionCookieFor(first, 'owner');
    await first
      .http()
      .post('/api/price-book')
      .set('Cookie', owner)
      .send({ book: dearer('85.00'), notes: 'Journeyman up' })
      .expect(201);
    // The publishing replica forgets its copy before it answers.
    expect(await journeymanLow(first)).toBe('85.00');
    // The other hears PostgreSQL's notification when the publishing transaction commits.
    await expect.poll(() => journeymanLow(second), { timeout: 5_000 }).toBe('85.00');
    const estimate = await second.http().post('/api/estimates').send(benchBoard()).expect(200);
    expect(estimate.body.priceBookVersion).toBe(2);
  });

  it('a version written straight into the table (a migration, psql) reaches both as well', async () => {
    await first.db
      .insertInto('price_book_versions')
      .values({ version: 3, currency: 'USD', book: JSON.stringify(dearer('87.50')) as never, notes: 'by hand' })
      .execute();
    await expect.poll(() => journeymanLow(first), { timeout: 5_000 }).toBe('87.50');
    await expect.poll(() => journeymanLow(second), { timeout: 5_000 }).toBe('87.50');
  });

  it('?view=panel answers the same figures without the lists only the Review step prints; a wrong view is a 400', async () => {
    const full = (await first.http().post('/api/estimates').send(benchBoard()).expect(200)).body;
    const panel = (await first.http().post('/api/estimates?view=panel').send(benchBoard()).expect(200)).body;
    expect(full.checks.signalChain.devices).toHaveLength(13);
    expect(full.checks.cableSchedule.patches).toHaveLength(12);
    expect(panel.checks.signalChain).toBeUndefined();
    expect(panel.checks.cableSchedule.patches).toBeUndefined();
    expect(panel.checks.cableSchedule.powerLeads).toBeUndefined();
    // 13 pedals in series: 12 patch cables (n − 1), two plugs each (common practice, no published source).
    expect(panel.checks.cableSchedule).toMatchObject({ patchCount: 12, plugCount: 24 });
    const { checks: fullChecks, ...fullFigures } = full;
    const { checks: panelChecks, ...panelFigures } = panel;
    expect(panelFigures).toEqual(fullFigures);
    expect(panelChecks.boardFit).toEqual(fullChecks.boardFit);
    expect(panelChecks.powerBudget).toEqual(fullChecks.powerBudget);
    expect(JSON.stringify(panel).length).toBeLessThan(JSON.stringify(full).length * 0.7);
    const wrong = await first.http().post('/api/estimates?view=everything').send(benchBoard());
    expect(wrong.status).toBe(400);
    expect(JSON.stringify(wrong.body)).toMatch(/view must be one of/i);
  });
});
