// `npm run bench`: measured figures with budgets, printed as one table and written to
// bench-results.json (git-ignored). Figures are measurements on this machine, not tests.
import { runnerImport } from 'vite';
import { readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';

const { module: engine } = await runnerImport('./src/chemistry/index.ts');

const rows = [];
function row(area, what, value, unit, budget, pass) {
  rows.push({ area, what, value, unit, budget, pass });
}
function quantile(sorted, q) {
  const pos = (sorted.length - 1) * q;
  const lo = Math.floor(pos), hi = Math.ceil(pos);
  return sorted[lo] + (sorted[hi] - sorted[lo]) * (pos - lo);
}

// --- engine: a full analyzeSample with the uncertainty band, over varied field waters ---
function waters(n) {
  let s = 12345;
  const r = () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648);
  return Array.from({ length: n }, () => ({
    tempC: 2 + 25 * r(), pH: 6.5 + 2 * r(), scUsPerCm: 50 + 900 * r(), alkalinityMgLCaCO3: 20 + 250 * r(), caMgL: 5 + 100 * r(),
  }));
}
const fieldSet = waters(2000);
for (const w of fieldSet.slice(0, 300)) engine.analyzeSample(w); // warm up the JIT
const times = [];
const t0 = performance.now();
for (const w of fieldSet) {
  const a = performance.now();
  engine.analyzeSample(w);
  times.push(performance.now() - a);
}
const total = performance.now() - t0;
times.sort((a, b) => a - b);
const med = quantile(times, 0.5), p99 = quantile(times, 0.99);
row('engine', 'analyzeSample (field minimum + uncertainty), median', med, 'ms', '≤ 0.5 ms', med <= 0.5);
row('engine', 'analyzeSample, 99th percentile (wall clock)', p99, 'ms', '≤ 2 ms', p99 <= 2);
// On a shared machine the wall-clock tail is mostly waiting for other processes: the fastest of five
// runs of each water gives the engine's own cost per water, whose 99th percentile is the honest tail.
const best = fieldSet.map((w) => {
  let m = Infinity;
  for (let k = 0; k < 5; k++) {
    const a = performance.now();
    engine.analyzeSample(w);
    m = Math.min(m, performance.now() - a);
  }
  return m;
}).sort((a, b) => a - b);
row('engine', 'analyzeSample, 99th percentile (fastest of 5 per water)', quantile(best, 0.99), 'ms', '≤ 2 ms', quantile(best, 0.99) <= 2);
row('engine', 'analyses per second', (fieldSet.length / total) * 1000, '/s', '', null);

const full = { tempC: 11, pH: 8.4, scUsPerCm: 256, alkalinityMgLCaCO3: 120, caMgL: 31, mgMgL: 8.5, naMgL: 9.8, kMgL: 2.2, clMgL: 6.5, so4MgL: 7.2 };
const ft = [];
for (let i = 0; i < 1000; i++) {
  const a = performance.now();
  engine.analyzeSample(full);
  ft.push(performance.now() - a);
}
ft.sort((a, b) => a - b);
row('engine', 'analyzeSample (full major ions), median', quantile(ft, 0.5), 'ms', '≤ 0.5 ms', quantile(ft, 0.5) <= 0.5);

// --- bundle: what a crew downloads on weak signal ---
{
  const { build } = await import('vite');
  const { readFileSync, readdirSync, statSync } = await import('node:fs');
  const { gzipSync } = await import('node:zlib');
  const { join } = await import('node:path');
  await build({ logLevel: 'silent' });
  const html = readFileSync('dist/index.html', 'utf8');
  const gz = (f) => gzipSync(readFileSync(join('dist', f))).length / 1024;
  const initialJs = [...html.matchAll(/(?:src|href)="\.?\/(assets\/[^"]+\.js)"/g)].map((m) => m[1]);
  const initialCss = [...html.matchAll(/href="\.?\/(assets\/[^"]+\.css)"/g)].map((m) => m[1]);
  const jsKb = initialJs.reduce((a, f) => a + gz(f), 0);
  const cssKb = initialCss.reduce((a, f) => a + gz(f), 0);
  const walk = (d) => readdirSync(d).flatMap((n) => (statSync(join(d, n)).isDirectory() ? walk(join(d, n)) : [join(d, n)]));
  const precacheKb = walk('dist').filter((f) => !f.endsWith('sw.js')).reduce((a, f) => a + statSync(f).size, 0) / 1024;
  row('bundle', 'initial JS, gzip', jsKb, 'kB', '≤ 35 kB', jsKb <= 35);
  row('bundle', 'initial CSS, gzip', cssKb, 'kB', '', null);
  row('bundle', 'total precache (uncompressed)', precacheKb, 'kB', '', null);
}

