import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import { mkdir, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Client } from 'pg';
import sharp from 'sharp';
import * as tar from 'tar';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startObjectStore, type ObjectStore } from '../fakes/object-store/object-store';
import { startApiProcess, Visitor, type ApiProcess } from './support/api-process';
import { createEmptyDatabase } from './support/test-app';
import { countedBoard } from '../../shared/src/estimate/reference-rigs.fixture';
import { objectStoreEnv } from './support/fakes-env';

const repoRoot = path.resolve(__dirname, '../..');
const board = countedBoard(4);

/** Runs `npm run backup` / `npm run restore` the way a person does (node on the script, no npm wrapper). */
function runScript(script: string, args: string[], env: Record<string, string>): Promise<{ code: number | null; out: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [path.join(repoRoot, 'api/scripts', script), ...args], {
      cwd: repoRoot,
      env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '', ...env },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let out = '';
    child.stdout.setEncoding('utf8').on('data', (c: string) => (out += c));
    child.stderr.setEncoding('utf8').on('data', (c: string) => (out += c));
    child.on('error', reject);
    child.on('exit', (code) => resolve({ code, out }));
  });
}

function storeEnv(databaseUrl: string, store: ObjectStore): Record<string, string> {
  return { DATABASE_URL: databaseUrl, ...objectStoreEnv(store) };
}

/** The built API on one database and bucket: no workers, warnings only, no sign-in limit in the checks' way. */
function startApiOn(databaseUrl: string, store: ObjectStore, settings: Record<string, string>): Promise<ApiProcess> {
  return startApiProcess({
    ...storeEnv(databaseUrl, store),
    RUN_WORKERS: 'false',
    LOG_LEVEL: 'warn',
    AUTH_THROTTLE_LIMIT: '1000',
    ...settings,
  });
}

/** Row counts of every table in the application's schema, read straight from PostgreSQL. */
async function tableCounts(url: string): Promise<Record<string, number>> {
  const client = new Client({ connectionString: url });
  await client.connect();
  try {
    const tables = await client.query<{ name: string }>(
      `select tablename as name from pg_tables where schemaname = 'public' order by tablename`,
    );
    const counts: Record<string, number> = {};
    for (const { name } of tables.rows)
      counts[name] = (await client.query<{ n: number }>(`select count(*)::int as n from public."${name}"`)).rows[0]!.n;
    return counts;
  } finally {
    await client.end();
  }
}

async function signIn(api: ApiProcess, email: string): Promise<Visitor> {
  const visitor = new Visitor(api.url);
  const answer = await visitor.call('POST', '/api/auth/sign-in', { email, password: 'demo-pass-2026' });
  expect(answer.status, answer.text).toBe(200);
  return visitor;
}

async function getBytes(visitor: Visitor, route: string): Promise<{ status: number; type: string | null; bytes: Buffer }> {
  const response = await fetch(`${visitor.base}${route}`, {
    headers: { cookie: visitor.cookieHeader() },
  });
  return { status: response.status, type: response.headers.get('content-type'), bytes: Buffer.from(await response.arrayBuffer()) };
}

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

/**
 * Backup and restore of the whole shop: the invented demo shop plus uploaded photos, in a bucket
 * of the local S3-compatible store, archived by `npm run backup` (pg_dump custom format + photos +
 * manifest in one tar), restored by `npm run restore` into an EMPTY second database and a NEW
 * bucket on another store; then a fresh API process on the restored pair serves the same
 * bookings, payments and photo bytes. The archive is also read with the `tar` package directly,
 * and the dump with Debian's pg_restore --list (PostgreSQL documentation, "pg_restore": the
 * custom format's table of contents), so the format is checked by tools outside our scripts.
 */
