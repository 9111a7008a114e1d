#!/usr/bin/env node
// How much gzipped JavaScript the configurator's first load ships: the entry chunk, the /configure
// route chunk and the first step's chunk, with every chunk they import statically. Reads Vite's
// build manifest (storefront/dist/.vite/manifest.json), so run `npm run build -w storefront` first.
// Prints figures; it judges nothing (the budget is printed beside them for the reader).
import { existsSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { brotliCompressSync, gzipSync } from 'node:zlib';

const here = path.dirname(fileURLToPath(import.meta.url));
const dist = path.resolve(here, '../../storefront/dist');
const manifest = JSON.parse(readFileSync(path.join(dist, '.vite/manifest.json'), 'utf8'));

const entryKey = Object.keys(manifest).find((k) => manifest[k].isEntry);
const routeKey = Object.keys(manifest).find((k) => k.endsWith('app/routes/configure.tsx'));
const firstStepKey = Object.keys(manifest).find((k) => k.endsWith('steps/SurfaceStep.tsx'));
// The Surface step may have its own chunk or ship inside the /configure route's.
if (!entryKey || !routeKey) throw new Error('manifest lacks the entry or the /configure route');

/** A chunk with everything it imports statically (what the browser must fetch before it runs). */
function closure(key, seen = new Set()) {
  if (seen.has(key)) return seen;
  seen.add(key);
  for (const dep of manifest[key].imports ?? []) closure(dep, seen);
  return seen;
}

const gz = (file) => gzipSync(readFileSync(path.join(dist, file)), { level: 9 }).length;
// The build's .br copy (what the API sends a browser that accepts brotli), else brotli 11 here.
const br = (file) =>
  existsSync(path.join(dist, `${file}.br`))
    ? statSync(path.join(dist, `${file}.br`)).size
    : brotliCompressSync(readFileSync(path.join(dist, file))).length;
const kB = (bytes) => (bytes / 1000).toFixed(process.env.BUNDLE_DIGITS ? Number(process.env.BUNDLE_DIGITS) : 1);

const groups = [
  ['entry (every page)', closure(entryKey)],
  ['/configure route', closure(routeKey)],
  ...(firstStepKey ? [['Surface step (first step)', closure(firstStepKey)]] : []),
];
// configure.html starts its modules with a small classic script of its own once the prerendered
// page has been painted (storefront/route-pages.ts); it is not in the manifest, but it is first-load JavaScript.
const loader = readFileSync(path.join(dist, 'configure.html'), 'utf8').match(/<script defer src="\/([^"]+)"/)?.[1];
const counted = new Set();
let total = loader ? gz(loader) : 0;
let totalBrotli = loader ? br(loader) : 0;
console.log('Storefront first load of /configure, gzipped JavaScript (gzip level 9):');
if (loader) console.log(`  ${kB(total).padStart(7)} kB  ${loader} (loads the modules once the page is painted)`);
for (const [label, keys] of groups) {
  let sum = 0;
  for (const key of keys) {
    if (counted.has(key)) continue;
    counted.add(key);
    const size = gz(manifest[key].file);
    totalBrotli += br(manifest[key].file);
    sum += size;
    console.log(`    ${kB(size).padStart(7)} kB  ${manifest[key].file}`);
  }
  total += sum;
  console.log(`  ${kB(sum).padStart(7)} kB  ${label}`);
}
console.log(`  ${kB(total).padStart(7)} kB  total first load (budget 170 kB, aim 150 kB)`);
console.log(`  ${kB(totalBrotli).padStart(7)} kB  the same, brotli (as the API sends it to a browser that accepts br)`);

const later = Object.keys(manifest).filter((k) => k.includes('/steps/') && k.endsWith('Step.tsx') && k !== firstStepKey);
for (const key of later) {
  const extra = [...closure(key)].filter((k) => !counted.has(k));
  const size = extra.reduce((s, k) => s + gz(manifest[k].file), 0);
  console.log(`  later: ${path.basename(key, '.tsx').padEnd(12)} +${kB(size)} kB on first visit to that step`);
}