// --- office command: memory flat in the number of rows (streams; a million rows ≤ 300 MB) ---
if (!process.argv.includes('--no-office')) {
  const { recomputeBench } = await import('./recompute-bench.mjs');
  const n = Number(process.env.BENCH_OFFICE_ROWS ?? 1_000_000);
  const r = await recomputeBench(n);
  row('office', `recompute ${n.toLocaleString('en')} rows: peak memory (maxRSS)`, r.maxRssMb, 'MB', '≤ 300 MB', r.maxRssMb <= 300);
  row('office', `recompute ${n.toLocaleString('en')} rows: rows per second`, r.rows / r.seconds, '/s', '', null);
}

/**
 * Peak resident memory of this benchmark's tab: the largest Chromium renderer process (the page and
 * its dedicated worker share one) among the descendants of the browser started with --bankside-bench.
 */
function watchRendererMemory() {
  const read = (p) => { try { return readFileSync(p, 'utf8'); } catch { return ''; } };
  const pids = () => readdirSync('/proc').filter((d) => /^\d+$/.test(d));
  const root = pids().find((p) => { const c = read(`/proc/${p}/cmdline`); return c.includes('--bankside-bench') && !c.includes('--type='); });
  const parent = (p) => Number(/PPid:\s+(\d+)/.exec(read(`/proc/${p}/status`))?.[1] ?? 0);
  const descends = (p) => { for (let q = Number(p), i = 0; q > 1 && i < 6; q = parent(q), i++) if (String(q) === root) return true; return false; };
  let peak = 0;
  const poll = () => {
    for (const p of pids()) {
      if (!read(`/proc/${p}/cmdline`).includes('--type=renderer') || !descends(p)) continue;
      const kb = Number(/VmRSS:\s+(\d+)/.exec(read(`/proc/${p}/status`))?.[1] ?? 0);
      peak = Math.max(peak, kb / 1024);
    }
  };
  poll();
  const timer = setInterval(poll, 100);
  return { stop: () => { clearInterval(timer); poll(); return peak; } };
}