describe('npm run backup / npm run restore', () => {
  let work: string;
  let sourceStore: ObjectStore;
  let targetStore: ObjectStore;
  let source: Awaited<ReturnType<typeof createEmptyDatabase>>;
  let target: Awaited<ReturnType<typeof createEmptyDatabase>>;
  let sourceApi: ApiProcess;
  let targetApi: ApiProcess | undefined;
  const uploaded: { bookingId: string; url: string; thumbnailUrl: string; bytes: Buffer }[] = [];

  beforeAll(async () => {
    work = await mkdtemp(path.join(tmpdir(), 'lw-backup-'));
    sourceStore = await startObjectStore({ port: 0, directory: path.join(work, 'store-a'), bucket: 'lw-photos-source' });
    targetStore = await startObjectStore({ port: 0, directory: path.join(work, 'store-b'), bucket: 'lw-photos-restored' });
    source = await createEmptyDatabase('lw_backup_src');
    target = await createEmptyDatabase('lw_backup_dst');
    // NODE_ENV=development: the demo seed leaves its bookings and payments out under NODE_ENV=test.
    sourceApi = await startApiOn(source.url, sourceStore, {
      NODE_ENV: 'development',
      SEED_DEMO: 'true',
      JWT_SECRET: 'backup-test-secret-0123456789abcdef',
    });

    // Two photos on a new booking by the demo player: the demo seed has bookings and payments, no photos.
    const player = await signIn(sourceApi, 'player@mail.example');
    const booking = await player.call('POST', '/api/bookings', { configuration: board });
    expect(booking.status, booking.text).toBe(201);
    for (const [i, colour] of [
      { r: 200, g: 40, b: 10 },
      { r: 10, g: 90, b: 200 },
    ].entries()) {
      const png = await sharp({ create: { width: 40 + i, height: 30, channels: 3, background: colour } })
        .png()
        .toBuffer();
      const form = new FormData();
      form.append('file', new Blob([png], { type: 'image/png' }), `board-${i}.png`);
      const response = await fetch(`${sourceApi.url}/api/bookings/${booking.body.id}/photos`, {
        method: 'POST',
        body: form,
        headers: { cookie: player.cookieHeader() },
      });
      const body = (await response.json()) as { url: string; thumbnailUrl: string };
      expect(response.status, JSON.stringify(body)).toBe(201);
      uploaded.push({ bookingId: booking.body.id, url: body.url, thumbnailUrl: body.thumbnailUrl, bytes: png });
    }
  }, 120_000);

  afterAll(async () => {
    await sourceApi?.stop();
    await targetApi?.stop();
    await sourceStore?.close();
    await targetStore?.close();
    await source?.drop();
    await target?.drop();
    await rm(work, { recursive: true, force: true });
  });

  it('archives the database and photos, restores them into an empty database and bucket, and the product serves them unchanged', async () => {
    const archive = path.join(work, 'shop.tar');
    const backup = await runScript('backup.mjs', [archive], storeEnv(source.url, sourceStore));
    expect(backup.code, backup.out).toBe(0);

    // The archive, read with the tar package itself: a manifest, the dump and four photo files.
    const entries: string[] = [];
    await tar.list({ file: archive, onReadEntry: (e) => entries.push(e.path) });
    expect(entries).toContain('manifest.json');
    expect(entries).toContain('database.dump');
    const unpacked = path.join(work, 'unpacked');
    await mkdir(unpacked);
    await tar.extract({ file: archive, cwd: unpacked });
    const manifest = JSON.parse(await readFile(path.join(unpacked, 'manifest.json'), 'utf8'));
    const counts = await tableCounts(source.url);
    expect(manifest.counts).toEqual(counts);
    expect(counts.bookings).toBeGreaterThan(1);
    expect(counts.payments).toBeGreaterThan(0);
    expect(counts.photos).toBe(2);
    expect(manifest.photos.count).toBe(4); // two photos and their two thumbnails
    expect(manifest.photos.missing).toEqual([]);
    const levelClient = new Client({ connectionString: source.url });
    await levelClient.connect();
    const level = (await levelClient.query<{ name: string }>('select name from kysely_migration order by name desc limit 1')).rows[0]!.name;
    await levelClient.end();
    expect(manifest.migrationLevel).toBe(level);
    // PostgreSQL's own pg_restore reads the dump's table of contents (custom format).
    const pgRestoreList = await new Promise<string>((resolve, reject) => {
      const bin = readdirSync('/usr/lib/postgresql')
        .map((v) => `/usr/lib/postgresql/${v}/bin/pg_restore`)
        .find((p) => existsSync(p))!;
      const child = spawn(bin, ['--list', path.join(unpacked, 'database.dump')]);
      let out = '';
      child.stdout.setEncoding('utf8').on('data', (c: string) => (out += c));
      child.on('error', reject);
      child.on('exit', (code) => (code === 0 ? resolve(out) : reject(new Error(`pg_restore --list ended ${code}`))));
    });
    expect(pgRestoreList).toMatch(/TABLE DATA public bookings/);
    expect(pgRestoreList).toMatch(/TABLE DATA public payments/);

    // Restore into the empty second database and the new bucket.
    const restore = await runScript('restore.mjs', [archive], storeEnv(target.url, targetStore));
    expect(restore.code, restore.out).toBe(0);
    expect(await tableCounts(target.url)).toEqual(counts);

    // A second restore onto the now-filled database is refused in words, and changes nothing.
    const again = await runScript('restore.mjs', [archive], storeEnv(target.url, targetStore));
    expect(again.code, again.out).toBe(2);
    expect(again.out).toMatch(/Refusing to restore: the database .* already has tables/);
    expect(again.out).toMatch(/--force/);
    // …unless told: --force drops what is there and restores the same rows again.
    const forced = await runScript('restore.mjs', [archive, '--force'], storeEnv(target.url, targetStore));
    expect(forced.code, forced.out).toBe(0);
    expect(await tableCounts(target.url)).toEqual(counts);

    // The product on the restored database and bucket (no seeding): same answers, same bytes.
    targetApi = await startApiOn(target.url, targetStore, { SEED_DEMO: 'false', JWT_SECRET: 'another-secret-for-the-restored-api-42' });
    const ownerBefore = await signIn(sourceApi, 'owner@shop.example');
    const ownerAfter = await signIn(targetApi, 'owner@shop.example');
    const sourceIds = new Client({ connectionString: source.url });
    await sourceIds.connect();
    const bookingIds = (await sourceIds.query<{ id: string }>('select id from bookings order by created_at, id')).rows.map((r) => r.id);
    await sourceIds.end();
    // Every booking's detail answer (quote, payments, photos, timeline) is the same on both.
    for (const id of bookingIds) {
      const [before, after] = await Promise.all([
        ownerBefore.call('GET', `/api/bookings/${id}`),
        ownerAfter.call('GET', `/api/bookings/${id}`),
      ]);
      expect(before.status, before.text).toBe(200);
      expect(after.status, after.text).toBe(200);
      expect(after.body).toEqual(before.body);
    }
    // Every photo and thumbnail: the same bytes from the restored bucket, the uploaded file's own for the full photo.
    const playerAfter = await signIn(targetApi, 'player@mail.example');
    for (const photo of uploaded) {
      const full = await getBytes(playerAfter, photo.url);
      expect(full.status).toBe(200);
      expect(full.type).toBe('image/png');
      const original = await getBytes(ownerBefore, photo.url);
      expect(sha256(full.bytes)).toBe(sha256(original.bytes));
      expect((await sharp(full.bytes).metadata()).width).toBe((await sharp(photo.bytes).metadata()).width);
      const thumbAfter = await getBytes(playerAfter, photo.thumbnailUrl);
      const thumbBefore = await getBytes(ownerBefore, photo.thumbnailUrl);
      expect(thumbAfter.status).toBe(200);
      expect(sha256(thumbAfter.bytes)).toBe(sha256(thumbBefore.bytes));
    }
    // The restored product still works: the player can sign in and list their builds.
    const mine = await playerAfter.call('GET', '/api/bookings');
    expect(mine.status, mine.text).toBe(200);
  }, 180_000);

  it('refuses in words: no archive named, a file that is not an archive, an archive with a damaged dump', async () => {
    const env = storeEnv(target.url, targetStore);
    const none = await runScript('restore.mjs', [], env);
    expect(none.code).toBe(2);
    expect(none.out).toMatch(/Say which archive to restore/);

    const notTar = path.join(work, 'notes.tar');
    await writeFile(notTar, 'these are not the droids');
    const bad = await runScript('restore.mjs', [notTar, '--force'], env);
    expect(bad.code).toBe(2);
    expect(bad.out).toMatch(/not a readable tar archive|has no manifest/);

    // A dump whose bytes changed after the backup: the checksum check stops before anything is touched.
    const dir = path.join(work, 'damaged');
    await mkdir(dir);
    await tar.extract({ file: path.join(work, 'shop.tar'), cwd: dir });
    const dump = path.join(dir, 'database.dump');
    const bytes = await readFile(dump);
    bytes[bytes.length - 10] ^= 0xff;
    await writeFile(dump, bytes);
    const damaged = path.join(work, 'damaged.tar');
    await tar.create({ file: damaged, cwd: dir }, ['manifest.json', 'database.dump', 'photos']);
    const before = await tableCounts(target.url);
    const refused = await runScript('restore.mjs', [damaged, '--force'], env);
    expect(refused.code).toBe(2);
    expect(refused.out).toMatch(/damaged/);
    expect(await tableCounts(target.url)).toEqual(before);
  }, 60_000);
});
