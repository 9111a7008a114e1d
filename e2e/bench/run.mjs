#!/usr/bin/env node
// `npm run bench`: brings the product up on its own ports, measures it, and prints one table in
// which each figure stands beside its ceiling from the same run where one exists (an unknown /api
// path, answered 404 through every middleware, is the ceiling of any route). It judges nothing:
// targets are printed for the reader, never asserted. Figures are as good as the machine is quiet.
//
// Sections (BENCH_ONLY=http,engine,bundle,lighthouse,latency,data,mail picks some; default all).
// Ports (defaults in the 3370-3379 block): BENCH_PORT 3370, BENCH_PG_PORT 3371, BENCH_PAYMENT_PORT 3372,
// BENCH_SMTP_PORT 3373, BENCH_MAIL_HTTP_PORT 3374, BENCH_OBJECT_STORE_PORT 3375. BENCH_SECONDS (8) per load run, BENCH_REPEAT (30)
// calls per data figure, BENCH_LIGHTHOUSE_RUNS (3) per page and preset, BENCH_SKIP_BUILD=true to reuse the last build,
// BENCH_SCALE=small for a quick try.
import { spawn, spawnSync } from 'node:child_process';
import { appendFileSync, existsSync, mkdirSync, readdirSync, readFileSync, readlinkSync, statSync, writeFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import { lighthouseChromeOptions, stackEnv } from '../stack-env.mjs';
import { measureEstimateLatency } from './latency-board.mjs';

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, '../..');
const require = createRequire(import.meta.url);
const env = process.env;
const ports = {
  api: Number(env.BENCH_PORT ?? 3370),
  pg: Number(env.BENCH_PG_PORT ?? 3371),
  payment: Number(env.BENCH_PAYMENT_PORT ?? 3372),
  smtp: Number(env.BENCH_SMTP_PORT ?? 3373),
  mailHttp: Number(env.BENCH_MAIL_HTTP_PORT ?? 3374),
  objectStore: Number(env.BENCH_OBJECT_STORE_PORT ?? 3375),
};
const base = `http://127.0.0.1:${ports.api}`;
const pgData = path.join(root, '.data/postgres-bench');
const dbName = 'loomwright_bench';
const seconds = Number(env.BENCH_SECONDS ?? 8);
const repeat = Number(env.BENCH_REPEAT ?? 30);
const only = new Set((env.BENCH_ONLY ?? 'http,engine,bundle,lighthouse,latency,data,mail').split(','));

const rows = [];
const notes = [];
const say = (line) => process.stderr.write(`[bench] ${line}\n`);
const row = (section, what, figure, ceiling = '', ratio = '', target = '') => rows.push({ section, what, figure, ceiling, ratio, target });
const ms = (v) => (v === undefined || Number.isNaN(v) ? '–' : `${v < 10 ? v.toFixed(1) : Math.round(v)} ms`);
const pct = (a, b) => (b ? `${Math.round((a / b) * 100)} %` : '');
const quantile = (values, q) => {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))];
};

/** The 13-pedal board the API and the engine price: the year-of-data seed's (api/dist, built before any section runs). */
const benchBoard = () => require(path.join(root, 'api/dist/src/database/seed/year-of-data.js')).benchBoard();

// ---------------------------------------------------------------- the stack
function postgres(...args) {
  const r = spawnSync('bash', [path.join(root, 'api/scripts/postgres.sh'), ...args], { stdio: ['ignore', 'ignore', 'inherit'] });
  if (r.status !== 0) throw new Error(`postgres.sh ${args[0]} failed`);
}

