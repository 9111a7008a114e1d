#!/usr/bin/env node
// Benchmark of the CSV exports: fills a database of its own with ROWS bookings (each with an
// estimate, a paid deposit and an hour entry), starts the built API against it, downloads
// bookings.csv, payments.csv and hours.csv and prints rows, bytes, time to the first byte, the
// whole time, and the API process's resident memory before and at its peak during each download
// (read from /proc/<pid>/status). Prints its numbers; asserts nothing.
//
// Needs `npm run build -w shared -w api` and a PostgreSQL cluster on PG_PORT (default 54329; the
// one `npm start` runs, or api/scripts/postgres.sh start DIR PORT).
//   PG_PORT=55180 ROWS=100000 node api/bench/export-bench.mjs
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import pg from 'pg';

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, '..', '..');
const pgPort = Number(process.env.PG_PORT ?? 54329);
const apiPort = Number(process.env.BENCH_API_PORT ?? 3389);
const rows = Number(process.env.ROWS ?? 100_000);
const dbName = `lw_bench_exports_${process.pid}`;
const adminUrl = `postgres://postgres@127.0.0.1:${pgPort}/postgres`;
const dbUrl = `postgres://postgres@127.0.0.1:${pgPort}/${dbName}`;

const rssKiB = (pid) => Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0);
const mib = (kib) => (kib / 1024).toFixed(1);

async function admin(sqlText) {
  const c = new pg.Client({ connectionString: adminUrl });
  await c.connect();
  try {
    await c.query(sqlText);
  } finally {
    await c.end();
  }
}

async function waitForHealth(url) {
  for (let i = 0; i < 300; i++) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not up yet
    }
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error('the API did not come up');
}

async function fill() {
  const c = new pg.Client({ connectionString: dbUrl });
  await c.connect();
  const t0 = performance.now();
  await c.query(
    `
    insert into bookings (reference, customer_id, state, configuration, created_at)
    select 'LW-B' || n, (select id from users where email = 'player@mail.example'), 'deposit_paid',
           '{"surfaceId":"surface-610","caseId":"case-hard","routing":{"mode":"serial"},"pedals":[],"functions":[],"level":"apprentice"}'::jsonb,
           timestamptz '2026-01-01 12:00Z' + (n % 330) * interval '1 day'
    from generate_series(1, $1::int) as n`,
    [rows],
  );
  await c.query(`
    insert into quotes (booking_id, kind, price_book_version, currency, configuration, estimate, labor_hours, total_low, total_high, deposit, expires_at)
    select b.id, 'estimate', (select max(version) from price_book_versions), 'USD', b.configuration,
           '{"laborHours":"6.00"}'::jsonb, 6, 700, 900, 150, b.created_at + interval '30 days'
    from bookings b where b.reference like 'LW-B%'`);
  await c.query(`
    insert into payments (booking_id, kind, amount, amount_minor, currency, status, paid_at)
    select b.id, 'deposit', 150, 15000, 'USD', 'paid', b.created_at + interval '1 hour' from bookings b where b.reference like 'LW-B%'`);
  await c.query(`
    insert into time_entries (booking_id, builder_id, worked_on, hours, note)
    select b.id, (select id from builders order by created_at limit 1), (b.created_at at time zone 'UTC')::date + 7, 2.5, 'Wiring the loom'
    from bookings b where b.reference like 'LW-B%'`);
  await c.query('analyze');
  await c.end();
  return performance.now() - t0;
}

async function download(pid, cookie, file) {
  const before = rssKiB(pid);
  let peak = before;
  const sampler = setInterval(() => {
    peak = Math.max(peak, rssKiB(pid));
  }, 20);
  const t0 = performance.now();
  const res = await fetch(`http://127.0.0.1:${apiPort}/api/exports/${file}?from=2026-01-01&to=2026-12-31`, { headers: { cookie } });
  if (!res.ok) throw new Error(`${file}: ${res.status} ${await res.text()}`);
  let firstByte = null;
  let bytes = 0;
  let lines = 0;
  for await (const chunk of res.body) {
    firstByte ??= performance.now() - t0;
    bytes += chunk.length;
    for (const b of chunk) if (b === 10) lines++;
  }
  const total = performance.now() - t0;
  clearInterval(sampler);
  peak = Math.max(peak, rssKiB(pid));
  console.log(
    `${file.padEnd(13)} ${String(lines - 1).padStart(7)} rows  ${(bytes / 1048576).toFixed(1).padStart(5)} MiB  first byte ${firstByte.toFixed(0).padStart(4)} ms  ` +
      `whole ${(total / 1000).toFixed(2)} s (${Math.round((lines - 1) / (total / 1000))} rows/s)  API RSS ${mib(before)} → peak ${mib(peak)} MiB`,
  );
}

async function main() {
  await admin(`create database "${dbName}"`);
  const api = spawn(process.execPath, [path.join(root, 'api/dist/src/main.js')], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: dbUrl,
      PORT: String(apiPort),
      SEED_DEMO: 'true',
      SERVE_APPS: 'false',
      RUN_WORKERS: 'false',
      NODE_ENV: 'development',
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  try {
    await waitForHealth(`http://127.0.0.1:${apiPort}/api/health`);
    const fillMs = await fill();
    console.log(`node ${process.version}; ${rows} bookings, payments and hour entries written in ${(fillMs / 1000).toFixed(1)} s`);
    const signIn = await fetch(`http://127.0.0.1:${apiPort}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: 'owner@shop.example', password: 'demo-pass-2026' }),
    });
    if (!signIn.ok) throw new Error(`sign-in: ${signIn.status}`);
    const cookie = signIn.headers
      .getSetCookie()
      .map((c) => c.split(';')[0])
      .join('; ');
    for (const file of (process.env.FILES ?? 'hours.csv,payments.csv,bookings.csv').split(',')) await download(api.pid, cookie, file);
  } finally {
    api.kill('SIGTERM');
    await new Promise((r) => api.once('exit', r));
    await admin(`drop database if exists "${dbName}" with (force)`);
  }
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
