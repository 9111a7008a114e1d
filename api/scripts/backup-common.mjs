// Shared by `npm run backup` (backup.mjs) and `npm run restore` (restore.mjs): where the database
// and the photos are, and how to reach them. Settings are the same environment variables the API
// reads (DATABASE_URL, PHOTO_STORAGE, S3_*, UPLOADS_DIR); when DATABASE_URL is not set they come
// from .data/stack.env, which `npm start` writes (as `npm run replica` reads it).
import { spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { createReadStream, existsSync, readdirSync, readFileSync } from 'node:fs';
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { CreateBucketCommand, GetObjectCommand, HeadBucketCommand, ListObjectsV2Command, PutObjectCommand } from '@aws-sdk/client-s3';

export const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const requireFromHere = createRequire(import.meta.url);

/** The archive's own name and version, written into its manifest and checked on restore. */
export const ARCHIVE_FORMAT = 'loomwright-backup';
export const ARCHIVE_VERSION = 1;

/** A refusal or failure the person running the command can act on: printed in words, exit 2. */
export class Refusal extends Error {}

export function log(line) {
  process.stdout.write(`[loomwright] ${line}\n`);
}

/** Runs `main`, printing a refusal in words (exit 2) or an unexpected failure (exit 1). */
export function runCommand(main) {
  main().then(
    () => process.exit(0),
    (error) => {
      if (error instanceof Refusal) {
        console.error(`[loomwright] ${error.message}`);
        process.exit(2);
      }
      console.error(`[loomwright] Failed: ${error?.message ?? String(error)}`);
      process.exit(1);
    },
  );
}

/** The settings the API would run with, from the environment or .data/stack.env. */
export function readSettings(env = process.env) {
  let source = 'the environment';
  let values = env;
  if (!env.DATABASE_URL) {
    const envFile = path.resolve(root, env.STACK_ENV ?? '.data/stack.env');
    if (!existsSync(envFile)) {
      throw new Refusal(
        `No database to work on: set DATABASE_URL (and PHOTO_STORAGE, S3_* or UPLOADS_DIR) as the API has them, or start the stack once with npm start so ${path.relative(root, envFile)} exists.`,
      );
    }
    const stackEnv = {};
    for (const line of readFileSync(envFile, 'utf8').split('\n')) {
      const m = line.match(/^([A-Z0-9_]+)=(.*)$/);
      if (m) stackEnv[m[1]] = JSON.parse(m[2]);
    }
    values = { ...env, ...stackEnv };
    source = path.relative(root, envFile);
  }
  const driver = values.PHOTO_STORAGE ?? 'disk';
  if (driver !== 's3' && driver !== 'disk') throw new Refusal(`PHOTO_STORAGE must be s3 or disk, not ${JSON.stringify(driver)}.`);
  apiPhotoStorage(); // the photo store (below) works through the API's build: refused now, before any work, if it is missing
  return {
    source,
    databaseUrl: values.DATABASE_URL,
    photos:
      driver === 's3'
        ? {
            driver,
            bucket: values.S3_BUCKET ?? 'loomwright-photos',
            endpoint: values.S3_ENDPOINT || undefined,
            region: values.S3_REGION ?? 'us-east-1',
            accessKeyId: values.S3_ACCESS_KEY_ID,
            secretAccessKey: values.S3_SECRET_ACCESS_KEY,
            forcePathStyle: (values.S3_FORCE_PATH_STYLE ?? 'true') === 'true',
          }
        : { driver, uploadsDir: path.resolve(root, values.UPLOADS_DIR ?? '.data/uploads') },
  };
}

/** The database URL without its password, for messages. */
export function describeDatabase(url) {
  const u = new URL(url);
  return `${u.hostname}:${u.port || 5432}${u.pathname}`;
}

export function describePhotos(photos) {
  return photos.driver === 's3'
    ? `bucket ${photos.bucket}${photos.endpoint ? ` at ${photos.endpoint}` : ''}`
    : `folder ${path.relative(root, photos.uploadsDir) || '.'}`;
}

/** Where a backup reads from or a restore writes to, for the line each prints first. */
export function describeSettings(settings) {
  return `database ${describeDatabase(settings.databaseUrl)} and photos in ${describePhotos(settings.photos)} (settings from ${settings.source})`;
}

/**
 * Runs one of PostgreSQL's client programs to its end; a failure says its exit code, `outcome`
 * (what that means for the person running the command) and what the program printed.
 */
export function runPgProgram(name, args, outcome = '') {
  return new Promise((resolve, reject) => {
    const child = spawn(pgProgram(name), args, { stdio: ['ignore', 'ignore', 'pipe'] });
    let errors = '';
    child.stderr.setEncoding('utf8').on('data', (chunk) => (errors += chunk));
    child.on('error', reject);
    child.on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`${name} ended with code ${code}${outcome}: ${errors.trim()}`))));
  });
}

