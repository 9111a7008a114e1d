import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createRelay, testDatabasePort, throughRelay } from './support/tcp-relay';
import { createTestApp, type TestApp } from './support/test-app';

describe('GET /api/health', () => {
  let t: TestApp;
  const relay = createRelay(testDatabasePort());

  beforeAll(async () => {
    const relayPort = await relay.listen();
    t = await createTestApp({
      databaseUrlOverride: throughRelay(relayPort),
    });
  });
  afterAll(async () => {
    await t.close();
    await relay.cut();
  });

  it('answers ok with db up after a real query', async () => {
    const res = await t.http().get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', db: 'up' });
  });

  it('answers 503 with db down while the database is unreachable, and recovers without a restart', async () => {
    await relay.cut();
    const started = Date.now();
    const down = await t.http().get('/api/health');
    expect(down.status).toBe(503);
    expect(down.body.db).toBe('down');
    expect(Date.now() - started).toBeLessThan(5_000);

    await relay.listen();
    let recovered = false;
    for (let i = 0; i < 20 && !recovered; i++) {
      const res = await t.http().get('/api/health');
      recovered = res.status === 200 && res.body.db === 'up';
      if (!recovered) await new Promise((r) => setTimeout(r, 250));
    }
    expect(recovered).toBe(true);
  });

  it('serves the API documentation generated from the controllers', async () => {
    const res = await t.http().get('/api/docs-json').expect(200);
    expect(Object.keys(res.body.paths)).toEqual(expect.arrayContaining(['/api/health', '/api/shop']));
  });
});
