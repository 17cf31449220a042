// Numbers here are counts of requests and stored copies, and the Nernst slope 58.17 mV/pH at 20 °C
// (the formula's value; source: CODATA constants, see test/chemistry/calibration.test.ts).
// Fault injection in real Chromium: an app update while a sample is half-typed, an office server
// that fails in every way, a full disk, and a second tab upgrading the database.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { readFileSync } from 'node:fs';
import { launch, openControlled, phoneContext, serveDist, serveSwappable, shot, type Served } from './helpers';

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

async function readDraft(page: Page): Promise<Record<string, unknown> | null> {
  return page.evaluate(
    () =>
      new Promise((resolve) => {
        const r = indexedDB.open('bankside');
        r.onsuccess = () => {
          const db = r.result;
          // new-sample drafts are kept per tab: draft:sample:new:<tab>
          const g = db.transaction('drafts').objectStore('drafts').getAll(IDBKeyRange.bound('draft:sample:new:', 'draft:sample:new:\uffff'));
          g.onsuccess = () => {
            db.close();
            resolve((g.result[0]?.form as Record<string, unknown>) ?? null);
          };
        };
      }),
  );
}

describe('faults', () => {
  it('an app update arriving mid-entry waits for the crew, and keeps the entry through the reload', async () => {
    const site = await serveSwappable();
    const context = await phoneContext(browser);
    const page = await context.newPage();
    await openControlled(page, site.url);
    await page.goto(site.url + '#/new');
    await page.getByLabel('Water temperature').fill('12.3');
    await page.getByLabel('pH').fill('7,91');
    // A new version is deployed: the worker script changes by a byte.
    site.replace('/sw.js', readFileSync('dist/sw.js', 'utf8') + '\n// next release\n');
    await page.evaluate(async () => (await navigator.serviceWorker.getRegistration())!.update());
    await page.getByRole('button', { name: 'Update now' }).waitFor({ timeout: 20_000 });
    // nothing reloaded by itself: what was typed is still on screen
    await expect(page.getByLabel('pH').inputValue()).resolves.toBe('7,91');
    await shot(page, 'update-waiting');
    await page.getByRole('button', { name: 'Update now' }).click();
    await page.waitForEvent('load', { timeout: 20_000 });
    await page.getByText('Restored your unsaved entry').waitFor({ timeout: 10_000 });
    await expect(page.getByLabel('pH').inputValue()).resolves.toBe('7,91');
    await expect(page.getByLabel('Water temperature').inputValue()).resolves.toBe('12.3');
    await context.close();
    await site.close();
  });

  it('office server failing (5xx, dying mid-upload, then fine): one copy arrives, nothing is lost', async () => {
    const stored = new Map<string, string>();
    let mode: 'ok' | '503' | 'die' = '503';
    let requests = 0;
    const office: Server = createServer((req, res) => {
      res.setHeader('Access-Control-Allow-Origin', '*');
      res.setHeader('Access-Control-Allow-Headers', 'Content-Type, Idempotency-Key, X-Bankside-File, X-Bankside-Samples, Authorization');
      res.setHeader('Access-Control-Allow-Methods', 'POST, PUT, OPTIONS');
      if (req.method === 'OPTIONS') return void res.writeHead(204).end();
      // only an upload stores anything (the phone's no-cors reachability probe is a GET)
      if (req.method !== 'POST') return void res.writeHead(405).end();
      let body = '';
      req.on('data', (c) => (body += c));
      req.on('end', () => {
        requests++;
        if (mode === '503') return void res.writeHead(503).end('down for maintenance');
        const key = String(req.headers['idempotency-key']);
        if (!stored.has(key)) stored.set(key, body);
        if (mode === 'die') return void req.socket.destroy();
        res.writeHead(201).end('{}');
      });
    });
    await new Promise<void>((r) => office.listen(0, '127.0.0.1', () => r()));
    const endpoint = `http://127.0.0.1:${(office.address() as AddressInfo).port}/in`;
    const context = await phoneContext(browser);
    const page = await context.newPage();
    try {
      await page.goto(served.url);
      await page.getByRole('button', { name: 'Load demo creek' }).click();
      await page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 3);
      await page.goto(served.url + '#/settings');
      await page.getByLabel('Office upload address (HTTPS)').fill(endpoint);
      await page.getByRole('button', { name: 'Save settings' }).click();
      await page.getByText('Settings saved.').waitFor();
      await page.goto(served.url + '#/send');
      await page.getByRole('button', { name: 'Queue selection for upload' }).click();
      const queue = page.getByRole('list', { name: 'Upload queue' });
      await queue.getByText(/503/).waitFor();
      await queue.getByText('Queued: waits for signal').waitFor();
      mode = 'die';
      await page.getByRole('button', { name: 'Send now' }).click();
      await page.getByText(/Sent 0; 1 still queued/).waitFor();
      expect(stored.size).toBe(1); // the office has it, but the phone never heard back
      mode = 'ok';
      await page.getByRole('button', { name: 'Send now' }).click();
      await queue.getByText('✓ Received by the office').waitFor();
      expect(stored.size).toBe(1);
      expect(requests).toBeGreaterThanOrEqual(3); // 503, the lost answer, the retry (background triggers may add tries)
      expect([...stored.values()][0]!.split('\r\n').length).toBeGreaterThan(3);
      await shot(page, 'send-received');
    } finally {
      await context.close();
      await new Promise<void>((r) => office.close(() => r()));
    }
  });

  it('a full disk: the save says so, the entry stays on screen, can be downloaded, and saves once space is back', async () => {
    const context = await phoneContext(browser);
    await context.addInitScript(() => {
      const w = window as unknown as { fullDisk: boolean };
      w.fullDisk = false;
      const put = IDBObjectStore.prototype.put;
      IDBObjectStore.prototype.put = function (this: IDBObjectStore, ...args: Parameters<typeof put>) {
        if (w.fullDisk && this.name === 'samples') throw new DOMException('The quota has been exceeded.', 'QuotaExceededError');
        return put.apply(this, args);
      };
    });
    const page = await context.newPage();
    await page.goto(served.url);
    await page.getByRole('button', { name: 'Load demo creek' }).click();
    await page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 3);
    await page.goto(served.url + '#/new');
    await page.getByLabel('Site', { exact: true }).selectOption({ index: 1 });
    await page.getByLabel('Water temperature').fill('8.8');
    await page.getByLabel('pH').fill('7.7');
    await page.evaluate(() => ((window as unknown as { fullDisk: boolean }).fullDisk = true));
    await page.getByRole('button', { name: 'Save sample' }).click();
    await page.getByText(/NOT saved/).waitFor();
    await expect(page.getByLabel('pH').inputValue()).resolves.toBe('7.7');
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download this entry' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^bankside-unsaved-entry-\d+\.json$/);
    await shot(page, 'quota-full');
    await page.evaluate(() => ((window as unknown as { fullDisk: boolean }).fullDisk = false));
    await page.getByRole('button', { name: 'Save sample' }).click();
    await page.getByText('Sample saved on this phone.').waitFor();
    await page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 4);
    await context.close();
  });

  it('two tabs during a schema upgrade: the old tab saves its draft and steps aside', async () => {
    const context = await phoneContext(browser);
    const tabA = await context.newPage();
    await tabA.goto(served.url + '#/new');
    await tabA.getByLabel('Water temperature').fill('10.1');
    await tabA.getByLabel('pH').fill('8.02');
    const tabB = await context.newPage();
    await tabB.goto(served.url + '#/about');
    // tab B opens the next schema version (as a newer release of the app would)
    const current = await tabB.evaluate(async () => (await indexedDB.databases()).find((d) => d.name === 'bankside')?.version ?? 0);
    expect(current).toBeGreaterThan(0);
    const opened = await tabB.evaluate(
      (current) =>
        new Promise<number>((resolve, reject) => {
          const r = indexedDB.open('bankside', current + 1);
          r.onupgradeneeded = () => undefined;
          r.onsuccess = () => {
            const v = r.result.version;
            r.result.close();
            resolve(v);
          };
          r.onerror = () => reject(r.error);
        }),
      current,
    );
    expect(opened).toBe(current + 1);
    await tabA.getByText('Bankside was updated in another tab').waitFor();
    const draft = await readDraft(tabB);
    expect(draft).toMatchObject({ pH: [{ v: '8.02' }] });
    await context.close();
  });
});
