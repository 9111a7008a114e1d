#!/usr/bin/env node
// Brings up everything the product needs on one machine: PostgreSQL, the payment and mail fakes,
// the local S3-compatible object store for photos, and the API (which serves both built apps).
// The API's settings are written to .data/stack-<port>.env and .data/stack.env, so `npm run replica`
// can start more API processes against the same database, bucket and fakes. Ctrl-C (or SIGTERM) stops all of it, database included.
// Every port and name can be moved by environment variables (see README.md).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';
import { apiNodeFlags } from './api-node-flags.mjs';

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, '..', '..');
const env = process.env;
const settings = {
  port: Number(env.PORT ?? 3000),
  pgPort: Number(env.PG_PORT ?? 54329),
  pgData: path.resolve(root, env.PG_DATA ?? '.data/postgres'),
  dbName: env.DB_NAME ?? 'loomwright',
  paymentPort: Number(env.PAYMENT_FAKE_PORT ?? 4242),
  smtpPort: Number(env.MAIL_FAKE_SMTP_PORT ?? 2525),
  mailHttpPort: Number(env.MAIL_FAKE_HTTP_PORT ?? 8025),
  objectStorePort: Number(env.OBJECT_STORE_PORT ?? 4569),
  objectStoreDir: path.resolve(root, env.OBJECT_STORE_DIR ?? '.data/object-store'),
  bucket: env.S3_BUCKET ?? 'loomwright-photos',
  freshDatabase: env.FRESH_DATABASE === 'true',
  quiet: env.STACK_QUIET === 'true',
};

const children = [];
let stopping = false;
let ownsPostgres = false;

function log(line) {
  process.stdout.write(`[loomwright] ${line}\n`);
}

function postgres(...args) {
  const result = spawnSync('bash', [path.join(here, 'postgres.sh'), ...args], { stdio: 'inherit' });
  if (result.status !== 0) throw new Error(`postgres.sh ${args[0]} failed`);
}

async function ensureDatabase() {
  const admin = new pg.Client({ host: '127.0.0.1', port: settings.pgPort, user: 'postgres', database: 'postgres' });
  await admin.connect();
  try {
    if (settings.freshDatabase) await admin.query(`drop database if exists "${settings.dbName}" with (force)`);
    const found = await admin.query('select 1 from pg_database where datname = $1', [settings.dbName]);
    if (found.rowCount === 0) await admin.query(`create database "${settings.dbName}"`);
  } finally {
    await admin.end();
  }
}

function run(name, script, extraEnv, nodeFlags = []) {
  const file = path.join(root, script);
  if (!existsSync(file)) {
    log(`${name}: ${script} is not built; skipping`);
    return;
  }
  const child = spawn(process.execPath, [...nodeFlags, file], {
    cwd: root,
    env: { ...env, ...extraEnv },
    stdio: settings.quiet ? ['ignore', 'ignore', 'inherit'] : 'inherit',
  });
  child.on('exit', (code, signal) => {
    if (!stopping) {
      log(`${name} stopped (${signal ?? code}); stopping everything`);
      void shutdown(1);
    }
  });
  children.push(child);
}

async function waitForHealth(url, timeoutMs = 90_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    try {
      const response = await fetch(url);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`The API did not become healthy at ${url} within ${timeoutMs / 1000} s`);
}

async function shutdown(code = 0) {
  if (stopping) return;
  stopping = true;
  log('Stopping…');
  await Promise.all(
    children.map(
      (child) =>
        new Promise((resolve) => {
          if (child.exitCode !== null || child.signalCode !== null) return resolve();
          child.once('exit', resolve);
          child.kill('SIGTERM');
          setTimeout(() => child.kill('SIGKILL'), 5_000).unref();
        }),
    ),
  );
  if (ownsPostgres) {
    try {
      postgres('stop', settings.pgData);
      log('PostgreSQL stopped');
    } catch {
      // already down
    }
  }
  process.exit(code);
}

process.on('SIGINT', () => void shutdown(0));
process.on('SIGTERM', () => void shutdown(0));