let stack;
async function startStack() {
  if (env.BENCH_SKIP_BUILD !== 'true') {
    say('building (npm run build)…');
    const r = spawnSync('npm', ['run', 'build'], { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
    if (r.status !== 0) throw new Error('npm run build failed');
  }
  mkdirSync(pgData, { recursive: true });
  postgres('ensure-installed');
  postgres('start', pgData, String(ports.pg));
  // auto_explain is loaded (switched off) so the data section can show the plan each call ran.
  const pg = require('pg');
  const admin = new pg.Client({ host: '127.0.0.1', port: ports.pg, user: 'postgres', database: 'postgres' });
  await admin.connect();
  const loaded = (await admin.query(`select setting from pg_settings where name = 'shared_preload_libraries'`)).rows[0].setting;
  await admin.query(`alter system set shared_preload_libraries = 'auto_explain'`);
  // Loaded into this session too, so ALTER SYSTEM knows its settings before the restart.
  await admin.query(`load 'auto_explain'`);
  await admin.query(`alter system set auto_explain.log_min_duration = -1`);
  await admin.query(`alter system set auto_explain.log_nested_statements = on`);
  await admin.end();
  if (!loaded.includes('auto_explain')) {
    postgres('stop', pgData);
    postgres('start', pgData, String(ports.pg));
  }
  say(`starting the product on ${base} (PostgreSQL 127.0.0.1:${ports.pg}, database ${dbName})…`);
  stack = spawn(process.execPath, [path.join(root, 'api/scripts/stack.mjs')], {
    cwd: root,
    detached: true,
    stdio: ['ignore', 'ignore', 'inherit'],
    env: {
      ...env,
      ...stackEnv({
        port: ports.api,
        pgPort: ports.pg,
        pgData,
        dbName,
        paymentPort: ports.payment,
        smtpPort: ports.smtp,
        mailHttpPort: ports.mailHttp,
        objectStorePort: ports.objectStore,
      }),
      OBJECT_STORE_DIR: '.data/object-store-bench',
      STACK_QUIET: 'true',
      // Sign-in is throttled per address; the benchmark signs in a few times from one.
      AUTH_THROTTLE_LIMIT: '1000',
    },
  });
  const deadline = Date.now() + 120_000;
  while (Date.now() < deadline) {
    try {
      if ((await fetch(`${base}/api/health`)).ok) return;
    } catch {
      // not yet
    }
    await new Promise((r) => setTimeout(r, 500));
  }
  throw new Error('the product did not come up within two minutes');
}

async function stopStack() {
  if (!stack || stack.exitCode !== null) return;
  await new Promise((resolve) => {
    stack.once('exit', resolve);
    process.kill(-stack.pid, 'SIGTERM');
    setTimeout(() => {
      try {
        process.kill(-stack.pid, 'SIGKILL');
      } catch {
        // gone
      }
      resolve();
    }, 15_000).unref();
  });
}

// ---------------------------------------------------------------- HTTP under load
/** The process listening on a TCP port (Linux /proc: the socket's inode, then whose descriptor holds it), or null. */
function listenerPid(port) {
  try {
    const hex = port.toString(16).toUpperCase().padStart(4, '0');
    const inodes = new Set();
    for (const file of ['/proc/net/tcp', '/proc/net/tcp6']) {
      if (!existsSync(file)) continue;
      for (const line of readFileSync(file, 'utf8').split('\n').slice(1)) {
        const f = line.trim().split(/\s+/);
        // local address ends in :PORT, state 0A is LISTEN, field 9 the inode
        if (f[1]?.endsWith(`:${hex}`) && f[3] === '0A') inodes.add(`socket:[${f[9]}]`);
      }
    }
    for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
      try {
        for (const fd of readdirSync(`/proc/${pid}/fd`)) if (inodes.has(readlinkSync(`/proc/${pid}/fd/${fd}`))) return Number(pid);
      } catch {
        // another user's process, or gone
      }
    }
  } catch {
    // not Linux
  }
  return null;
}

/** User + system CPU time of a process so far, in microseconds (/proc/PID/stat, clock ticks at 100 Hz). */
function cpuMicros(pid) {
  if (!pid) return null;
  try {
    const f = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    return (Number(f[11]) + Number(f[12])) * 10_000;
  } catch {
    return null;
  }
}

let apiPid = null;
async function load(opts) {
  const autocannon = require('autocannon');
  // Two seconds of the same load first, not counted: the route's code is compiled and optimized by
  // then (V8's tiers), so the figures are the route's, not the JIT's (the first load of a fresh API
  // process otherwise carries the compile pauses in its tail).
  await autocannon({ ...opts, duration: 2 });
  const before = cpuMicros(apiPid);
  const result = await autocannon({ duration: seconds, ...opts });
  const after = cpuMicros(apiPid);
  return {
    rps: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors + result.non2xx,
    bytes: result.throughput.average / Math.max(1, result.requests.average),
    // The API process's CPU per answer: unlike requests/s it hardly moves when other work shares the machine.
    cpu: before !== null && after !== null && result.requests.total > 0 ? (after - before) / result.requests.total : null,
  };
}
const cpuText = (r) => (r.cpu === null ? '' : ` · ${Math.round(r.cpu)} µs CPU`);

async function httpSection() {
  const estimateBody = JSON.stringify(benchBoard());
  const json = { 'content-type': 'application/json' };
  const sizeFull = (await (await fetch(`${base}/api/estimates`, { method: 'POST', headers: json, body: estimateBody })).text()).length;
  const sizePanel = (await (await fetch(`${base}/api/estimates?view=panel`, { method: 'POST', headers: json, body: estimateBody })).text())
    .length;
  notes.push(
    `estimate answer for the 13-pedal board: ${(sizeFull / 1000).toFixed(1)} kB whole, ${(sizePanel / 1000).toFixed(1)} kB with ?view=panel (what the configurator's panel shows)`,
  );
  apiPid = listenerPid(ports.api);
  if (!apiPid) notes.push('CPU per request not measured: the API process could not be found from its port');
  for (const connections of [10, 50]) {
    say(`load: ${connections} connections, ${seconds} s each…`);
    const ceiling = await load({ url: `${base}/api/no-such-route`, connections });
    const estimate = await load({ url: `${base}/api/estimates`, method: 'POST', headers: json, body: estimateBody, connections });
    const panel = await load({ url: `${base}/api/estimates?view=panel`, method: 'POST', headers: json, body: estimateBody, connections });
    const catalog = await load({ url: `${base}/api/catalog`, connections });
    const lead = await load({ url: `${base}/api/bench/lead-time?hours=14.00&level=journeyman`, connections });
    const label = `${connections} conn`;
    row(
      'HTTP',
      `404 ceiling (${label}) req/s · p50 · p99 · API CPU per request`,
      `${Math.round(ceiling.rps)} · ${ms(ceiling.p50)} · ${ms(ceiling.p99)}${cpuText(ceiling)}`,
      '',
      '100 %',
    );
    for (const [name, r, target] of [
      ['POST /api/estimates 13 pedals', estimate, connections === 10 ? '≥ 70 %, p99 ≤ 15 ms' : ''],
      ['POST /api/estimates?view=panel', panel, connections === 10 ? '≥ 70 %, p99 ≤ 15 ms' : ''],
      ['GET /api/catalog', catalog, ''],
      ['GET /api/bench/lead-time', lead, ''],
    ]) {
      row(
        'HTTP',
        `${name} (${label}) req/s · p50 · p99 · API CPU per request`,
        `${Math.round(r.rps)} · ${ms(r.p50)} · ${ms(r.p99)}${cpuText(r)}${r.errors ? ` · ${r.errors} errors` : ''}`,
        `${Math.round(ceiling.rps)}`,
        pct(r.rps, ceiling.rps),
        target,
      );
    }
    if (ceiling.cpu && estimate.cpu && panel.cpu) {
      // The same ratio from CPU time: the 404's CPU per request over the route's (what requests/s
      // would give with the API alone on a core).
      row(
        'HTTP',
        `CPU ratio (${label}): 404 over POST /api/estimates · over ?view=panel`,
        `${Math.round(ceiling.cpu)} / ${Math.round(estimate.cpu)} µs · ${Math.round(ceiling.cpu)} / ${Math.round(panel.cpu)} µs`,
        '',
        `${pct(ceiling.cpu, estimate.cpu)} · ${pct(ceiling.cpu, panel.cpu)}`,
        connections === 10 ? '≥ 70 %' : '',
      );
    }
  }
}

// ---------------------------------------------------------------- the engine alone
function engineSection() {
  const { estimateRig, demoPriceBook } = require(path.join(root, 'shared/dist/index.js'));
  const config = benchBoard();
  for (let i = 0; i < 3_000; i++) estimateRig(config, demoPriceBook, { version: 1 });
  const count = Number(env.BENCH_ENGINE_COUNT ?? 30_000);
  const cpu0 = process.cpuUsage();
  const t0 = process.hrtime.bigint();
  for (let i = 0; i < count; i++) estimateRig(config, demoPriceBook, { version: 1 });
  const wallMs = Number(process.hrtime.bigint() - t0) / 1e6;
  const cpu = process.cpuUsage(cpu0);
  const cpuUs = (cpu.user + cpu.system) / count;
  // On a shared machine the wall clock includes time spent waiting for a core; CPU time does not,
  // so the rate on one free core is 1 s divided by the CPU per estimate.
  row(
    'engine',
    'estimates/s, 13-pedal board, one core (1 s ÷ CPU per estimate · wall clock)',
    `${Math.round(1e6 / cpuUs).toLocaleString('en-US')} · ${Math.round(count / (wallMs / 1000)).toLocaleString('en-US')}`,
    '',
    '',
    '≥ 50,000',
  );
  row('engine', 'CPU per estimate', `${cpuUs.toFixed(1)} µs`, '', '', '≤ 20 µs');
}

// ---------------------------------------------------------------- first load
function bundleSection() {
  const dist = path.join(root, 'storefront/dist');
  const manifest = JSON.parse(readFileSync(path.join(dist, '.vite/manifest.json'), 'utf8'));
  const gz = (file) => gzipSync(readFileSync(path.join(dist, file)), { level: 9 }).length;
  // What the API sends a browser that accepts brotli: the build's .br copy (brotli 11) when it made one.
  const br = (file) =>
    existsSync(path.join(dist, `${file}.br`))
      ? statSync(path.join(dist, `${file}.br`)).size
      : brotliCompressSync(readFileSync(path.join(dist, file))).length;
  const closure = (key, seen = new Set()) => {
    if (!manifest[key] || seen.has(key)) return seen;
    seen.add(key);
    for (const dep of manifest[key].imports ?? []) closure(dep, seen);
    return seen;
  };
  const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry);
  const find = (suffix) => Object.keys(manifest).find((k) => k.endsWith(suffix));
  const routes = {
    '/': [entryKey, find('app/routes/home.tsx')],
    '/configure': [entryKey, find('app/routes/configure.tsx'), find('steps/SurfaceStep.tsx')],
  };
  const pageFiles = { '/': 'home.html', '/configure': 'configure.html' };
  for (const [route, keys] of Object.entries(routes)) {
    const all = new Set();
    for (const k of keys.filter(Boolean)) closure(k, all);
    // The small classic script a prerendered page starts its modules with (not in the manifest).
    const loader = readFileSync(path.join(dist, pageFiles[route]), 'utf8').match(/<script defer src="\/([^"]+)"/)?.[1];
    let js = loader ? gz(loader) : 0;
    let jsBrotli = loader ? br(loader) : 0;
    const css = new Set();
    for (const k of all) {
      js += gz(manifest[k].file);
      jsBrotli += br(manifest[k].file);
      for (const c of manifest[k].css ?? []) css.add(c);
    }
    const cssBytes = [...css].reduce((s, f) => s + gz(f), 0);
    row(
      'first load',
      `${route} gzipped JS · brotli JS (as sent) · CSS`,
      `${(js / 1000).toFixed(1)} kB · ${(jsBrotli / 1000).toFixed(1)} kB · ${(cssBytes / 1000).toFixed(1)} kB`,
      '150 kB',
      pct(js, 150_000),
      '≤ 150 kB JS',
    );
  }
}

