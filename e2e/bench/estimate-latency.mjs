#!/usr/bin/env node
// Time from the estimate debounce firing to the new figures on screen, in Debian's Chromium on
// loopback. The storefront marks both moments (performance marks 'lw:estimate-requested' and
// 'lw:estimate-shown', measure 'lw:estimate-latency'); this script changes the pedal count
// RUNS times, each to a count not asked before (so no cached answer), and prints the spread.
// Needs the product running: BENCH_URL=http://localhost:3105 node e2e/bench/estimate-latency.mjs
import { chromium } from '@playwright/test';
import { chromiumLaunchOptions } from '../stack-env.mjs';
import { latencyBoardLink } from './latency-board.mjs';

const baseUrl = process.env.BENCH_URL ?? 'http://localhost:3000';
const runs = Number(process.env.RUNS ?? 30);

const browser = await chromium.launch(chromiumLaunchOptions);
try {
  const page = await browser.newPage({ viewport: { width: 1440, height: 1000 } });
  await page.goto(`${baseUrl}/configure?step=pedals&c=${latencyBoardLink()}`);
  await page.getByTestId('estimate-total').filter({ hasText: '$' }).waitFor();
  const more = page.getByRole('button', { name: 'One pedal more' });
  const durations = [];
  for (let i = 0; i < runs; i++) {
    const seen = await page.evaluate(() => performance.getEntriesByName('lw:estimate-latency').length);
    await more.click();
    await page.waitForFunction((n) => performance.getEntriesByName('lw:estimate-latency').length > n, seen, { timeout: 10_000 });
    durations.push(await page.evaluate(() => performance.getEntriesByName('lw:estimate-latency').at(-1).duration));
  }
  const sorted = [...durations].sort((a, b) => a - b);
  const at = (q) => sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
  const ms = (v) => `${v.toFixed(1)} ms`;
  console.log(`Estimate latency, debounce fired → figures committed on screen (${runs} changes, Chromium, ${baseUrl}):`);
  console.log(`  min ${ms(sorted[0])} · median ${ms(at(0.5))} · p95 ${ms(at(0.95))} · max ${ms(sorted.at(-1))} (target: within 100 ms)`);
} finally {
  await browser.close();
}
