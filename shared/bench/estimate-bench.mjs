// Prices 100,000 random configurations in one process against the built engine (shared/dist)
// and prints estimates per second and the p50/p99 time per estimate. Run: npm run bench:estimate -w shared
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const { estimateRig, demoPriceBook, pedalKinds } = require('../dist/index.js');

const COUNT = Number(process.env.BENCH_COUNT ?? 100_000);
const WARMUP = 2_000;

// A small seeded generator, so two runs price the same configurations.
let seed = 0x5eed;
const random = () => {
  seed = (seed * 1664525 + 1013904223) >>> 0;
  return seed / 2 ** 32;
};
const pick = (items) => items[Math.floor(random() * items.length)];
const kinds = pedalKinds.filter((k) => k !== 'switcher');
const names = ['fuzz', 'overdrive', 'compressor', 'chorus', 'phaser', 'analog delay', 'reverb', 'tuner', 'wah', 'octave'];

function randomConfiguration() {
  const mode = random() < 0.5 ? 'serial' : 'switcher';
  const pedalTotal = 1 + Math.floor(random() * 20);
  const pedals = Array.from({ length: pedalTotal }, () => ({
    name: pick(names),
    kind: pick(kinds),
    powered: random() < 0.9,
    inLoop: mode === 'switcher' && random() < 0.7,
    ...(random() < 0.6 ? { currentMa: Math.floor(random() * 300) } : {}),
    ...(random() < 0.1 ? { voltage: pick([12, 18]) } : {}),
  }));
  const outputs =
    random() < 0.5
      ? Array.from({ length: 1 + Math.floor(random() * 10) }, () => ({
          voltage: pick([9, 9, 9, 12, 18]),
          currentMa: pick([100, 250, 500]),
          isolated: random() < 0.8,
        }))
      : undefined;
  return {
    surfaceId: pick(demoPriceBook.surfaces).id,
    caseId: pick(demoPriceBook.cases).id,
    routing: { mode },
    pedals,
    functions: demoPriceBook.functions.filter(() => random() < 0.15).map((f) => f.code),
    level: pick(['apprentice', 'journeyman', 'master']),
    ...(outputs ? { powerSupply: { outputs } } : {}),
  };
}

const configurations = Array.from({ length: COUNT }, randomConfiguration);
for (let i = 0; i < WARMUP; i++) estimateRig(configurations[i % COUNT], demoPriceBook, { version: 1 });

const times = new Float64Array(COUNT);
let checksum = 0;
const cpuStarted = process.cpuUsage();
const started = process.hrtime.bigint();
for (let i = 0; i < COUNT; i++) {
  const t0 = process.hrtime.bigint();
  const result = estimateRig(configurations[i], demoPriceBook, { version: 1 });
  times[i] = Number(process.hrtime.bigint() - t0) / 1e6;
  checksum += result.lines.length;
}
const elapsedMs = Number(process.hrtime.bigint() - started) / 1e6;
const cpu = process.cpuUsage(cpuStarted);
const cpuMs = (cpu.user + cpu.system) / 1000;
times.sort();
const pct = (p) => times[Math.min(COUNT - 1, Math.floor((p / 100) * COUNT))];

console.log(`estimates:         ${COUNT} random configurations (1–20 pedals, serial or switcher, with checks)`);
console.log(`elapsed:           ${elapsedMs.toFixed(0)} ms`);
console.log(`estimates/second:  ${Math.round(COUNT / (elapsedMs / 1000))}`);
// On a shared machine the wall clock includes time the process waited for a core; CPU time does not.
console.log(`CPU time:          ${cpuMs.toFixed(0)} ms (${((cpuMs / COUNT) * 1000).toFixed(1)} µs CPU per estimate)`);
console.log(`p50 per estimate:  ${pct(50).toFixed(4)} ms`);
console.log(`p99 per estimate:  ${pct(99).toFixed(4)} ms`);
console.log(`max per estimate:  ${times[COUNT - 1].toFixed(4)} ms`);
console.log(`node ${process.version}, lines priced ${checksum}`);
