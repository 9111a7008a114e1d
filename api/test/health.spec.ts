import net from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from './support/test-app';

/**
 * A TCP relay between the API and PostgreSQL that the test can cut and restore, so "the database
 * went away" is real network failure, not a mock.
 */
function createRelay(targetPort: number) {
  const sockets = new Set<net.Socket>();
  let server: net.Server | undefined;
  let port = 0;
  const listen = () =>
    new Promise<number>((resolve) => {
      server = net.createServer((client) => {
        const upstream = net.connect(targetPort, '127.0.0.1');
        sockets.add(client).add(upstream);
        client.pipe(upstream).pipe(client);
        const drop = () => {
          client.destroy();
          upstream.destroy();
        };
        client.on('error', drop).on('close', drop);
        upstream.on('error', drop).on('close', drop);
      });
      server.listen(port, '127.0.0.1', () => {
        port = (server!.address() as net.AddressInfo).port;
        resolve(port);
      });
    });
  const cut = () =>
    new Promise<void>((resolve) => {
      for (const s of sockets) s.destroy();
      sockets.clear();
      server?.close(() => resolve());
    });
  return { listen, cut };
}

describe('GET /api/health', () => {
  let t: TestApp;
  const relay = createRelay(Number(new URL(process.env.TEST_DATABASE_ADMIN_URL!).port));

  beforeAll(async () => {
    const relayPort = await relay.listen();
    t = await createTestApp({
      databaseUrlOverride: (url) => {
        const u = new URL(url);
        u.port = String(relayPort);
        return u.toString();
      },
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
