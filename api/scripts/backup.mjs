#!/usr/bin/env node
// `npm run backup [-- FILE]`: one archive (a tar file) holding the whole shop as of one moment:
//   manifest.json    when, which app version and migration level, row counts, checksums
//   database.dump    pg_dump in its custom format (restore with pg_restore, or `npm run restore`)
//   photos/<key>     every photo and thumbnail the database refers to, from the bucket or folder
// Consistency: one read-only REPEATABLE READ transaction exports its snapshot; pg_dump dumps that
// snapshot (--snapshot) and the same transaction lists the photo keys and counts the rows, so the
// dump, the counts and the photo list describe the same instant while the shop keeps working.
// Photos are written to the store before their row commits, so every listed key has its bytes.
import { mkdtemp, mkdir, rename, rm, stat, writeFile } from 'node:fs/promises';
import path from 'node:path';
import pg from 'pg';
import * as tar from 'tar';
import {
  ARCHIVE_FORMAT,
  ARCHIVE_VERSION,
  Refusal,
  appVersion,
  contentTypeOfKey,
  describeDatabase,
  describeSettings,
  log,
  migrationLevel,
  photoStore,
  readSettings,
  root,
  runCommand,
  runPgProgram,
  sha256File,
  tableCounts,
} from './backup-common.mjs';

const stamp = (date) =>
  date
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d+Z$/, 'Z');

async function main() {
  const settings = readSettings();
  const createdAt = new Date();
  const target = path.resolve(process.argv[2] ?? path.join(root, '.data', 'backups', `loomwright-${stamp(createdAt)}.tar`));
  if (!target.endsWith('.tar'))
    throw new Refusal(`The archive is a tar file: give it a name ending in .tar (not ${path.basename(target)}).`);
  if (await stat(target).catch(() => null)) throw new Refusal(`${target} already exists: give another name, or move it away first.`);
  await mkdir(path.dirname(target), { recursive: true });
  log(`Backing up ${describeSettings(settings)}`);

  const work = await mkdtemp(path.join(path.dirname(target), '.backup-'));
  const client = new pg.Client({ connectionString: settings.databaseUrl });
  try {
    try {
      await client.connect();
    } catch (error) {
      throw new Refusal(
        `Cannot reach the database at ${describeDatabase(settings.databaseUrl)}: ${error.message}. Is the stack running (npm start)?`,
      );
    }
    await client.query('begin isolation level repeatable read read only');
    const snapshot = (await client.query('select pg_export_snapshot() as id')).rows[0].id;
    const dumpFile = path.join(work, 'database.dump');
    // pg_dump joins the exported snapshot while this transaction stays open.
    const dumped = runPgProgram('pg_dump', [
      '--format=custom',
      `--snapshot=${snapshot}`,
      `--file=${dumpFile}`,
      `--dbname=${settings.databaseUrl}`,
    ]);
    const level = await migrationLevel(client);
    if (level === null)
      throw new Refusal(`The database at ${describeDatabase(settings.databaseUrl)} has no Loomwright tables yet: nothing to back up.`);
    const counts = await tableCounts(client);
    const photoRows = (await client.query('select storage_key, thumbnail_key, content_type from photos order by storage_key')).rows;
    await dumped;
    await client.query('commit');

    const store = photoStore(settings.photos);
    const photos = [];
    const missing = [];
    let bytes = 0;
    const keys = photoRows.flatMap((r) => [
      { key: r.storage_key, contentType: r.content_type },
      ...(r.thumbnail_key ? [{ key: r.thumbnail_key, contentType: contentTypeOfKey(r.thumbnail_key) }] : []),
    ]);
    for (const { key, contentType } of keys) {
      const body = await store.get(key);
      if (body === null) {
        missing.push(key);
        continue;
      }
      const file = path.join(work, 'photos', key);
      await mkdir(path.dirname(file), { recursive: true });
      await writeFile(file, body);
      photos.push({ key, contentType, size: body.length, sha256: await sha256File(file) });
      bytes += body.length;
    }
    const manifest = {
      format: ARCHIVE_FORMAT,
      formatVersion: ARCHIVE_VERSION,
      createdAt: createdAt.toISOString(),
      appVersion: appVersion(),
      migrationLevel: level,
      database: { file: 'database.dump', format: 'pg_dump custom', sha256: await sha256File(dumpFile), size: (await stat(dumpFile)).size },
      counts,
      photos: { source: settings.photos.driver, count: photos.length, bytes, files: photos, missing },
    };
    await writeFile(path.join(work, 'manifest.json'), JSON.stringify(manifest, null, 2) + '\n');
    // Written beside the target and renamed at the end: a half-written archive never has its name.
    const partial = `${target}.partial`;
    await tar.create({ file: partial, cwd: work, portable: true }, [
      'manifest.json',
      'database.dump',
      ...(photos.length ? ['photos'] : []),
    ]);
    await rename(partial, target);

    log(`Wrote ${target} (${(await stat(target)).size} bytes)`);
    log(
      `  migration level ${level}; ${counts.bookings ?? 0} bookings, ${counts.payments ?? 0} payments, ${counts.users ?? 0} people, ${photoRows.length} photos (${photos.length} files, ${bytes} bytes)`,
    );
    if (missing.length)
      log(
        `  Warning: ${missing.length} photo file(s) the database lists were not in the store (deleted while the backup ran, or lost before): ${missing.join(', ')}`,
      );
  } finally {
    await client.end().catch(() => {});
    await rm(work, { recursive: true, force: true });
  }
}

runCommand(main);