// ---------------------------------------------------------------- Lighthouse
async function lighthouseSection() {
  const { default: lighthouse } = await import('lighthouse');
  const { default: desktopConfig } = await import('lighthouse/core/config/desktop-config.js');
  const chromeLauncher = await import('chrome-launcher');
  // Each page and preset is measured `runs` times (a score on a busy 2-core machine moves by several
  // points from run to run): every run's figures are printed, and the notes say which audits fell short.
  const runs = Number(env.BENCH_LIGHTHOUSE_RUNS ?? 3);
  /** One Lighthouse run in a fresh browser; a run whose trace Lighthouse could not record is made again once. */
  async function lighthouseOnce(route, preset, retried = false) {
    const chrome = await chromeLauncher.launch(lighthouseChromeOptions);
    try {
      const { lhr } = await lighthouse(
        `${base}${route}`,
        { port: chrome.port, output: 'json', logLevel: 'error', onlyCategories: ['performance', 'accessibility', 'best-practices', 'seo'] },
        preset === 'desktop' ? desktopConfig : undefined,
      );
      if (lhr.runtimeError && !retried) {
        notes.push(`Lighthouse ${preset} ${route}: ${lhr.runtimeError.code} (${lhr.runtimeError.message}); run again`);
        return lighthouseOnce(route, preset, true);
      }
      return lhr;
    } finally {
      await chrome.kill();
    }
  }
  for (const route of ['/', '/configure']) {
    for (const preset of ['mobile', 'desktop']) {
      for (let run = 1; run <= runs; run++) {
        say(`Lighthouse ${preset} ${route}, run ${run} of ${runs}…`);
        const { categories, audits, runtimeError } = await lighthouseOnce(route, preset);
        if (runtimeError) notes.push(`Lighthouse ${preset} ${route}: ${runtimeError.code} ${runtimeError.message}`);
        const score = (c) => (categories[c]?.score == null ? '–' : Math.round(categories[c].score * 100));
        const value = (id) => audits[id]?.numericValue;
        const cls = value('cumulative-layout-shift');
        row(
          'Lighthouse',
          `${route} ${preset} (run ${run}): perf · LCP · TBT · CLS · a11y · best pr. · SEO`,
          `${score('performance')} · ${ms(value('largest-contentful-paint'))} · ${ms(value('total-blocking-time'))} · ${cls === undefined ? '–' : cls.toFixed(3)} · ${score('accessibility')} · ${score('best-practices')} · ${score('seo')}`,
          '',
          '',
          'perf ≥ 95, CLS ≤ 0.02, BP/SEO 100',
        );
        const failing = Object.values(audits).filter(
          (a) => a.score !== null && a.score < 1 && ['binary', 'numeric'].includes(a.scoreDisplayMode) && !a.id.includes('metric'),
        );
        if (failing.length)
          notes.push(
            `Lighthouse ${preset} ${route} (run ${run}), audits below 1: ${failing.map((a) => `${a.id}${a.displayValue ? ` (${a.displayValue})` : ''}`).join(', ')}`,
          );
        const shifts = audits['layout-shifts']?.details?.items ?? [];
        if (shifts.length)
          notes.push(
            `Lighthouse ${preset} ${route} (run ${run}), layout shifts: ${shifts.map((i) => `${i.node?.selector ?? i.node?.snippet ?? '?'} ${Number(i.score).toFixed(3)}`).join('; ')}`,
          );
      }
    }
  }
}

