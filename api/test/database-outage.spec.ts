import { execFile } from 'node:child_process';
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';
import type { Express } from 'express';
import { Client } from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { shopUnavailableMessage } from '@loomwright/shared';
import { createTestApp, type TestApp } from './support/test-app';
import { sessionCookieFor } from './support/sessions';

const run = promisify(execFile);
const scripts = path.resolve(__dirname, '..', 'scripts');
const postgres = (...args: string[]) => run('bash', [path.join(scripts, 'postgres.sh'), ...args], { timeout: 120_000 });

/** A well-formed id that names nothing: with a session cookie the guard reads the database before any lookup. */
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';

/** Every "METHOD /path" Express has, as the authorization matrix reads them. */
function registeredRoutes(t: TestApp): Array<[string, string]> {
  const express = t.app.getHttpAdapter().getInstance() as Express & {
    router: { stack: Array<{ route?: { path: string; methods: Record<string, boolean> } }> };
  };
  const routes: Array<[string, string]> = [];
  for (const layer of express.router.stack) {
    if (!layer.route) continue;
    for (const [method, on] of Object.entries(layer.route.methods))
      if (on && method !== '_all') routes.push([method.toUpperCase(), layer.route.path]);
  }
  return routes;
}

/**
 * A REAL outage: this file starts a PostgreSQL cluster of its own (not the shared test cluster the
 * other API test files use at the same time), points an API at it, stops the server mid-test with
 * pg_ctl and starts it again. While it is down every route must answer 503 with the words the apps
 * show (never 401, which would sign people out, and never 500); once it is back, the same API
 * process must serve again without a restart.
 */
describe('while the database is down', () => {
  let dataDir: string;
  let port: string;
  let t: TestApp;
  let ownerCookie: string;
  let playerCookie: string;

  const request = (method: string, url: string, cookie?: string) => {
    let req = t.http()[method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete'](url);
    if (cookie) req = req.set('Cookie', cookie);
    // Each call in the content type its route documents (csrf.spec.ts): multipart for the photo upload and a
    // message (it may carry photos), else JSON.
    if (method === 'DELETE') return req.set('Content-Type', 'application/json');
    if (!['POST', 'PUT', 'PATCH'].includes(method)) return req;
    return url.endsWith('/photos') || url.endsWith('/messages') ? req.field('caption', '') : req.send({});
  };

  beforeAll(async () => {
    dataDir = await mkdtemp(path.join(tmpdir(), 'lw-outage-pg-'));
    // A port free right now, picked the way `npm test` picks the shared cluster's.
    port = (await run('node', [path.join(scripts, 'free-port.mjs')])).stdout.trim();
    await postgres('start', dataDir, port);
    const admin = new Client({ connectionString: `postgres://postgres@127.0.0.1:${port}/postgres` });
    await admin.connect();
    await admin.query('create database loomwright_outage');
    await admin.end();
    t = await createTestApp({ databaseUrlOverride: () => `postgres://postgres@127.0.0.1:${port}/loomwright_outage` });
    ownerCookie = await sessionCookieFor(t, 'owner');
    playerCookie = await sessionCookieFor(t, 'customerA');
    await t.http().get('/api/auth/me').set('Cookie', playerCookie).expect(200);
  }, 180_000);

  afterAll(async () => {
    await t?.close();
    if (dataDir) {
      await postgres('stop', dataDir).catch(() => undefined);
      await rm(dataDir, { recursive: true, force: true });
    }
  }, 60_000);

  it('every route answers 503 in words, signed in or not, and all of it recovers when the database returns', async () => {
    await postgres('stop', dataDir);

    // Signed in: the session check itself needs the database, so every route is 503 (the API
    // documentation is static and served without a session, so it is left out).
    const problems: string[] = [];
    const routes = registeredRoutes(t).filter(([, p]) => !p.startsWith('/api/docs'));
    expect(routes.length).toBeGreaterThan(40);
    for (const [method, pattern] of routes) {
      const url = pattern.replace(/:[A-Za-z]+/g, UNKNOWN_ID);
      for (const [who, cookie] of [
        ['owner', ownerCookie],
        ['player', playerCookie],
      ] as const) {
        const res = await request(method, url, cookie);
        if (res.status !== 503 || res.body?.message !== shopUnavailableMessage || res.headers['retry-after'] !== '30') {
          problems.push(
            `${method} ${pattern} as ${who}: ${res.status} ${JSON.stringify(res.body?.message)} retry-after=${res.headers['retry-after']}`,
          );
        }
      }
    }
    expect(problems).toEqual([]);

    // Not signed in: the open routes that read the shop's data, sign-in and sign-up included.
    const anonymous = {
      'sign-in': t.http().post('/api/auth/sign-in').send({ email: 'player@mail.example', password: 'demo-pass-2026' }),
      'sign-up': t
        .http()
        .post('/api/auth/sign-up')
        .send({ email: 'new.player@mail.example', password: 'a-long-password', name: 'New Player' }),
      'password reset': t.http().post('/api/auth/password-reset').send({ email: 'player@mail.example' }),
      catalog: t.http().get('/api/catalog'),
      shop: t.http().get('/api/shop'),
      'lead time': t.http().get('/api/bench/lead-time?hours=10.00&level=journeyman'),
    };
    for (const [what, pending] of Object.entries(anonymous)) {
      const res = await pending;
      expect(res.status, what).toBe(503);
      expect(res.body).toMatchObject({ statusCode: 503, message: shopUnavailableMessage });
    }
    const health = await t.http().get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body.db).toBe('down');

    await postgres('start', dataDir, port);

    // The same process, no restart: the pool reconnects on the next query.
    let me = await t.http().get('/api/auth/me').set('Cookie', playerCookie);
    for (let i = 0; i < 40 && me.status !== 200; i++) {
      await new Promise((r) => setTimeout(r, 250));
      me = await t.http().get('/api/auth/me').set('Cookie', playerCookie);
    }
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe('player@mail.example');
    await t.http().get('/api/bookings').set('Cookie', ownerCookie).expect(200);
    await t.http().get('/api/catalog').expect(200);
    await t.http().post('/api/auth/sign-in').send({ email: 'player@mail.example', password: 'demo-pass-2026' }).expect(200);
    await t.http().get('/api/health').expect(200);
  }, 180_000);
});