// --- store: real Chromium, real IndexedDB, at 1,000 / 10,000 / 50,000 samples ---
if (!process.argv.includes('--engine-only')) {
  const { createServer } = await import('vite');
  const { chromium } = await import('playwright-core');
  const server = await createServer({ logLevel: 'error', server: { port: 0, host: '127.0.0.1' } });
  await server.listen();
  const url = server.resolvedUrls.local[0];
  const browser = await chromium.launch({
    executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
    args: ['--bankside-bench', '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
  });
  try {
    const page = await browser.newPage();
    await page.goto(url + 'test/bench/store-bench.html');
    await page.waitForFunction(() => window.benchReady === true, null, { timeout: 60_000 });
    for (const n of [1000, 10000, 50000]) {
      const r = await page.evaluate((k) => window.runStoreBench(k), n);
      const at10k = n === 10000;
      row('store', `save one sample, p95 (${n.toLocaleString('en')} stored)`, r.saveP95, 'ms', at10k ? '≤ 20 ms' : '', at10k ? r.saveP95 <= 20 : null);
      if (n === 50000) {
        // exports in the worker at 50,000 samples: the page's longest task and the tab's peak memory
        const cdp = await page.context().newCDPSession(page);
        await cdp.send('HeapProfiler.collectGarbage');
        for (const [kind, label] of [['csv-wide', 'samples'], ['csv-long', 'values']]) {
          const mem = watchRendererMemory();
          const w = await page.evaluate((k) => window.workerExportAll(k), kind);
          const peakMb = mem.stop();
          row('export', `${label} CSV of 50,000 in the worker, total time`, w.ms, 'ms', '', null);
          row('export', `${label} CSV of 50,000: file size`, w.bytes / 1e6, 'MB', '', null);
          row('export', `${label} CSV of 50,000: longest main-thread task`, w.longestTaskMs, 'ms', '≤ 100 ms', w.longestTaskMs <= 100);
          row('export', `${label} CSV of 50,000: peak tab memory (RSS)`, peakMb, 'MB', kind === 'csv-long' ? '< 500 MB' : '', kind === 'csv-long' ? peakMb < 500 : null);
        }
      }
      row('store', `list one day (30 samples), median (${n.toLocaleString('en')} stored)`, r.listDayMedian, 'ms', at10k ? '≤ 100 ms' : '', at10k ? r.listDayMedian <= 100 : null);
      row('export', `samples CSV of ${n.toLocaleString('en')}, cold (read, derive, write)`, r.exportMs, 'ms', at10k ? '≤ 1000 ms' : '', at10k ? r.exportMs <= 1000 : null);
      row('export', `samples CSV of ${n.toLocaleString('en')}, warm (derived cache)`, r.exportWarmMs, 'ms', at10k ? '≤ 300 ms' : '', at10k ? r.exportWarmMs <= 300 : null);
    }
    const { siteOpen } = await import('./sitebench.mjs');
    const so = await siteOpen(browser);
    row('lists', `site page with ${so.n.toLocaleString('en')} samples opens (median of 3)`, so.openMs, 'ms', '≤ 300 ms', so.openMs <= 300);
    row('lists', 'rows rendered on a 360 × 780 screen', so.rows, '', '', null);
    row('lists', 'longest main-thread task while it opens and draws', so.longest, 'ms', '', null);
    const { coldStart } = await import('./coldstart.mjs');
    const cs = await coldStart(browser);
    row('start', 'cold start offline, 4× CPU: first paint (Bankside)', cs.app.fcp, 'ms', '', null);
    row('start', 'cold start offline, 4× CPU: first paint (bare Preact)', cs.bare.fcp, 'ms', '', null);
    row('start', 'new-sample form accepts input (Bankside)', cs.app.ready, 'ms', '', null);
    row('start', 'input accepts input (bare Preact)', cs.bare.ready, 'ms', '', null);
    const ratio = cs.app.ready / cs.bare.ready;
    row('start', 'ratio Bankside / bare, time to input', ratio, '×', '≤ 1.3×', ratio <= 1.3);
    const fcpRatio = cs.app.fcp / cs.bare.fcp;
    row('start', 'ratio Bankside / bare, first paint', fcpRatio, '×', '≤ 1.2×', fcpRatio <= 1.2);
  } finally {
    await browser.close();
    await server.close();
  }
}

// --- print ---
const fmt = (v) => (Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 1 ? v.toFixed(2) : v.toFixed(4));
console.log('\nBankside benchmark (' + new Date().toISOString() + ', node ' + process.version + ')\n');
console.log('area     | figure                                                | value        | budget     | result');
console.log('---------|-------------------------------------------------------|--------------|------------|-------');
for (const r of rows) {
  console.log(
    `${r.area.padEnd(8)} | ${r.what.padEnd(53)} | ${(fmt(r.value) + ' ' + r.unit).padEnd(12)} | ${r.budget.padEnd(10)} | ${r.pass === null ? '' : r.pass ? 'pass' : 'FAIL'}`,
  );
}
writeFileSync('bench-results.json', JSON.stringify({ when: new Date().toISOString(), node: process.version, rows }, null, 2));
console.log('\nwritten: bench-results.json');