// ---------------------------------------------------------------- estimate on screen

async function latencySection() {
  const durations = await measureEstimateLatency(base, repeat);
  row(
    'browser',
    `estimate on screen after the debounce (${durations.length} changes) median · p95`,
    `${ms(quantile(durations, 0.5))} · ${ms(quantile(durations, 0.95))}`,
    '',
    '',
    'median ≤ 100 ms',
  );
}

// ---------------------------------------------------------------- a year of data
async function signIn(email) {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: 'demo-pass-2026' }),
  });
  if (!res.ok) throw new Error(`sign-in as ${email}: ${res.status}`);
  return res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
}

const bigTables = ['bookings', 'users', 'quotes', 'payments', 'mail_outbox', 'booking_events', 'bench_allocations'];

/**
 * The plans PostgreSQL logged (auto_explain, with ANALYZE and BUFFERS) for one call: the indexes
 * used, any full scan of a big table, and the 8 kB pages the call's statements touched (shared
 * buffers hit or read, each statement's top node). Pages touched do not change with the machine's
 * load, so they compare runs that wall-clock times cannot. The job queue's own polling is left out.
 */
async function explainCall(admin, call, cookie) {
  const log = path.join(pgData, 'server.log');
  const set = async (on) => {
    await admin.query(`alter system set auto_explain.log_min_duration = ${on ? 0 : -1}`);
    await admin.query(`alter system set auto_explain.log_analyze = ${on ? 'on' : 'off'}`);
    await admin.query(`alter system set auto_explain.log_buffers = ${on ? 'on' : 'off'}`);
    await admin.query(`alter system set auto_explain.log_timing = off`);
    await admin.query(`select pg_reload_conf()`);
    await new Promise((r) => setTimeout(r, 300));
  };
  await set(true);
  const from = statSync(log).size;
  await fetch(`${base}${call}`, { headers: { cookie } });
  await set(false);
  const blocks = readFileSync(log)
    .subarray(from)
    .toString('utf8')
    .split(/LOG: {2}duration: [\d.]+ ms {2}plan:\n/)
    .slice(1)
    .filter((b) => !b.includes('pgboss'));
  const text = blocks.join('\n');
  const indexes = new Set();
  const scans = new Set();
  for (const m of text.matchAll(/(?:Index Scan|Index Only Scan)(?: Backward)? using (\w+)|Bitmap Index Scan on (\w+)/g))
    indexes.add(m[1] ?? m[2]);
  for (const m of text.matchAll(/Seq Scan on (\w+)/g)) if (bigTables.includes(m[1])) scans.add(m[1]);
  let pages = 0;
  for (const b of blocks) {
    const m = /Buffers: shared(?: hit=(\d+))?(?: read=(\d+))?/.exec(b);
    if (m) pages += Number(m[1] ?? 0) + Number(m[2] ?? 0);
  }
  const ignore = /^(sessions_pkey|users_pkey|users_email_key|builders_pkey|builders_user_id_key)$/;
  const shown = [...indexes].filter((i) => !ignore.test(i));
  return {
    plan: `${shown.join(', ') || 'no index'}${scans.size ? `; full scan of ${[...scans].join(', ')}` : ''}`,
    pages,
    statements: blocks.length,
  };
}

