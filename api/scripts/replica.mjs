#!/usr/bin/env node
// `PORT=<port> npm run replica`: one more API process against the stack `npm start` is running
// (same database, bucket, payment and mail settings, read from .data/stack.env, which npm start
// writes), with no rebuild and no second database. Put a load balancer in front of both, or call
// either port directly: sessions, jobs, photos and sign-in limits are shared through PostgreSQL
// and the bucket. Ctrl-C stops this replica only.
import { spawn } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { apiNodeFlags } from './api-node-flags.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
const envFile = path.resolve(root, process.env.STACK_ENV ?? '.data/stack.env');
const port = Number(process.env.PORT);

if (!Number.isInteger(port) || port < 1 || port > 65535) {
  console.error('[loomwright] Say which port the replica listens on: PORT=3001 npm run replica');
  process.exit(2);
}
if (!existsSync(envFile)) {
  console.error(`[loomwright] ${path.relative(root, envFile)} is missing: start the stack first (npm start), then the replica.`);
  process.exit(2);
}
const main = path.join(root, 'api/dist/src/main.js');
if (!existsSync(main)) {
  console.error('[loomwright] The API is not built: run npm start (or npm run build) once first.');
  process.exit(2);
}

const stackEnv = {};
for (const line of readFileSync(envFile, 'utf8').split('\n')) {
  const m = line.match(/^([A-Z0-9_]+)=(.*)$/);
  if (m) stackEnv[m[1]] = JSON.parse(m[2]);
}

const child = spawn(process.execPath, [...apiNodeFlags, main], {
  cwd: root,
  stdio: 'inherit',
  // The first process already migrated and seeded; a replica only joins.
  env: { ...process.env, ...stackEnv, PORT: String(port), SEED_DEMO: 'false' },
});
console.log(`[loomwright] Replica API on http://localhost:${port}/api (settings from ${path.relative(root, envFile)})`);
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => child.kill('SIGTERM'));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
