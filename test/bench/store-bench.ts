// Runs inside real Chromium (served by Vite for `npm run bench`): the record store at scale.
import { getDb, listDay, resetDb, saveSample } from '../../src/store';
import { Sample } from '../../src/records/schema';
import { demoRecords } from '../../src/demo/scenario';
import { longCsv, wideCsv } from '../../src/exchange/csv';
import { startExport } from '../../src/exchange/export-job';
import type { StreamedExportKind } from '../../src/exchange/export-stream';
import { listSamplesBetween, listSites } from '../../src/store/records';
import { loadDemo } from '../../src/demo/load';
import { DEFAULT_PROFILE } from '../../src/chemistry';
import { generatedDay } from '../exchange/generated-day';
import { DEFAULT_SETTINGS } from '../../src/records/defaults';
import { derivedCache } from '../../src/records/derived-cache';

function quantile(sorted: number[], q: number): number {
  const pos = (sorted.length - 1) * q;
  const lo = Math.floor(pos), hi = Math.ceil(pos);
  return sorted[lo]! + (sorted[hi]! - sorted[lo]!) * (pos - lo);
}

/** n samples spread over n/30 days (a crew's ~30 samples a day), valid records built from the demo's shapes. */
async function seed(n: number): Promise<string> {
  const template = demoRecords(new Date('2026-06-14T12:00:00')).samples[1]!;
  const db = await getDb();
  const start = Date.parse('2024-01-01T08:00:00Z');
  let busiest = '';
  const batch = 2000;
  for (let i = 0; i < n; i += batch) {
    const tx = db.transaction('samples', 'readwrite');
    for (let k = i; k < Math.min(n, i + batch); k++) {
      const day = Math.floor(k / 30);
      const t = new Date(start + day * 86_400_000 + (k % 30) * 900_000).toISOString().replace(/\.\d{3}Z$/, 'Z');
      const s = Sample.parse({ ...template, id: `bench-${k}`, time: t, localDate: t.slice(0, 10), createdAt: t, updatedAt: t, demo: false });
      void tx.store.put(s);
      busiest = t.slice(0, 10);
    }
    await tx.done;
  }
  return busiest;
}

async function emptyDb(): Promise<void> {
  await resetDb();
  await new Promise<void>((res, rej) => {
    const r = indexedDB.deleteDatabase('bankside');
    r.onsuccess = () => res();
    r.onerror = () => rej(r.error);
  });
}

/** Samples or values CSV of the dates from..to, written in the export worker (as the Send screen does). */
async function workerExport(kind: StreamedExportKind, from: string, to: string): Promise<{ file: Uint8Array; ms: number; bytes: number; longestTaskMs: number }> {
  let longest = 0;
  const obs = new PerformanceObserver((l) => { for (const e of l.getEntries()) longest = Math.max(longest, e.duration); });
  obs.observe({ type: 'longtask' });
  const t0 = performance.now();
  const out = await startExport({ kind, selection: { scope: 'dates', from, to }, settings: DEFAULT_SETTINGS, profile: DEFAULT_PROFILE, bom: true }).result;
  const ms = performance.now() - t0;
  await new Promise((r) => setTimeout(r, 50));
  obs.disconnect();
  if (out.status !== 'done') throw new Error('export did not finish');
  // the file's bytes (BOM included) are read only when small enough to hand back for comparison
  return { file: out.blob.size < 50e6 ? new Uint8Array(await out.blob.arrayBuffer()) : new Uint8Array(), ms, bytes: out.blob.size, longestTaskMs: longest };
}

/** The same export written on the page in one piece and in the worker in chunks, from the same store. */
async function compareExports(what: 'demo' | number, kind: 'csv-wide' | 'csv-long') {
  await emptyDb();
  let date: string;
  if (what === 'demo') {
    await loadDemo(new Date('2026-06-14T12:00:00'));
    date = '2026-06-14';
  } else {
    date = '2025-08-20';
    const day = generatedDay(what, date);
    const db = await getDb();
    const tx = db.transaction(['samples', 'sites'], 'readwrite');
    for (const s of day.sites) void tx.objectStore('sites').put(s);
    for (const s of day.samples) void tx.objectStore('samples').put(s);
    await tx.done;
  }
  derivedCache.clear();
  const ctx = { samples: await listSamplesBetween(date, date), sites: await listSites(), settings: DEFAULT_SETTINGS, profile: DEFAULT_PROFILE };
  // the page's file as the download would hold it: UTF-8 bytes
  const page = new TextEncoder().encode(kind === 'csv-wide' ? wideCsv(ctx, { bom: true }) : longCsv(ctx, { bom: true }));
  const worker = (await workerExport(kind, date, date)).file;
  let firstDiff = -1;
  for (let i = 0; i < Math.max(page.length, worker.length); i++) if (page[i] !== worker[i]) { firstDiff = i; break; }
  return { samples: ctx.samples.length, pageLength: page.length, workerLength: worker.length, identical: firstDiff === -1, firstDiff };
}

async function run(n: number) {
  await emptyDb();
  const t0 = performance.now();
  const day = await seed(n);
  const seedMs = performance.now() - t0;
  const template = demoRecords(new Date('2026-06-14T12:00:00')).samples[0]!;
  const saves: number[] = [];
  for (let i = 0; i < 60; i++) {
    const a = performance.now();
    await saveSample({ ...template, id: `bench-new-${i}`, demo: false }, 'bench');
    saves.push(performance.now() - a);
  }
  saves.sort((a, b) => a - b);
  const lists: number[] = [];
  for (let i = 0; i < 10; i++) {
    const a = performance.now();
    const rows = await listDay(day);
    lists.push(performance.now() - a);
    if (rows.length === 0) throw new Error('empty day');
  }
  lists.sort((a, b) => a - b);
  // cold: nothing derived yet; warm: the same export again, derived results from the cache
  derivedCache.clear();
  const e0 = performance.now();
  const all = await (await getDb()).getAll('samples');
  const csv = wideCsv({ samples: all, sites: [], settings: DEFAULT_SETTINGS });
  const exportMs = performance.now() - e0;
  if (csv.length < all.length * 100) throw new Error('export too short');
  const w0 = performance.now();
  const again = wideCsv({ samples: await (await getDb()).getAll('samples'), sites: [], settings: DEFAULT_SETTINGS });
  const exportWarmMs = performance.now() - w0;
  if (again !== csv) throw new Error('warm export differs from cold export');
  derivedCache.clear();
  return {
    exportMs, exportWarmMs, n, seedMs, saveP95: quantile(saves, 0.95), saveMedian: quantile(saves, 0.5), listDayMedian: quantile(lists, 0.5), listDayMax: lists[lists.length - 1] };
}

(window as unknown as { runStoreBench: typeof run }).runStoreBench = run;
(window as unknown as { compareExports: typeof compareExports }).compareExports = compareExports;
/** every stored sample's file, written in the worker (bench.mjs watches the tab's memory meanwhile) */
(window as unknown as { workerExportAll(kind: StreamedExportKind): Promise<unknown> }).workerExportAll = async (kind) => {
  const r = await workerExport(kind, '0000-01-01', '9999-12-31');
  return { ms: r.ms, bytes: r.bytes, longestTaskMs: r.longestTaskMs };
};
(window as unknown as { benchReady: boolean }).benchReady = true;