/**
 * Wall-clock times of `repeat` calls one after another (after three to warm up), and the API
 * process's CPU per call (with `beforeEach`'s own work, if any, on the API's side).
 */
async function timeCall(call, cookie, beforeEach) {
  const times = [];
  let before = null;
  for (let i = 0; i < 3 + repeat; i++) {
    await beforeEach?.();
    if (i === 3) before = cpuMicros(apiPid);
    const t0 = performance.now();
    const res = await fetch(`${base}${call}`, { headers: { cookie } });
    await res.arrayBuffer();
    if (!res.ok) throw new Error(`${call}: ${res.status}`);
    if (i >= 3) times.push(performance.now() - t0);
  }
  const after = cpuMicros(apiPid);
  return { times, cpu: before !== null && after !== null ? (after - before) / repeat : null };
}

async function dataSection() {
  const pg = require('pg');
  const { seedYearOfData, fullYearScale } = require(path.join(root, 'api/dist/src/database/seed/year-of-data.js'));
  const { Kysely, PostgresDialect } = require('kysely');
  const scale =
    env.BENCH_SCALE === 'small' ? { bookings: 5_000, customers: 500, builders: 20, mails: 10_000, fullEstimates: 1_000 } : fullYearScale;
  const db = new Kysely({
    dialect: new PostgresDialect({
      pool: new pg.Pool({ connectionString: `postgres://postgres@127.0.0.1:${ports.pg}/${dbName}`, max: 2 }),
    }),
  });
  say(`seeding a year of data (${scale.bookings.toLocaleString('en-US')} bookings)…`);
  const t0 = performance.now();
  const counts = await seedYearOfData(db, scale, (step, s) => say(`  seed ${step}: ${s.toFixed(1)} s`));
  const seedSeconds = (performance.now() - t0) / 1000;
  await db.destroy();
  row('data', 'seed: a year of data', `${seedSeconds.toFixed(1)} s`, '', '', '< 120 s');
  notes.push(
    `seeded rows: ${Object.entries(counts)
      .map(([k, v]) => `${k} ${v.toLocaleString('en-US')}`)
      .join(', ')}`,
  );

  const cookie = await signIn('owner@shop.example');
  const pick = async (q) => (await (await fetch(`${base}/api/bookings?${q}`, { headers: { cookie } })).json()).items[0];
  const waiting = await pick('state=deposit_paid&pageSize=1');
  const someBooking = await pick('state=scheduled&pageSize=1');
  const lastBookings = Math.ceil(scale.bookings / 25);
  // Keyset paging: the cursor after the first page, and after a page in the middle of the list
  // (where reading by OFFSET costs most, since a page past the middle is read from the other end).
  const middle = Math.ceil(lastBookings / 2);
  const cursorAfter = async (list, q) => (await (await fetch(`${base}/api/${list}?${q}`, { headers: { cookie } })).json()).nextCursor;
  const nextCursor = await cursorAfter('bookings', 'pageSize=25');
  const middleCursor = await cursorAfter('bookings', `pageSize=25&page=${middle - 1}`);
  const mailMiddle = Math.ceil(scale.mails / 25 / 2);
  const mailCursor = await cursorAfter('mail', `pageSize=25&page=${mailMiddle - 1}`);
  const monday = new Date();
  monday.setUTCDate(monday.getUTCDate() + ((8 - monday.getUTCDay()) % 7 || 7));
  const day = (d, plus) => new Date(d.getTime() + plus * 86_400_000).toISOString().slice(0, 10);
  const calls = [
    ['Requests: first page', '/api/bookings?page=1&pageSize=25', 50],
    ['Requests: search a name', '/api/bookings?q=Nell%20Brack&pageSize=25', 50],
    ['Requests: search a reference', '/api/bookings?q=LW-Y04321&pageSize=25', 50],
    ['Requests: deposit paid', '/api/bookings?deposit=paid&pageSize=25', 50],
    ['Requests: sort by bench date', '/api/bookings?sort=bench_date&order=asc&pageSize=25', 50],
    ['Requests: last page', `/api/bookings?page=${lastBookings}&pageSize=25`, ''],
    ['Requests: next page by cursor', `/api/bookings?pageSize=25&cursor=${nextCursor}`, 50],
    [`Requests: page ${middle.toLocaleString('en-US')} by cursor`, `/api/bookings?pageSize=25&cursor=${middleCursor}`, 50],
    [`Requests: page ${middle.toLocaleString('en-US')} by OFFSET`, `/api/bookings?pageSize=25&page=${middle}`, ''],
    ['Builds: scheduled', '/api/bookings?state=scheduled&pageSize=25', 50],
    ['Builds: delivered, by last change', '/api/bookings?state=delivered&sort=updated_at&order=desc&pageSize=25', 50],
    ['Customers: first page', '/api/customers', 50],
    ['Customers: search', '/api/customers?search=ashgrove', 50],
    ['Customers: sort by builds', '/api/customers?sort=buildCount&order=desc', 50],
    ['Customers: last page', `/api/customers?page=${Math.ceil(scale.customers / 25)}`, ''],
    ['Mail log: first page', '/api/mail', 50],
    ['Mail log: search', '/api/mail?q=player42', 50],
    ['Mail log: last page', `/api/mail?page=${Math.ceil(scale.mails / 25)}`, ''],
    [`Mail log: page ${mailMiddle.toLocaleString('en-US')} by cursor`, `/api/mail?pageSize=25&cursor=${mailCursor}`, 50],
    ['Bench: week', `/api/bench?from=${day(monday, 0)}&to=${day(monday, 6)}`, ''],
    ['Bench: month', `/api/bench?from=${day(monday, 0)}&to=${day(monday, 34)}`, 100],
    ['Accept suggestion', `/api/bench/suggest?bookingId=${waiting?.id}`, 20],
    ['Public lead time', '/api/bench/lead-time?hours=14.00&level=journeyman', 20],
    // The same two calls each just after the bench changed (every API process drops the bench it
    // holds in memory and reads it again): what the first caller after an acceptance waits for.
    ['Accept suggestion, bench just changed', `/api/bench/suggest?bookingId=${waiting?.id}`, 20, 'changed'],
    ['Public lead time, bench just changed', '/api/bench/lead-time?hours=14.00&level=journeyman', 20, 'changed'],
    ['Booking detail', `/api/bookings/${someBooking?.id}`, ''],
  ];
  apiPid ??= listenerPid(ports.api);
  const admin = new pg.Client({ host: '127.0.0.1', port: ports.pg, user: 'postgres', database: dbName });
  await admin.connect();
  try {
    // What any write to the bench tells every API process (the triggers of migration 20261203_0700),
    // given a moment to arrive.
    const benchChanged = async () => {
      await admin.query(`select pg_notify('bench_changed', '')`);
      await new Promise((r) => setTimeout(r, 20));
    };
    for (const [label, call, target, when] of calls) {
      say(`data: ${label}…`);
      const { times, cpu } = await timeCall(call, cookie, when === 'changed' ? benchChanged : undefined);
      if (when === 'changed') await benchChanged();
      const { plan, pages, statements } = await explainCall(admin, call, cookie);
      row(
        'data',
        `${label} p50 · p95 · API CPU per call`,
        `${ms(quantile(times, 0.5))} · ${ms(quantile(times, 0.95))}${cpuText({ cpu })}`,
        '',
        '',
        target ? `p95 ≤ ${target} ms` : '',
      );
      notes.push(`plan, ${label}: ${plan} (${statements} statements, ${pages.toLocaleString('en-US')} pages of 8 kB touched)`);
    }
  } finally {
    await admin.end();
  }
}

