import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { INestApplication } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import type { NestExpressApplication } from '@nestjs/platform-express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createEmptyDatabase } from './support/test-app';

/**
 * Security headers on every kind of answer: both built apps, an API answer, an API error and the
 * Swagger page. The expected values follow the OWASP Secure Headers Project's recommendations and
 * the standards each header comes from: CSP Level 3 (W3C) for `frame-ancestors` and the source
 * lists, Fetch (WHATWG) §3.5 for `X-Content-Type-Options: nosniff`, Referrer Policy (W3C) for
 * `no-referrer`, RFC 7034 for `X-Frame-Options: DENY`. HSTS (RFC 6797) is only sent in
 * production: security-headers-production.spec.ts.
 */
const repoRoot = path.resolve(__dirname, '..', '..');

function directives(csp: string | undefined): Map<string, string[]> {
  const map = new Map<string, string[]>();
  for (const part of (csp ?? '').split(';')) {
    const [name, ...values] = part.trim().split(/\s+/);
    if (name) map.set(name, values);
  }
  return map;
}

/** `<script>` elements with a body: the inline code a CSP without 'unsafe-inline' would block. */
const inlineScripts = (html: string) =>
  [...html.matchAll(/<script\b[^>]*>([\s\S]*?)<\/script>/gi)].filter(
    ([tag, body]) => !/\bsrc=/.test(tag.split('>')[0]!) || body!.trim() !== '',
  );

describe('security headers on every answer', () => {
  let app: INestApplication;
  let database: Awaited<ReturnType<typeof createEmptyDatabase>>;
  const t = { http: () => request(app.getHttpServer()) };
  beforeAll(async () => {
    // Created as main.ts creates it (ServeStaticModule serves nothing inside Nest's testing
    // module), with the built apps served as in use: npm test builds them first.
    database = await createEmptyDatabase();
    Object.assign(process.env, {
      NODE_ENV: 'test',
      DATABASE_URL: database.url,
      SERVE_APPS: 'true',
      SEED_DEMO: 'false',
      RUN_WORKERS: 'false',
    });
    const { AppModule } = await import('../src/app.module');
    const { configureApp } = await import('../src/app.setup');
    app = await NestFactory.create<NestExpressApplication>(AppModule, { bodyParser: false, logger: ['error', 'warn'] });
    configureApp(app);
    await app.init();
  });
  afterAll(async () => {
    await app?.close();
    await database?.drop();
  });

  const pages = [
    ['the storefront', '/', 'text/html'],
    ['the backoffice', '/backoffice/', 'text/html'],
    ['a storefront route served by its index.html', '/configure', 'text/html'],
    ['the API', '/api/health', 'application/json'],
    ['an API refusal', '/api/auth/me', 'application/json'],
    ['the Swagger page', '/api/docs', 'text/html'],
  ] as const;

  it.each(pages)('%s (%s) carries the CSP, nosniff, Referrer-Policy, frame refusal and no X-Powered-By', async (_what, url, type) => {
    const res = await t.http().get(url);
    expect(res.status, `${url} answered ${res.status}; run npm run build first if an app is missing`).toBe(
      url === '/api/auth/me' ? 401 : 200,
    );
    expect(res.headers['content-type']).toContain(type);
    const csp = directives(res.headers['content-security-policy']);
    expect(csp.get('script-src')).toEqual(["'self'"]);
    expect(csp.get('default-src')).toEqual(["'self'"]);
    expect(csp.get('frame-ancestors')).toEqual(["'none'"]);
    expect(csp.get('object-src')).toEqual(["'none'"]);
    expect(csp.get('connect-src')).toEqual(["'self'"]);
    expect(res.headers['content-security-policy']).not.toMatch(/unsafe-eval/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['referrer-policy']).toBe('no-referrer');
    expect(res.headers['x-frame-options']).toBe('DENY');
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['strict-transport-security']).toBeUndefined();
  });

  it('serves pages whose scripts all come from files, so they run without unsafe-inline scripts', async () => {
    for (const url of ['/', '/configure', '/account', '/backoffice/', '/api/docs']) {
      const html = (await t.http().get(url).expect(200)).text;
      expect(html).toMatch(/<script\b[^>]*\bsrc=/);
      expect(inlineScripts(html), `${url} has an inline script`).toEqual([]);
    }
    // The check itself catches an inline script.
    expect(inlineScripts('<script type="module">import("/x.js")</script>')).toHaveLength(1);
    // And the files on disk are the ones served: `/` and `/configure` have their own page files (each
    // preloads its first screen), every other storefront page is the app's index.html.
    for (const [url, file] of [
      ['/', 'home.html'],
      ['/configure', 'configure.html'],
      ['/account', 'index.html'],
    ]) {
      const served = (await t.http().get(url).expect(200)).text;
      expect(readFileSync(path.join(repoRoot, 'storefront', 'dist', file), 'utf8'), `${url} serves ${file}`).toBe(served);
    }
  });
});