async function main() {
  mkdirSync(settings.pgData, { recursive: true });
  postgres('ensure-installed');
  // A cluster that was already running (the test command's, say) is left running on the way out.
  ownsPostgres = spawnSync('bash', [path.join(here, 'postgres.sh'), 'status', settings.pgData], { stdio: 'ignore' }).status !== 0;
  postgres('start', settings.pgData, String(settings.pgPort));
  await ensureDatabase();

  const publicUrl = env.PUBLIC_URL ?? `http://localhost:${settings.port}`;
  const shared = {
    DATABASE_URL: `postgres://postgres@127.0.0.1:${settings.pgPort}/${settings.dbName}`,
    STRIPE_API_HOST: '127.0.0.1',
    STRIPE_API_PORT: String(settings.paymentPort),
    STRIPE_API_PROTOCOL: 'http',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(settings.smtpPort),
    PUBLIC_URL: publicUrl,
    // Photos in the local S3-compatible store (s3rver's own fixed keys), as in a deployment.
    PHOTO_STORAGE: 's3',
    S3_BUCKET: settings.bucket,
    S3_ENDPOINT: `http://127.0.0.1:${settings.objectStorePort}`,
    S3_REGION: 'us-east-1',
    S3_ACCESS_KEY_ID: 'S3RVER',
    S3_SECRET_ACCESS_KEY: 'S3RVER',
    S3_FORCE_PATH_STYLE: 'true',
  };
  // A browser-test run (fresh database) starts with an empty bucket too.
  const objectStoreDir = settings.freshDatabase ? `${settings.objectStoreDir}-${settings.dbName}` : settings.objectStoreDir;
  if (settings.freshDatabase) rmSync(objectStoreDir, { recursive: true, force: true });
  run('object store', 'api/dist/fakes/object-store/main.js', {
    OBJECT_STORE_PORT: String(settings.objectStorePort),
    OBJECT_STORE_DIR: objectStoreDir,
    S3_BUCKET: settings.bucket,
  });
  run('payment fake', 'api/dist/fakes/payment/main.js', {
    ...shared,
    PAYMENT_FAKE_PORT: String(settings.paymentPort),
    PAYMENT_FAKE_WEBHOOK_URL: `http://127.0.0.1:${settings.port}/api/payments/webhook`,
    // Kept beside the database it belongs to, so a restart forgets no checkout; a fresh database
    // (the browser tests) starts a fresh fake too.
    PAYMENT_FAKE_STATE_FILE: settings.freshDatabase ? '' : path.join(settings.pgData, '..', `payment-fake-${settings.dbName}.json`),
  });
  run('mail fake', 'api/dist/fakes/mail/main.js', {
    MAIL_FAKE_SMTP_PORT: String(settings.smtpPort),
    MAIL_FAKE_HTTP_PORT: String(settings.mailHttpPort),
  });
  // What a replica needs to join: every setting this API gets from the stack, plus the
  // environment's own secrets and options (JWT_SECRET, NODE_ENV, …) as they are now.
  const passOn = Object.fromEntries(
    Object.entries(env).filter(([k]) =>
      /^(NODE_ENV|JWT_SECRET|SESSION_MINUTES|STRIPE_|SMTP_|MAIL_|AUTH_|PAYMENT_METHOD_TYPES|ALLOWED_ORIGINS|TRUST_PROXY|LOG_LEVEL|SEED_DEMO|DATABASE_POOL_MAX|METRICS_TOKEN)/.test(
        k,
      ),
    ),
  );
  const stackEnv = { ...passOn, ...shared, SERVE_APPS: env.SERVE_APPS ?? 'true' };
  const envFile =
    Object.entries(stackEnv)
      .map(([k, v]) => `${k}=${JSON.stringify(String(v))}`)
      .join('\n') + '\n';
  mkdirSync(path.join(root, '.data'), { recursive: true });
  writeFileSync(path.join(root, '.data', `stack-${settings.port}.env`), envFile, { mode: 0o600 });
  writeFileSync(path.join(root, '.data', 'stack.env'), envFile, { mode: 0o600 });
  run('API', 'api/dist/src/main.js', { ...shared, PORT: String(settings.port) }, apiNodeFlags);
  await waitForHealth(`http://127.0.0.1:${settings.port}/api/health`);

  log('');
  log(`Storefront   ${publicUrl}/`);
  log(`Backoffice   ${publicUrl}/backoffice/`);
  log(`API          ${publicUrl}/api  (docs at ${publicUrl}/api/docs)`);
  log(`Payment fake http://127.0.0.1:${settings.paymentPort}`);
  log(`Mail fake    http://127.0.0.1:${settings.mailHttpPort}  (SMTP 127.0.0.1:${settings.smtpPort})`);
  log(`PostgreSQL   127.0.0.1:${settings.pgPort}  database ${settings.dbName}`);
  log(
    `Object store http://127.0.0.1:${settings.objectStorePort}  bucket ${settings.bucket} (data in ${path.relative(root, objectStoreDir)})`,
  );
  log(`More API processes on this stack: PORT=<port> npm run replica`);
  log('');
  log('Demo sign-ins (password demo-pass-2026 for all):');
  log('  owner@shop.example    the owner (backoffice, everything)');
  log('  builder@shop.example  a master-level builder (backoffice)');
  log('  junior@shop.example   an apprentice-level builder (backoffice)');
  log('  player@mail.example   a player (storefront)');
  log('');
  log('READY — press Ctrl-C to stop everything.');
}

main().catch((error) => {
  console.error(`[loomwright] ${error.message}`);
  void shutdown(1);
});
