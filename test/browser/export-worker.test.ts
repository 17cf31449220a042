// Exports run in a worker, chunk by chunk: the downloaded file is byte for byte what the one-piece
// export functions write from the same stored records (demo day; a generated 10,000-sample day), and a
// cancelled export leaves nothing behind (no file, no export-log entry). Expected values: the export
// functions' own output; no published reference values are checked here.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { generatedDay } from '../exchange/generated-day';
import { launch, openControlled, phoneContext, serveDist, shot, type Served } from './helpers';

let browser: Browser;
let served: Served;
beforeAll(async () => {
  browser = await launch();
  served = await serveDist();
});
afterAll(async () => {
  await browser?.close();
  await served?.close();
});

/** Everything in one object store, read with the plain IndexedDB API. */
function readStore<T>(page: Page, store: string): Promise<T[]> {
  return page.evaluate((name) => new Promise<unknown[]>((resolve, reject) => {
    const open = indexedDB.open('bankside');
    open.onerror = () => reject(open.error);
    open.onsuccess = () => {
      const db = open.result;
      const r = db.transaction(name).objectStore(name).getAll();
      r.onsuccess = () => { db.close(); resolve(r.result); };
      r.onerror = () => reject(r.error);
    };
  }), store) as Promise<T[]>;
}

/** Put records straight into a store (the app must have created the database first). */
function putAll(page: Page, store: string, records: unknown[]): Promise<void> {
  return page.evaluate(({ name, rows }) => new Promise<void>((resolve, reject) => {
    const open = indexedDB.open('bankside');
    open.onsuccess = () => {
      const db = open.result;
      const tx = db.transaction(name, 'readwrite');
      for (const r of rows) tx.objectStore(name).put(r);
      tx.oncomplete = () => { db.close(); resolve(); };
      tx.onerror = () => reject(tx.error);
    };
    open.onerror = () => reject(open.error);
  }), { name: store, rows: records });
}

describe('exports in a worker', () => {
  // Same browser, same stored records: the page's one-piece export against the worker's chunked one
  // (the bench page imports both; Vite serves it). Node's and Chromium's Math differ in the last digit
  // of a few results, so the comparison must run in one engine.
  it('demo day and a generated 10,000-sample day: worker files are byte for byte the page’s', async () => {
    const { createServer } = await import('vite');
    const server = await createServer({ logLevel: 'error', server: { port: 0, host: '127.0.0.1' } });
    await server.listen();
    try {
      const page = await browser.newPage();
      await page.goto(server.resolvedUrls!.local[0] + 'test/bench/store-bench.html');
      await page.waitForFunction(() => (window as unknown as { benchReady?: boolean }).benchReady === true, null, { timeout: 60_000 });
      type Cmp = { samples: number; pageLength: number; workerLength: number; identical: boolean; firstDiff: number };
      const compare = (what: 'demo' | number, kind: string) =>
        page.evaluate(([w, k]) => (window as unknown as { compareExports(w: unknown, k: unknown): Promise<Cmp> }).compareExports(w, k), [what, kind] as const);
      const demoWide = await compare('demo', 'csv-wide');
      expect(demoWide).toMatchObject({ samples: 3, identical: true, firstDiff: -1 });
      expect(demoWide.pageLength).toBeGreaterThan(1000);
      expect(await compare('demo', 'csv-long')).toMatchObject({ samples: 3, identical: true });
      const big = await compare(10_000, 'csv-wide');
      expect(big).toMatchObject({ samples: 10_000, identical: true, firstDiff: -1 });
      expect(big.workerLength).toBeGreaterThan(10_000 * 300);
      await page.close();
    } finally {
      await server.close();
    }
  }, 300_000);

  it('a cancelled export stops halfway and leaves nothing behind; the next export works', async () => {
    const context = await phoneContext(browser);
    const page = await context.newPage();
    await openControlled(page, served.url);
    const day = generatedDay(3000, '2025-08-21');
    await putAll(page, 'sites', day.sites);
    await putAll(page, 'samples', day.samples);
    const downloads: string[] = [];
    page.on('download', (d) => downloads.push(d.suggestedFilename()));
    await page.goto(served.url + '#/send');
    await page.locator('#from').fill('2025-08-21');
    const cdp = await context.newCDPSession(page);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    await page.getByRole('button', { name: 'Samples CSV (one row each)' }).click();
    // wait until some but not all samples are written, then cancel
    await page.getByText(/Writing the file: [1-9][\d,]* of 3,000 samples/).waitFor({ timeout: 60_000 });
    await page.getByRole('button', { name: 'Cancel export' }).click({ timeout: 5000 });
    await page.getByText('Export cancelled: no file was made.').waitFor({ timeout: 30_000 });
    await shot(page, 'export-cancelled');
    await expect(page.locator('#export-progress').count()).resolves.toBe(0);
    await page.waitForTimeout(1500);
    expect(downloads).toEqual([]);
    expect(await readStore(page, 'exportLog')).toEqual([]);
    expect(await readStore(page, 'outbox')).toEqual([]);
    // the worker is still there and exports the same selection in full afterwards
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 1 });
    const [download] = await Promise.all([page.waitForEvent('download', { timeout: 120_000 }), page.getByRole('button', { name: 'Meter checks CSV' }).click()]);
    expect(download.suggestedFilename()).toBe('bankside_2025-08-21_meter_checks.csv');
    expect((await readStore<{ sampleIds: string[] }>(page, 'exportLog'))[0]!.sampleIds).toHaveLength(3000);
    await context.close();
  }, 180_000);
});
