#!/usr/bin/env node
// Time from the estimate debounce firing to the new figures on screen, in Debian's Chromium on
// loopback. The storefront marks both moments (performance marks 'lw:estimate-requested' and
// 'lw:estimate-shown', measure 'lw:estimate-latency'); this script changes the pedal count
// RUNS times, each to a count not asked before (so no cached answer), and prints the spread.
// Needs the product running: BENCH_URL=http://localhost:3105 node e2e/bench/estimate-latency.mjs
import { measureEstimateLatency } from './latency-board.mjs';

const baseUrl = process.env.BENCH_URL ?? 'http://localhost:3000';
const runs = Number(process.env.RUNS ?? 30);

const durations = await measureEstimateLatency(baseUrl, runs);
const sorted = [...durations].sort((a, b) => a - b);
const at = (q) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
const ms = (v) => `${v.toFixed(1)} ms`;
console.log(`Estimate latency, debounce fired → figures committed on screen (${durations.length} changes, Chromium, ${baseUrl}):`);
console.log(`  min ${ms(sorted[0])} · median ${ms(at(0.5))} · p95 ${ms(at(0.95))} · max ${ms(sorted.at(-1))} (target: within 100 ms)`);
