// Expected values come from the invented demo scenario and our own file format; no published reference
// values are checked here (the chemistry's sources are named in test/chemistry).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { readFileSync } from 'node:fs';
import { parseCsv } from '../../src/exchange/csv';
import { launch, openControlled, phoneContext, serveDist, shot, type Served } from './helpers';
import { ENGINE_VERSION } from '../../src/chemistry';

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

describe('getting the day to the office, offline', () => {
  it('downloads the day as CSV with no network, and the file holds the day’s samples', async () => {
    const context = await phoneContext(browser);
    const page = await context.newPage();
    await openControlled(page, served.url);
    await context.setOffline(true);
    await page.getByRole('button', { name: 'Load demo creek' }).click();
    await page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 3);
    const codesOnList = await page.locator('.sample-card .sample-code').allTextContents();
    expect(codesOnList).toHaveLength(3);
    await page.getByRole('link', { name: 'Send', exact: true }).click();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Samples CSV (one row each)' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^bankside_\d{4}-\d{2}-\d{2}_samples\.csv$/);
    const text = readFileSync((await download.path())!, 'utf8');
    expect(text.charCodeAt(0)).toBe(0xfeff);
    const { rows } = parseCsv(text);
    expect(rows.map((r) => r.sample_code).sort()).toEqual([...codesOnList].sort());
    expect(rows.map((r) => r.site_code).sort()).toEqual(['WF-01', 'WF-02', 'WF-03']);
    // each row carries the readable sample ID the day list shows (site code, local date, time)
    for (const r of rows) {
      expect(r.sample_code).toMatch(new RegExp(`^${r.site_code}-\\d{8}-\\d{4}$`));
      expect(r.sample_code!.length).toBeLessThanOrEqual(35);
      expect(r.engine_version).toBe(ENGINE_VERSION);
      expect(Number.isFinite(Number(r.si_calcite))).toBe(true);
    }
    await page.getByText(/Saved bankside_.*_samples\.csv to downloads/).waitFor();
    // queued for the office while offline: shown as queued, never as failed
    await page.getByRole('button', { name: 'Queue selection for upload' }).click();
    await page.getByRole('list', { name: 'Upload queue' }).getByText('Queued: waits for signal').waitFor();
    await shot(page, 'send-offline');
    await context.close();
  });

  it('exports the day in WQX once the project ID is set, from a button that says WQX (360 px phone)', async () => {
    const context = await browser.newContext({ viewport: { width: 360, height: 780 }, deviceScaleFactor: 2, hasTouch: true, isMobile: true });
    const page = await context.newPage();
    await page.goto(served.url);
    await page.getByRole('button', { name: 'Load demo creek' }).click();
    await page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 3);
    await page.goto(served.url + '#/send');
    await page.getByRole('button', { name: 'WQX results CSV' }).click();
    await page.getByText('WQX needs a Project ID: set it in Settings (Office).').waitFor();
    await page.goto(served.url + '#/settings');
    await page.getByLabel('WQX project ID').fill('WRENFOLD-2026');
    await page.getByLabel('WQX organization ID').fill('BANKSIDE_DEMO');
    await shot(page, 'settings-wqx-360');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Settings saved.').waitFor();
    await page.goto(served.url + '#/send');
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'WQX results CSV' }).click()]);
    expect(download.suggestedFilename()).toMatch(/^bankside_\d{4}-\d{2}-\d{2}_wqx_results\.csv$/);
    const { header, rows } = parseCsv(readFileSync((await download.path())!, 'utf8'));
    expect(header.slice(0, 3)).toEqual(['Activity ID', 'Activity Type', 'Activity Media Name']);
    expect(new Set(rows.map((r) => r['Project ID']))).toEqual(new Set(['WRENFOLD-2026']));
    expect(new Set(rows.map((r) => r['Monitoring Location ID']))).toEqual(new Set(['WF-01', 'WF-02', 'WF-03']));
    for (const r of rows) expect(r['Activity ID']!.length).toBeLessThanOrEqual(35);
    const [loc] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'WQX monitoring locations CSV' }).click()]);
    expect(parseCsv(readFileSync((await loc.path())!, 'utf8')).rows.map((r) => r['Monitoring Location ID']).sort()).toEqual(['WF-01', 'WF-02', 'WF-03']);
    await page.getByRole('button', { name: 'WQX results CSV' }).scrollIntoViewIfNeeded();
    await shot(page, 'send-wqx-360');
    await context.close();
  });

  it('uses the system share sheet where the browser has one', async () => {
    const context = await phoneContext(browser);
    await context.addInitScript(() => {
      const w = window as unknown as { sharedFiles: string[] };
      w.sharedFiles = [];
      Object.assign(navigator, {
        canShare: (d: { files?: File[] }) => Array.isArray(d.files),
        share: async (d: { files: File[] }) => {
          for (const f of d.files) w.sharedFiles.push(`${f.name}:${f.type}:${(await f.text()).split('\r\n').length}`);
        },
      });
    });
    const page = await context.newPage();
    await page.goto(served.url);
    await page.getByRole('button', { name: 'Load demo creek' }).click();
    await page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 3);
    await page.goto(served.url + '#/send');
    await page.getByRole('button', { name: 'Values CSV (one row per value)' }).click();
    await page.getByText(/^Shared bankside_/).waitFor();
    const shared = await page.evaluate(() => (window as unknown as { sharedFiles: string[] }).sharedFiles);
    expect(shared).toHaveLength(1);
    expect(shared[0]).toMatch(/^bankside_.*_values\.csv:text\/csv:\d+$/);
    expect(Number(shared[0]!.split(':')[2])).toBeGreaterThan(30);
    await context.close();
  });
});