// ---------------------------------------------------------------- mail drain
async function mailSection() {
  const count = Number(env.BENCH_MAILS ?? 300);
  Object.assign(process.env, {
    NODE_ENV: 'development',
    DATABASE_URL: `postgres://postgres@127.0.0.1:${ports.pg}/${dbName}`,
    SERVE_APPS: 'false',
    SEED_DEMO: 'false',
    RUN_WORKERS: 'false',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(ports.smtp),
    PUBLIC_URL: `http://localhost:${ports.api}`,
  });
  const { NestFactory } = require(require.resolve('@nestjs/core', { paths: [path.join(root, 'api')] }));
  const { AppModule } = require(path.join(root, 'api/dist/src/app.module.js'));
  const { MailService } = require(path.join(root, 'api/dist/src/mail/mail.service.js'));
  const { MailDeliveryService } = require(path.join(root, 'api/dist/src/mail/mail-delivery.service.js'));
  const { Database } = require(path.join(root, 'api/dist/src/database/database.js'));
  const app = await NestFactory.createApplicationContext(AppModule, { logger: ['error'] });
  try {
    const db = app.get(Database);
    const mail = app.get(MailService);
    await db.transaction().execute(async (trx) => {
      for (let i = 0; i < count; i++) {
        await mail.enqueue(trx, {
          template: 'welcome',
          to: `drain${i}@bench.example`,
          data: { name: `Drain ${i}`, configureUrl: `${base}/configure`, accountUrl: `${base}/account` },
        });
      }
    });
    say(`mail: draining ${count} messages…`);
    const t0 = performance.now();
    let sent = 0;
    for (;;) {
      const outcome = await app.get(MailDeliveryService).deliverPending();
      const done = Object.values(outcome).reduce((a, b) => a + b, 0);
      sent += outcome.sent;
      if (done === 0) break;
    }
    const secondsTaken = (performance.now() - t0) / 1000;
    row(
      'mail',
      `outbox drain, ${count} welcome messages to the mail fake, one process`,
      `${Math.round(sent / secondsTaken)} messages/s (${sent} sent in ${secondsTaken.toFixed(1)} s)`,
    );
  } finally {
    await app.close();
  }
}

