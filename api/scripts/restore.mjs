#!/usr/bin/env node
// `npm run restore -- FILE [--force]`: brings the database and the photos back from an archive
// that `npm run backup` wrote, into the database and photo store the settings name (the same
// environment variables the API reads, or .data/stack.env). Stop the API first.
//   - Checks the archive before touching anything: its manifest, and the checksum of every file.
//   - Creates the database if it does not exist; refuses, in words, to write over a database that
//     already has tables, or a bucket/folder that already holds files, unless --force is given
//     (then the database's schemas are dropped first and the photos are written over).
//   - Photos go in first, then the database in one transaction (pg_restore --single-transaction):
//     the database never lists a photo whose bytes are not there, and a failed restore leaves no
//     half-filled database behind.
//   - Afterwards every table's row count is compared with the counts the backup recorded.
import { existsSync } from 'node:fs';
import { mkdtemp, readFile, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import pg from 'pg';
import * as tar from 'tar';
import {
  ARCHIVE_FORMAT,
  ARCHIVE_VERSION,
  Refusal,
  describeDatabase,
  describePhotos,
  describeSettings,
  log,
  migrationLevel,
  photoStore,
  readSettings,
  runCommand,
  runPgProgram,
  sha256File,
  tableCounts,
} from './backup-common.mjs';

/** Connects to the target database, creating it (on the same server) when it does not exist yet. */
async function connectOrCreate(databaseUrl) {
  const client = new pg.Client({ connectionString: databaseUrl });
  try {
    await client.connect();
    return { client, created: false };
  } catch (error) {
    if (error.code !== '3D000') throw new Refusal(`Cannot reach the database at ${describeDatabase(databaseUrl)}: ${error.message}.`);
  }
  const name = decodeURIComponent(new URL(databaseUrl).pathname.slice(1));
  const adminUrl = new URL(databaseUrl);
  adminUrl.pathname = '/postgres';
  const admin = new pg.Client({ connectionString: adminUrl.toString() });
  await admin.connect();
  try {
    await admin.query(`create database "${name.replaceAll('"', '""')}"`);
  } finally {
    await admin.end();
  }
  const fresh = new pg.Client({ connectionString: databaseUrl });
  await fresh.connect();
  return { client: fresh, created: true };
}

/** Schemas that hold anything of ours (public, the job queue's, …): everything but PostgreSQL's own. */
async function userSchemas(client) {
  const r = await client.query(
    `select n.nspname as name, count(c.oid)::int as relations from pg_namespace n left join pg_class c on c.relnamespace = n.oid
      where n.nspname not in ('information_schema') and n.nspname not like 'pg\\_%'
      group by n.nspname order by n.nspname`,
  );
  return r.rows;
}

async function main() {
  const args = process.argv.slice(2);
  // `npm run restore FILE --force` hands --force to npm, which passes it on as npm_config_force.
  const force = args.includes('--force') || process.env.npm_config_force === 'true';
  const unknown = args.filter((a) => a.startsWith('-') && a !== '--force');
  if (unknown.length) throw new Refusal(`Unknown option ${unknown.join(' ')}: the only option is --force.`);
  const files = args.filter((a) => !a.startsWith('-'));
  if (files.length !== 1) throw new Refusal('Say which archive to restore: npm run restore -- .data/backups/loomwright-….tar [--force]');
  const archive = path.resolve(files[0]);
  if (!existsSync(archive)) throw new Refusal(`There is no archive at ${archive}.`);

  const settings = readSettings();
  const work = await mkdtemp(path.join(tmpdir(), 'loomwright-restore-'));
  let client;
  try {
    try {
      await tar.extract({ file: archive, cwd: work, strict: true });
    } catch (error) {
      throw new Refusal(`${path.basename(archive)} is not a readable tar archive (${error.message}).`);
    }
    const manifestFile = path.join(work, 'manifest.json');
    if (!existsSync(manifestFile))
      throw new Refusal(`${path.basename(archive)} has no manifest.json: it was not written by npm run backup.`);
    const manifest = JSON.parse(await readFile(manifestFile, 'utf8'));
    if (manifest.format !== ARCHIVE_FORMAT) throw new Refusal(`${path.basename(archive)} is not a Loomwright backup.`);
    if (manifest.formatVersion > ARCHIVE_VERSION) {
      throw new Refusal(
        `${path.basename(archive)} was written by a newer Loomwright (archive format ${manifest.formatVersion}); update this copy first.`,
      );
    }
    const dumpFile = path.join(work, manifest.database.file);
    if (!existsSync(dumpFile) || (await sha256File(dumpFile)) !== manifest.database.sha256) {
      throw new Refusal(
        `The database dump in ${path.basename(archive)} is missing or damaged (its checksum does not match the manifest); nothing was restored.`,
      );
    }
    for (const photo of manifest.photos.files) {
      const file = path.join(work, 'photos', photo.key);
      if (!existsSync(file) || (await sha256File(file)) !== photo.sha256) {
        throw new Refusal(`Photo ${photo.key} in ${path.basename(archive)} is missing or damaged; nothing was restored.`);
      }
    }
    log(`Archive from ${manifest.createdAt} (app ${manifest.appVersion}, migration level ${manifest.migrationLevel}) checks out.`);
    log(`Restoring into ${describeSettings(settings)}`);

    const connected = await connectOrCreate(settings.databaseUrl);
    client = connected.client;
    if (connected.created) log(`Created database ${describeDatabase(settings.databaseUrl)}`);
    const store = photoStore(settings.photos);
    const schemas = await userSchemas(client);
    const filled = schemas.filter((s) => s.relations > 0);
    const photosThere = !(await store.isEmpty());
    if (!force && (filled.length > 0 || photosThere)) {
      const what = [
        ...(filled.length
          ? [
              `the database ${describeDatabase(settings.databaseUrl)} already has tables (in ${filled.map((s) => s.name).join(', ')}; migration level ${(await migrationLevel(client)) ?? 'none'})`,
            ]
          : []),
        ...(photosThere ? [`the photo store (${describePhotos(settings.photos)}) already holds files`] : []),
      ];
      throw new Refusal(
        `Refusing to restore: ${what.join(' and ')}. A restore replaces everything in them. Restore into an empty database and bucket, or run again with --force (npm run restore -- FILE --force) to drop what is there.`,
      );
    }
    if (force && filled.length > 0) {
      for (const schema of schemas) await client.query(`drop schema "${schema.name.replaceAll('"', '""')}" cascade`);
      await client.query('create schema public');
      log(`--force: dropped what the database held (schemas ${schemas.map((s) => s.name).join(', ')})`);
    }

    await store.prepare();
    for (const photo of manifest.photos.files) {
      await store.put(photo.key, await readFile(path.join(work, 'photos', photo.key)), photo.contentType);
    }
    log(`Photos: ${manifest.photos.files.length} files (${manifest.photos.bytes} bytes) written`);

    await runPgProgram(
      'pg_restore',
      ['--no-owner', '--no-privileges', '--single-transaction', '--exit-on-error', `--dbname=${settings.databaseUrl}`, dumpFile],
      ' and restored nothing',
    );
    const counts = await tableCounts(client);
    const differ = Object.keys({ ...manifest.counts, ...counts }).filter((t) => manifest.counts[t] !== counts[t]);
    if (differ.length) {
      throw new Error(
        `The restored row counts differ from the backup's in ${differ.map((t) => `${t} (${counts[t] ?? 'none'} here, ${manifest.counts[t] ?? 'none'} in the backup)`).join(', ')}.`,
      );
    }
    log(
      `Database: restored at migration level ${await migrationLevel(client)}; every table's row count equals the backup's (${counts.bookings ?? 0} bookings, ${counts.payments ?? 0} payments, ${counts.photos ?? 0} photos).`,
    );
    if (manifest.photos.missing?.length)
      log(`Note: the backup recorded ${manifest.photos.missing.length} photo file(s) already missing when it was taken.`);
    log('Done. Start the API on this database and store (npm start, or the API with these settings); it runs any newer migrations itself.');
  } finally {
    await client?.end().catch(() => {});
    await rm(work, { recursive: true, force: true });
  }
}

runCommand(main);
