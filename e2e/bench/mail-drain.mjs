#!/usr/bin/env node
// `npm run bench:mail`: how fast the mail outbox drains, printed, never asserted.
//
// Brings up its own PostgreSQL cluster (.data/postgres-bench-mail on BENCH_MAIL_PG_PORT, default 3376)
// and the local mail fake in this process, then, on the built API (`npm run build` first):
//   1. the flush by hand: N queued messages sent by MailDeliveryService.deliverPending()
//      (batch claims, MAIL_CONCURRENCY sends at once);
//   2. the pg-boss worker as a running API has it: N messages enqueued in one transaction with
//      their jobs, timed from the commit to the last row marked sent.
// Each pass also counts the messages the mail fake received against the rows marked sent, so a
// fast figure that sent something twice or lost something shows as such.
// BENCH_MAILS (300) messages per pass; MAIL_BATCH_SIZE and MAIL_CONCURRENCY as the API reads them.
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const require = createRequire(import.meta.url);
const env = process.env;
const pgPort = Number(env.BENCH_MAIL_PG_PORT ?? 3376);
const pgData = path.join(root, '.data/postgres-bench-mail');
const dbName = 'loomwright_bench_mail';
const count = Number(env.BENCH_MAILS ?? 300);
const say = (line) => process.stderr.write(`[bench:mail] ${line}\n`);

function postgres(...args) {
  const r = spawnSync('bash', [path.join(root, 'api/scripts/postgres.sh'), ...args], { stdio: ['ignore', 'ignore', 'inherit'] });
  if (r.status !== 0) throw new Error(`postgres.sh ${args[0]} failed`);
}

const fromApi = (id) => require(require.resolve(id, { paths: [path.join(root, 'api')] }));
const built = (file) => require(path.join(root, 'api/dist', file));

mkdirSync(pgData, { recursive: true });
postgres('ensure-installed');
postgres('start', pgData, String(pgPort));
const pg = fromApi('pg');
const admin = new pg.Client({ host: '127.0.0.1', port: pgPort, user: 'postgres', database: 'postgres' });
await admin.connect();
await admin.query(`drop database if exists ${dbName} with (force)`);
await admin.query(`create database ${dbName}`);
await admin.end();

const { startMailFake } = built('fakes/mail/mail-fake.js');
const fake = await startMailFake({ smtpPort: 0, httpPort: 0 });
Object.assign(process.env, {
  NODE_ENV: 'development',
  DATABASE_URL: `postgres://postgres@127.0.0.1:${pgPort}/${dbName}`,
  SERVE_APPS: 'false',
  SEED_DEMO: 'true',
  RUN_WORKERS: 'false',
  SMTP_HOST: '127.0.0.1',
  SMTP_PORT: String(fake.smtpPort),
  LOG_LEVEL: 'warn',
});
const { NestFactory } = fromApi('@nestjs/core');
const { AppModule } = built('src/app.module.js');
const { MailService } = built('src/mail/mail.service.js');
const { MailDeliveryService } = built('src/mail/mail-delivery.service.js');
const { MailWorker } = built('src/mail/mail-worker.service.js');
const { Database } = built('src/database/database.js');
const { sql } = fromApi('kysely');

say('starting the API (migrations and the demo seed)…');
const app = await NestFactory.createApplicationContext(AppModule, { logger: ['error'] });
const db = app.get(Database);
const mail = app.get(MailService);
const config = app.get(fromApi('@nestjs/config').ConfigService).get('mail');
const results = [];

async function enqueue(tag) {
  await db.transaction().execute(async (trx) => {
    for (let i = 0; i < count; i++) {
      await mail.enqueue(trx, { template: 'welcome', to: `${tag}${i}@bench.example`, data: { name: `Drain ${i}` } });
    }
  });
}
const sentFor = async (tag) =>
  Number(
    (await sql`select count(*)::int as n from mail_outbox where state = 'sent' and to_address like ${`${tag}%`}`.execute(db)).rows[0].n,
  );
const receivedFor = (tag) => fake.messages.filter((m) => m.to.some((to) => to.startsWith(tag))).length;

try {
  // 1. By hand.
  await enqueue('flush');
  say(`flush by hand: ${count} messages…`);
  let t0 = performance.now();
  for (;;) {
    const outcome = await app.get(MailDeliveryService).deliverPending();
    if (Object.values(outcome).reduce((a, b) => a + b, 0) === 0) break;
  }
  let seconds = (performance.now() - t0) / 1000;
  results.push(['deliverPending, one process', await sentFor('flush'), receivedFor('flush'), seconds]);

  // 2. The worker.
  await app.get(MailWorker).start();
  say(`pg-boss worker: ${count} messages…`);
  await enqueue('worker');
  t0 = performance.now();
  const deadline = Date.now() + 10 * 60_000;
  while ((await sentFor('worker')) < count && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
  seconds = (performance.now() - t0) / 1000;
  results.push(['pg-boss worker, one process (from the commit)', await sentFor('worker'), receivedFor('worker'), seconds]);
} finally {
  await app.close();
  await fake.stop();
  postgres('stop', pgData);
}

const load = readFileSync('/proc/loadavg', 'utf8').split(' ').slice(0, 3).join(' ');
console.log(
  `Mail drain, ${new Date().toISOString()} (load average ${load}; MAIL_BATCH_SIZE ${config.batchSize}, MAIL_CONCURRENCY ${config.concurrency})`,
);
for (const [what, sent, received, secs] of results) {
  console.log(
    `| ${what} | ${count} welcome messages | ${(sent / secs).toFixed(1)} messages/s | ${sent} sent in ${secs.toFixed(1)} s | mail fake received ${received}${received === sent ? '' : ' (NOT equal to sent)'} |`,
  );
}
