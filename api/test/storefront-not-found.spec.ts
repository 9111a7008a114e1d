import { mkdtempSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import path from 'node:path';
import compression from 'compression';
import express from 'express';
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { storefrontPaths } from '@loomwright/shared';
import { storefrontNotFound } from '../src/storefront/storefront-not-found';
import { precompressedAssets, storefrontPageFiles } from '../src/storefront/storefront-pages';

// RFC 9110 §15.5.5: 404 says the server has no current representation for the target. A single-page
// app that answers 200 to every address makes each typo a "soft 404" to browsers and crawlers.
describe('real 404s in front of the storefront build', () => {
  const dist = mkdtempSync(path.join(tmpdir(), 'lw-dist-'));
  mkdirSync(path.join(dist, 'assets'));
  writeFileSync(path.join(dist, 'index.html'), '<!doctype html><div id="root"></div>');
  writeFileSync(path.join(dist, 'robots.txt'), 'User-agent: *\nAllow: /\n');
  writeFileSync(path.join(dist, 'assets', 'index-abc.js'), 'console.log(1)');
  const app = express();
  app.use(storefrontNotFound(dist));
  // Stands in for the static server and its index.html fallback.
  app.use(express.static(dist));
  app.get('/{*path}', (_req, res) => res.status(200).type('html').send('fallback'));
  afterAll(() => rmSync(dist, { recursive: true, force: true }));

  it('lets every page of the router, every built file, the API and the backoffice through', async () => {
    for (const p of storefrontPaths) await request(app).get(p.replace(':id', '4f1c2d7e-0000-4000-8000-000000000000')).expect(200);
    await request(app).get('/configure?step=pedals').expect(200);
    await request(app).get('/robots.txt').expect(200);
    await request(app).get('/assets/index-abc.js').expect(200);
    await request(app).get('/api/anything').expect(200);
    await request(app).get('/backoffice/bench').expect(200);
  });

  it('answers an unknown page with 404 and the app (which shows its own not-found page)', async () => {
    const res = await request(app).get('/configurator').set('Accept', 'text/html').expect(404);
    expect(res.text).toContain('<div id="root">');
    await request(app).get('/builds/1/2').set('Accept', 'text/html').expect(404);
  });

  it('answers a missing file with 404 in words, never the app', async () => {
    const res = await request(app).get('/assets/index-gone.js').expect(404);
    expect(res.text).toBe('There is nothing at /assets/index-gone.js.');
    await request(app).get('/wp-login.php').expect(404);
    await request(app).get('/..%2f..%2fetc%2fpasswd').expect(404);
  });
});

// The storefront's build writes home.html and configure.html beside index.html (the same page,
// preloading that screen's code and data); the static server must answer `/` and `/configure` with
// them, and every other page with the index.html fallback.
describe('pages with their own copy of index.html', () => {
  const dist = mkdtempSync(path.join(tmpdir(), 'lw-dist-'));
  writeFileSync(path.join(dist, 'index.html'), 'index');
  writeFileSync(path.join(dist, 'home.html'), 'home');
  writeFileSync(path.join(dist, 'configure.html'), 'configure');
  const app = express();
  app.use(storefrontNotFound(dist));
  app.use(express.static(dist, storefrontPageFiles));
  app.get('/{*path}', (_req, res) => res.status(200).type('html').send('index'));
  afterAll(() => rmSync(dist, { recursive: true, force: true }));

  it('answers / with home.html and /configure (with or without a query) with configure.html', async () => {
    expect((await request(app).get('/').expect(200)).text).toBe('home');
    expect((await request(app).get('/configure').expect(200)).text).toBe('configure');
    expect((await request(app).get('/configure?step=pedals&c=e30').expect(200)).text).toBe('configure');
  });

  it('answers the other pages with index.html, and no page is made up from a file name', async () => {
    expect((await request(app).get('/sign-in').expect(200)).text).toBe('index');
    expect((await request(app).get('/builds/4f1c2d7e-0000-4000-8000-000000000000').expect(200)).text).toBe('index');
    await request(app).get('/home').set('Accept', 'text/html').expect(404);
    await request(app).get('/index').set('Accept', 'text/html').expect(404);
  });
});

// RFC 9110 §8.4 (Content-Encoding) and §12.5.5 (Vary): a precompressed copy is sent only to a client
// whose Accept-Encoding names its coding, labelled with it; anyone else gets the plain file.
describe('precompressed scripts', () => {
  const assets = mkdtempSync(path.join(tmpdir(), 'lw-assets-'));
  const plain = 'export const greeting = "hello from the bench";\n'.repeat(40);
  writeFileSync(path.join(assets, 'index-abc.js'), plain);
  writeFileSync(path.join(assets, 'index-abc.js.br'), brotliCompressSync(plain));
  writeFileSync(path.join(assets, 'index-abc.js.gz'), gzipSync(plain, { level: 9 }));
  writeFileSync(path.join(assets, 'tiny-abc.js'), 'export {};\n');
  const app = express();
  app.use(compression());
  app.use(
    '/assets',
    precompressedAssets(assets, (res) => res.setHeader('Cache-Control', 'public, max-age=31536000, immutable')),
  );
  afterAll(() => rmSync(assets, { recursive: true, force: true }));
  // supertest buffers text only; a compressed body is collected as it arrives.
  const binary: Parameters<request.Test['parse']>[0] = (res, done: (error: Error | null, body: Buffer) => void) => {
    const stream = res as unknown as NodeJS.ReadableStream;
    const parts: Buffer[] = [];
    stream.on('data', (part: Buffer) => parts.push(part));
    stream.on('end', () => done(null, Buffer.concat(parts)));
  };

  it('sends the brotli copy to a browser that accepts br, byte for byte, with its type and Vary', async () => {
    const res = await request(app)
      .get('/assets/index-abc.js')
      .set('Accept-Encoding', 'gzip, deflate, br, zstd')
      .buffer(true)
      .parse(binary)
      .expect(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/javascript/);
    expect(res.headers.vary).toMatch(/Accept-Encoding/i);
    expect(res.headers['cache-control']).toContain('immutable');
    // The bytes on the wire are the build's .br file (supertest decodes the body it hands back).
    expect(Number(res.headers['content-length'])).toBe(brotliCompressSync(plain).length);
    expect((res.body as Buffer).toString()).toBe(plain);
  });

  it('sends the gzip copy when only gzip is accepted, and the plain file when nothing is', async () => {
    const gz = await request(app).get('/assets/index-abc.js').set('Accept-Encoding', 'gzip').buffer(true).parse(binary).expect(200);
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(Number(gz.headers['content-length'])).toBe(gzipSync(plain, { level: 9 }).length);
    expect((gz.body as Buffer).toString()).toBe(plain);
    const none = await request(app).get('/assets/index-abc.js').set('Accept-Encoding', 'identity').buffer(true).parse(binary).expect(200);
    expect(none.headers['content-encoding']).toBeUndefined();
    expect((none.body as Buffer).toString()).toBe(plain);
  });

  it('serves a file without copies as it is, and a missing file falls through', async () => {
    const res = await request(app).get('/assets/tiny-abc.js').set('Accept-Encoding', 'br').expect(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    await request(app).get('/assets/gone-abc.js').set('Accept-Encoding', 'br').expect(404);
  });
});