/** Debian's PostgreSQL client programs (pg_dump, pg_restore), the newest installed. */
function pgProgram(name) {
  const base = '/usr/lib/postgresql';
  const versions = existsSync(base) ? readdirSync(base).filter((v) => existsSync(path.join(base, v, 'bin', name))) : [];
  versions.sort((a, b) => Number(b) - Number(a));
  if (versions.length > 0) return path.join(base, versions[0], 'bin', name);
  const onPath = spawnSync('sh', ['-c', `command -v ${name}`], { encoding: 'utf8' });
  if (onPath.status === 0 && onPath.stdout.trim()) return onPath.stdout.trim();
  throw new Refusal(`${name} is not installed: install Debian's PostgreSQL client (apt-get install postgresql-client).`);
}

export function sha256File(file) {
  return new Promise((resolve, reject) => {
    const hash = createHash('sha256');
    createReadStream(file)
      .on('data', (chunk) => hash.update(chunk))
      .on('error', reject)
      .on('end', () => resolve(hash.digest('hex')));
  });
}

/**
 * The API's own photo-storage module (api/src/bookings/photo-storage.ts) from its build, so the S3
 * client settings and the content types of stored keys are the API's, written once. `npm start`
 * builds it, as does `npm run build`.
 */
function apiPhotoStorage() {
  const built = path.join(root, 'api/dist/src/bookings/photo-storage.js');
  if (!existsSync(built))
    throw new Refusal(`The API is not built (${path.relative(root, built)} is missing): run npm run build first (npm start does it too).`);
  return requireFromHere(built);
}

/** Where photo bytes are read from and written to: the bucket through the S3 SDK, or a folder. */
export function photoStore(photos) {
  if (photos.driver === 'disk') {
    const fileOf = (key) => {
      const file = path.resolve(photos.uploadsDir, key);
      if (!file.startsWith(path.resolve(photos.uploadsDir) + path.sep)) throw new Error(`refusing photo key ${JSON.stringify(key)}`);
      return file;
    };
    return {
      async get(key) {
        try {
          return await readFile(fileOf(key));
        } catch (error) {
          if (error.code === 'ENOENT') return null;
          throw error;
        }
      },
      async put(key, bytes) {
        const file = fileOf(key);
        await mkdir(path.dirname(file), { recursive: true });
        await writeFile(file, bytes);
      },
      async isEmpty() {
        if (!existsSync(photos.uploadsDir)) return true;
        return readdirSync(photos.uploadsDir).length === 0;
      },
      async prepare() {
        await mkdir(photos.uploadsDir, { recursive: true });
      },
    };
  }
  const client = apiPhotoStorage().s3ClientFor(photos);
  return {
    async get(key) {
      try {
        const answer = await client.send(new GetObjectCommand({ Bucket: photos.bucket, Key: key }));
        return Buffer.from(await answer.Body.transformToByteArray());
      } catch (error) {
        if (error.name === 'NoSuchKey' || error.$metadata?.httpStatusCode === 404) return null;
        throw error;
      }
    },
    async put(key, bytes, contentType) {
      await client.send(
        new PutObjectCommand({ Bucket: photos.bucket, Key: key, Body: bytes, ContentType: contentType, ContentLength: bytes.length }),
      );
    },
    async isEmpty() {
      try {
        const listed = await client.send(new ListObjectsV2Command({ Bucket: photos.bucket }));
        // (No MaxKeys: s3rver answers a truncated listing with an internal error.)
        return (listed.Contents?.length ?? 0) === 0;
      } catch (error) {
        if (error.name === 'NoSuchBucket' || error.$metadata?.httpStatusCode === 404) return true;
        throw error;
      }
    },
    async prepare() {
      try {
        await client.send(new HeadBucketCommand({ Bucket: photos.bucket }));
      } catch (error) {
        if (error.name === 'NotFound' || error.$metadata?.httpStatusCode === 404)
          await client.send(new CreateBucketCommand({ Bucket: photos.bucket }));
        else throw error;
      }
    },
  };
}

/** The tables of the application's own schema, with exact row counts, as one transaction sees them. */
export async function tableCounts(client) {
  const tables = await client.query(
    `select c.relname as name from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where n.nspname = 'public' and c.relkind in ('r', 'p') order by c.relname`,
  );
  const counts = {};
  for (const { name } of tables.rows) {
    const r = await client.query(`select count(*)::int as n from public."${name.replaceAll('"', '""')}"`);
    counts[name] = r.rows[0].n;
  }
  return counts;
}

/** The last migration the database has run (Kysely's migration table), or null. */
export async function migrationLevel(client) {
  const exists = await client.query(`select to_regclass('public.kysely_migration') is not null as present`);
  if (!exists.rows[0].present) return null;
  const r = await client.query('select name from kysely_migration order by name desc limit 1');
  return r.rows[0]?.name ?? null;
}

export const appVersion = () => JSON.parse(readFileSync(path.join(root, 'package.json'), 'utf8')).version;

/** The content type a stored key's extension stands for, as the API's photo storage names them. */
export const contentTypeOfKey = (key) => apiPhotoStorage().contentTypeOfKey(key);