// ---------------------------------------------------------------- the table
function print() {
  const header = ['section', 'what', 'figure', 'ceiling', 'ratio', 'target'];
  const table = [header, ...rows.map((r) => header.map((h) => String(r[h] ?? '')))];
  const widths = header.map((_, i) => Math.max(...table.map((r) => r[i].length)));
  const line = (r) => `| ${r.map((c, i) => c.padEnd(widths[i])).join(' | ')} |`;
  const load = (() => {
    try {
      return readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ');
    } catch {
      return 'unknown';
    }
  })();
  const out = [
    `Loomwright benchmark, ${new Date().toISOString()} (load average ${load}; figures on a shared machine are noisy)`,
    line(table[0]),
    `|${widths.map((w) => '-'.repeat(w + 2)).join('|')}|`,
    ...table.slice(1).map(line),
    '',
    ...notes.map((n) => `- ${n}`),
  ].join('\n');
  console.log(out);
  mkdirSync(path.join(root, '.data'), { recursive: true });
  writeFileSync(path.join(root, '.data/bench-last.txt'), `${out}\n`);
  appendFileSync(path.join(root, '.data/bench-history.txt'), `${out}\n\n`);
}

const sections = [
  ['engine', engineSection],
  ['bundle', bundleSection],
  ['http', httpSection],
  ['lighthouse', lighthouseSection],
  ['latency', latencySection],
  ['data', dataSection],
  ['mail', mailSection],
];
let failed = false;
try {
  const needsStack = sections.some(([name]) => only.has(name) && !['engine', 'bundle'].includes(name));
  if (needsStack) await startStack();
  else if (env.BENCH_SKIP_BUILD !== 'true' && !existsSync(path.join(root, 'api/dist/src/database/seed/year-of-data.js')))
    spawnSync('npm', ['run', 'build'], { cwd: root, stdio: 'inherit' });
  for (const [name, fn] of sections) {
    if (!only.has(name)) continue;
    try {
      await fn();
    } catch (error) {
      failed = true;
      notes.push(`${name} section failed: ${error.message}`);
      say(`${name} failed: ${error.stack}`);
    }
  }
} finally {
  await stopStack();
  print();
}
process.exit(failed ? 1 : 0);
