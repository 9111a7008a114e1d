import { demoPriceBook, jargonIn, type PriceBook } from '@loomwright/shared';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';
import { signIn } from './support/bench-fixtures';

describe('price book versions', () => {
  let t: TestApp;
  const signedIn = (email: string) => signIn(t.app, email);
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t?.close();
  });

  const dearer: PriceBook = {
    ...demoPriceBook,
    levels: demoPriceBook.levels.map((l) => (l.code === 'master' ? { ...l, rateLow: '110.00', rateHigh: '160.00' } : l)),
  };
  const config = countedBoard(9, 'master');

  it('lets only the owner publish; builders read; players and strangers do not', async () => {
    await t.http().get('/api/price-book').expect(401);
    await t.http().post('/api/price-book').send({ book: dearer }).expect(401);
    const player = await signedIn('player@mail.example');
    await player.get('/api/price-book').expect(403);
    const builder = await signedIn('builder@shop.example');
    const overview = await builder.get('/api/price-book').expect(200);
    expect(overview.body.current.version).toBe(1);
    expect(overview.body.current.book).toEqual(demoPriceBook);
    await builder.post('/api/price-book').send({ book: dearer }).expect(403);
  });

  it('publishes a new version; new estimates use it and the old version stays as it was', async () => {
    const before = await t.http().post('/api/estimates').send(config).expect(200);
    expect(before.body).toMatchObject({ priceBookVersion: 1, laborLow: '1000.00', laborHigh: '1500.00' });

    const owner = await signedIn('owner@shop.example');
    const published = await owner.post('/api/price-book').send({ book: dearer, notes: 'Master rates up' }).expect(201);
    expect(published.body).toMatchObject({ version: 2, notes: 'Master rates up', currency: 'USD' });

    const after = await t.http().post('/api/estimates').send(config).expect(200);
    // 9 pedals + the supply = 10 h at 110–160.
    expect(after.body).toMatchObject({ priceBookVersion: 2, laborLow: '1100.00', laborHigh: '1600.00' });
    const catalog = await t.http().get('/api/catalog').expect(200);
    expect(catalog.body.priceBookVersion).toBe(2);

    const overview = await owner.get('/api/price-book').expect(200);
    expect(overview.body.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(overview.body.versions[0].publishedBy).toBe('Odile Varga');
    const v1 = await t.db.selectFrom('price_book_versions').select('book').where('version', '=', 1).executeTakeFirstOrThrow();
    expect(v1.book).toEqual(demoPriceBook);
  });

  it.each([
    [
      'a negative plug price',
      { ...demoPriceBook, materials: { ...demoPriceBook.materials, plugPrice: '-4.00' } },
      'book.materials.plugPrice',
    ],
    ['an unknown currency', { ...demoPriceBook, currency: 'XXY' }, 'book.currency'],
    ['a missing level', { ...demoPriceBook, levels: demoPriceBook.levels.slice(1) }, 'book.levels'],
    ['a price as a number', { ...demoPriceBook, surfaces: [{ ...demoPriceBook.surfaces[0], price: 185 }] }, 'book.surfaces[0].price'],
    [
      'a low rate above the high rate',
      { ...demoPriceBook, levels: demoPriceBook.levels.map((l) => ({ ...l, rateLow: '500.00' })) },
      'book.levels[0].rateLow',
    ],
  ])('refuses %s with a 400 naming the field', async (_what, book, field) => {
    const owner = await signedIn('owner@shop.example');
    const res = await owner.post('/api/price-book').send({ book });
    expect(res.status).toBe(400);
    // Words for the owner in `message`, the field's path beside them in `issues`.
    expect(res.body.issues.some((i: { path: string }) => i.path === field)).toBe(true);
    expect((res.body.details as string[]).flatMap(jargonIn)).toEqual([]);
  });

  it('answers 400 to garbage, never 500', async () => {
    const owner = await signedIn('owner@shop.example');
    for (const raw of ['null', '[]', '"book"', '{"book": 7}', '{"book": {"surfaces": "many"}}', '{not json']) {
      const res = await owner.post('/api/price-book').set('content-type', 'application/json').send(raw);
      expect(res.status).toBe(400);
    }
  });
});
