#!/usr/bin/env node
// Compares storefront builds' first loads side by side, interleaved in the same minutes, so a busy
// machine slows both alike: each build is served from its own port the way the API serves it
// (home.html for /, configure.html for /configure, index.html otherwise, scripts as their .br
// copies), with /api passed to a running product (`npm start`, or the bench's stack). Per round, per
// build, per page: Lighthouse 12 (mobile preset unless AB_PRESET=desktop) and the main thread's busy
// time in Chromium at 412 px with 4x CPU throttling (CDP Performance.getMetrics TaskDuration and
// ScriptDuration, and the trace's tasks over 50 ms). Prints every run and the medians; judges nothing.
//
//   node e2e/bench/first-load-ab.mjs OLD_DIST NEW_DIST [...]
//   AB_API=http://127.0.0.1:3250 AB_ROUNDS=5 AB_PORT=3260 AB_ROUTES=/,/configure AB_SKIP=lighthouse|cdp
import { createServer, request } from 'node:http';
import { existsSync, readFileSync, statSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { chromiumLaunchOptions, lighthouseChromeOptions } from '../stack-env.mjs';

const require = createRequire(import.meta.url);
const env = process.env;
const dists = process.argv.slice(2).map((d) => path.resolve(d));
if (dists.length < 1) throw new Error('usage: first-load-ab.mjs DIST [DIST…]');
const api = new URL(env.AB_API ?? `http://127.0.0.1:${env.PORT ?? 3000}`);
const rounds = Number(env.AB_ROUNDS ?? 5);
const firstPort = Number(env.AB_PORT ?? 3260);
const routes = (env.AB_ROUTES ?? '/,/configure').split(',');
const preset = env.AB_PRESET ?? 'mobile';
const skip = new Set((env.AB_SKIP ?? '').split(','));
const types = {
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript',
  '.css': 'text/css',
  '.woff2': 'font/woff2',
  '.svg': 'image/svg+xml',
};

/** A static server for one build, with /api passed through to the product. */
function serve(dist, port) {
  const server = createServer((req, res) => {
    const url = new URL(req.url, 'http://x');
    if (url.pathname.startsWith('/api/')) {
      const upstream = request(
        { host: api.hostname, port: api.port, path: req.url, method: req.method, headers: { ...req.headers, host: api.host } },
        (answer) => {
          res.writeHead(answer.statusCode, answer.headers);
          answer.pipe(res);
        },
      );
      req.pipe(upstream);
      return;
    }
    const pageFile = { '/': 'home.html', '/configure': 'configure.html' }[url.pathname];
    let file = path.join(dist, pageFile ?? url.pathname);
    if (!file.startsWith(dist) || !existsSync(file) || !statSync(file).isFile()) file = path.join(dist, pageFile ?? 'index.html');
    if (!existsSync(file)) file = path.join(dist, 'index.html');
    const headers = { 'content-type': types[path.extname(file)] ?? 'application/octet-stream', 'cache-control': 'no-cache' };
    if (/\.(js|css)$/.test(file) && existsSync(`${file}.br`) && /\bbr\b/.test(req.headers['accept-encoding'] ?? '')) {
      res.writeHead(200, { ...headers, 'content-encoding': 'br', vary: 'Accept-Encoding' });
      res.end(readFileSync(`${file}.br`));
    } else {
      res.writeHead(200, headers);
      res.end(readFileSync(file));
    }
  });
  return new Promise((resolve) => server.listen(port, '127.0.0.1', () => resolve(server)));
}

async function lighthouseRun(url) {
  const { default: lighthouse } = await import('lighthouse');
  const { default: desktopConfig } = await import('lighthouse/core/config/desktop-config.js');
  const chromeLauncher = await import('chrome-launcher');
  const chrome = await chromeLauncher.launch(lighthouseChromeOptions);
  try {
    const { lhr } = await lighthouse(
      url,
      { port: chrome.port, output: 'json', logLevel: 'error', onlyCategories: ['performance'] },
      preset === 'desktop' ? desktopConfig : undefined,
    );
    const v = (id) => lhr.audits[id]?.numericValue;
    return {
      perf: Math.round((lhr.categories.performance.score ?? 0) * 100),
      fcp: v('first-contentful-paint'),
      lcp: v('largest-contentful-paint'),
      tbt: v('total-blocking-time'),
      cls: v('cumulative-layout-shift'),
      si: v('speed-index'),
      mainThread: v('mainthread-work-breakdown'),
      lcpElement: lhr.audits['largest-contentful-paint-element']?.details?.items?.[0]?.items?.[0]?.node?.snippet,
    };
  } finally {
    await chrome.kill();
  }
}

let browser;
async function cdpRun(url) {
  const { chromium } = require('@playwright/test');
  browser ??= await chromium.launch(chromiumLaunchOptions);
  const context = await browser.newContext({
    viewport: { width: 412, height: 823 },
    deviceScaleFactor: 1.75,
    isMobile: true,
    hasTouch: true,
  });
  const page = await context.newPage();
  const errors = [];
  page.on('console', (m) => m.type() === 'error' && errors.push(m.text()));
  const cdp = await context.newCDPSession(page);
  await cdp.send('Performance.enable');
  // Without throttling: each task's thread CPU time (the trace's tdur) times four stands for a 4x
  // slower phone, as Lighthouse's simulation does with observed times, but without other processes'
  // load in it (wall-clock durations on a busy machine include the time the thread waited for a core).
  if (env.AB_THROTTLE) await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
  const longTasks = [];
  const cpuTasks = [];
  await cdp.send('Tracing.start', {
    categories: 'devtools.timeline,disabled-by-default-devtools.timeline,toplevel',
    transferMode: 'ReturnAsStream',
  });
  await page.goto(url, { waitUntil: 'networkidle' });
  await page.waitForTimeout(500);
  const metrics = Object.fromEntries((await cdp.send('Performance.getMetrics')).metrics.map((m) => [m.name, m.value]));
  const done = new Promise((resolve) => cdp.once('Tracing.tracingComplete', resolve));
  await cdp.send('Tracing.end');
  const { stream } = await done;
  let text = '';
  for (;;) {
    const chunk = await cdp.send('IO.read', { handle: stream });
    text += chunk.data;
    if (chunk.eof) break;
  }
  await cdp.send('IO.close', { handle: stream });
  const events = JSON.parse(text).traceEvents ?? JSON.parse(text);
  const mainPid = events.find((e) => e.name === 'TracingStartedInBrowser')?.args?.data?.frames?.[0]?.processId;
  const mainTid = events.find((e) => e.name === 'thread_name' && e.args?.name === 'CrRendererMain' && (!mainPid || e.pid === mainPid))?.tid;
  for (const e of events)
    // Complete events only (a task cut by the end of the trace has no duration).
    if (e.name === 'RunTask' && e.tid === mainTid && (!mainPid || e.pid === mainPid) && e.dur !== undefined) {
      cpuTasks.push((e.tdur ?? e.dur) / 1000);
      if (env.AB_CPU_TASKS && e.tdur > 12_500) {
        const inside = events.filter(
          (c) =>
            c.tid === e.tid &&
            c.pid === e.pid &&
            c.ts >= e.ts &&
            c.ts + (c.dur ?? 0) <= e.ts + e.dur &&
            c !== e &&
            (c.tdur ?? 0) > 2000 &&
            !c.name.startsWith('V8.GC') &&
            c.name !== 'ThreadControllerImpl::RunTask',
        );
        console.log(
          `  task at ${((e.ts - events.find((x) => x.name === 'TracingStartedInBrowser').ts) / 1000).toFixed(0)} ms, CPU ${(e.tdur / 1000).toFixed(1)} ms: ${inside.map((c) => `${c.name}${c.args?.data?.url ? `(${path.basename(c.args.data.url)})` : c.args?.data?.functionName ? `(${c.args.data.functionName})` : ''} ${(c.tdur / 1000).toFixed(1)}`).join(', ')}`,
        );
      }
    }
  for (const e of events)
    if (e.name === 'RunTask' && e.tid === mainTid && (!mainPid || e.pid === mainPid) && e.dur > 50_000) {
      longTasks.push(e.dur / 1000);
      if (env.AB_TASKS) {
        // What the long task did: the events inside it on the same thread, by name, with the script's URL.
        const inside = events.filter(
          (c) => c.tid === e.tid && c.pid === e.pid && c.ts >= e.ts && c.ts + (c.dur ?? 0) <= e.ts + e.dur && c !== e && c.dur > 3000,
        );
        console.log(
          `  long task at ${((e.ts - events.find((x) => x.name === 'TracingStartedInBrowser').ts) / 1000).toFixed(0)} ms, ${(e.dur / 1000).toFixed(0)} ms: ${inside.map((c) => `${c.name}${c.args?.data?.url ? `(${path.basename(c.args.data.url)})` : c.args?.data?.functionName ? `(${c.args.data.functionName})` : ''} ${(c.dur / 1000).toFixed(0)}`).join(', ')}`,
        );
      }
    }
  const lcp = await page.evaluate(
    () =>
      new Promise((resolve) => {
        new PerformanceObserver((list) => {
          const entries = list.getEntries();
          const last = entries[entries.length - 1];
          resolve({ at: last.startTime, element: last.element?.tagName + (last.element?.textContent ?? '').slice(0, 40) });
        }).observe({ type: 'largest-contentful-paint', buffered: true });
      }),
  );
  await context.close();
  return {
    task: metrics.TaskDuration * 1000,
    script: metrics.ScriptDuration * 1000,
    layout: metrics.LayoutDuration * 1000,
    style: metrics.RecalcStyleDuration * 1000,
    long: longTasks.reduce((s, d) => s + d, 0),
    blocking: longTasks.reduce((s, d) => s + d - 50, 0),
    longest: Math.max(0, ...longTasks),
    lcpAt: lcp.at,
    cpu: cpuTasks.reduce((sum, d) => sum + d, 0),
    cpuBlocking4x: cpuTasks.reduce((sum, d) => sum + Math.max(0, 4 * d - 50), 0),
    cpuLongest: Math.max(0, ...cpuTasks),
    lcpElement: lcp.element,
    errors,
  };
}

const median = (values) => {
  const s = values.filter((v) => v !== undefined).sort((a, b) => a - b);
  return s.length ? (s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2) : undefined;
};
const f = (v) => (v === undefined ? '–' : v >= 100 ? Math.round(v) : v.toFixed(v < 1 ? 3 : 1));

const servers = await Promise.all(dists.map((d, i) => serve(d, firstPort + i)));
if (env.AB_SERVE_ONLY) {
  // Serve the builds (for a profiler or a browser by hand) until stopped.
  dists.forEach((d, i) => console.log(`http://127.0.0.1:${firstPort + i}/ serves ${d}`));
  await new Promise(() => {});
}
const results = {};
try {
  for (let round = 1; round <= rounds; round++) {
    for (const route of routes) {
      for (let i = 0; i < dists.length; i++) {
        // Alternate which build goes first, so neither always follows the other.
        const d = round % 2 ? i : dists.length - 1 - i;
        const url = `http://127.0.0.1:${firstPort + d}${route}`;
        const key = `${route} ${path.relative(process.cwd(), dists[d])}`;
        results[key] ??= { lh: [], cdp: [] };
        const load = readFileSync('/proc/loadavg', 'utf8').split(' ')[0];
        if (!skip.has('lighthouse')) {
          const r = await lighthouseRun(url);
          results[key].lh.push(r);
          console.log(
            `round ${round} ${key} lighthouse ${preset}: perf ${r.perf} FCP ${f(r.fcp)} LCP ${f(r.lcp)} TBT ${f(r.tbt)} CLS ${f(r.cls)} SI ${f(r.si)} main ${f(r.mainThread)} (load ${load}) ${r.lcpElement ?? ''}`,
          );
        }
        if (!skip.has('cdp')) {
          const r = await cdpRun(url);
          results[key].cdp.push(r);
          console.log(
            `round ${round} ${key} cdp: CPU ${f(r.cpu)} blocking at 4x CPU ${f(r.cpuBlocking4x)} longest CPU ${f(r.cpuLongest)} | wall: task ${f(r.task)} script ${f(r.script)} layout ${f(r.layout)} style ${f(r.style)} long ${f(r.long)} blocking ${f(r.blocking)} longest ${f(r.longest)} LCP ${f(r.lcpAt)} ${r.lcpElement}${r.errors.length ? ` CONSOLE ERRORS: ${r.errors.join(' | ')}` : ''}`,
          );
        }
      }
    }
  }
} finally {
  await browser?.close();
  for (const s of servers) s.close();
}
console.log(`\nmedians of ${rounds} rounds (ms; Lighthouse ${preset}; CDP at 412 px, 4x CPU)`);
for (const [key, { lh, cdp }] of Object.entries(results)) {
  const m = (list, k) => f(median(list.map((r) => r[k])));
  console.log(
    `${key.padEnd(40)} ${lh.length ? `perf ${m(lh, 'perf')} FCP ${m(lh, 'fcp')} LCP ${m(lh, 'lcp')} TBT ${m(lh, 'tbt')} CLS ${m(lh, 'cls')} SI ${m(lh, 'si')} ` : ''}${cdp.length ? `| CPU ${m(cdp, 'cpu')} blocking4x ${m(cdp, 'cpuBlocking4x')} longestCPU ${m(cdp, 'cpuLongest')} | wall task ${m(cdp, 'task')} script ${m(cdp, 'script')} blocking ${m(cdp, 'blocking')} longest ${m(cdp, 'longest')} LCP ${m(cdp, 'lcpAt')}` : ''}`,
  );
}
