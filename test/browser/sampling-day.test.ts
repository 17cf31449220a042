// The sampling day at 360 px, offline, in real Chromium: site lists in, next and nearest site, sample
// IDs, QC verdicts, chain of custody, labels with QR codes, the day summary. Sites and values are the
// invented demo scenario or made up here; QC limits come from the default method profile.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { parseCsv } from '../../src/exchange/csv';
import { launch, openControlled, serveDist, shot, type Served } from './helpers';
import { seriousAxe } from './axe';
import { readFileSync } from 'node:fs';

let browser: Browser;
let served: Served;

/** A 360 × 740 phone, offline after the service worker took control. */
async function offlinePhone(): Promise<{ context: BrowserContext; page: Page }> {
  // isMobile stays off: a mobile viewport zooms the whole page out when anything (today the header's
  // status chips) is wider than the phone, and taps then miss; this file checks its own content's width.
  const context = await browser.newContext({ viewport: { width: 360, height: 740 }, deviceScaleFactor: 2, hasTouch: true });
  const page = await context.newPage();
  await openControlled(page, served.url);
  await context.setOffline(true);
  return { context, page };
}

/** Nothing in this change's pieces (`scope`) is wider than the phone; the screens' layout is another test's. */
async function noOverflow(p: Page, scope: string): Promise<void> {
  const wide = await p.evaluate((sel) => [...document.querySelectorAll(`${sel}, ${sel} *`)].filter((el) => el.getBoundingClientRect().right > 361).map((el) => `${el.tagName}.${el.className} “${(el.textContent ?? '').slice(0, 30)}” right ${Math.round(el.getBoundingClientRect().right)}`), scope);
  expect(wide).toEqual([]);
}

/** Tap a control after bringing it to the middle of the screen (clear of the bottom navigation). */
async function tap(l: Locator): Promise<void> {
  await l.evaluate((el) => el.scrollIntoView({ block: 'center' }));
  await l.click();
}

beforeAll(async () => {
  browser = await launch();
  served = await serveDist();
});
afterAll(async () => {
  await browser?.close();
  await served?.close();
});

const OFFICE_CSV = [
  'code,name,type,latitude,longitude,datum,run_order',
  'WF-01,Wrenfold Creek at the upper footbridge,stream,45.50321,-110.90112,WGS84,2',
  'WF-02,Limekiln spring (orifice),spring,45.49870,-110.89544,WGS84,1',
  'WF-09,Bad latitude,stream,95.2,-110.1,WGS84,3',
].join('\r\n');

describe('sites from the office and from another phone', () => {
  it('imports a CSV site list with a preview and per-row errors; the day offers the next and the nearest site', async () => {
    const { context, page } = await offlinePhone();
    await context.grantPermissions(['geolocation']);
    // 0.0002° north of WF-01 (about 22 m), fix ±25 m
    await context.setGeolocation({ latitude: 45.50341, longitude: -110.90112, accuracy: 25 });
    await page.goto(served.url + '#/sites');
    await tap(page.getByText('Import a site list'));
    await page.locator('.site-import input[type=file]').setInputFiles({ name: 'office-sites.csv', mimeType: 'text/csv', buffer: Buffer.from(OFFICE_CSV) });
    await page.getByText('office-sites.csv: 3 rows, 2 ready, 1 with problems (left out).').waitFor();
    await expect(page.locator('.import-row.bad').textContent()).resolves.toContain('Latitude 95.2 is above 90.');
    await noOverflow(page, '.site-import');
    expect(await seriousAxe(page)).toEqual([]);
    await shot(page, 'day-site-import-preview-360');
    await tap(page.getByRole('button', { name: 'Import 2 sites' }));
    await page.getByText('Imported: 2 new, 0 updated, 1 left out.').waitFor();
    await page.goto(served.url + '#/today');
    await page.getByText('Next in run order (1 of 2):').waitFor();
    await expect(page.locator('.next-site strong').textContent()).resolves.toBe('WF-02');
    await tap(page.getByRole('button', { name: 'Which site am I at?' }));
    await page.getByText(/You are at WF-01 .*\(22 m away, fix ±25 m\)/).waitFor();
    await noOverflow(page, '.day-guide');
    await shot(page, 'day-next-and-nearest-site-360');
    await tap(page.getByRole('link', { name: 'Sample WF-01' }));
    // the new sample opens with that site chosen
    await page.waitForFunction(() => (document.querySelector('#site') as HTMLSelectElement | null)?.selectedOptions[0]?.textContent?.startsWith('WF-01 ·'), null, { timeout: 10_000 });
    await context.close();
  });

  it('moves one phone’s sites to another through the sites map file (GeoJSON)', async () => {
    const a = await offlinePhone();
    await tap(a.page.getByRole('button', { name: 'Load demo creek' }));
    await a.page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 3);
    await a.page.goto(served.url + '#/send');
    const [download] = await Promise.all([a.page.waitForEvent('download'), tap(a.page.getByRole('button', { name: 'Sites map file' }))]);
    const geojson = readFileSync((await download.path())!);
    await a.context.close();

    const b = await offlinePhone(); // a new phone: its own empty storage
    await b.page.goto(served.url + '#/sites');
    await b.page.getByText('No sites yet.').waitFor();
    await tap(b.page.getByText('Import a site list'));
    await b.page.locator('.site-import input[type=file]').setInputFiles({ name: download.suggestedFilename(), mimeType: 'application/geo+json', buffer: geojson });
    await b.page.getByText(/: 3 rows, 3 ready\./).waitFor();
    await tap(b.page.getByRole('button', { name: 'Import 3 sites' }));
    await b.page.getByText('Imported: 3 new, 0 updated.').waitFor();
    const cards = await b.page.locator('.cards .card-title').allTextContents();
    expect(cards.slice(0, 3)).toEqual(['WF-01 · Wrenfold Creek at the upper footbridge', 'WF-02 · Limekiln spring (orifice)', 'WF-03 · Wrenfold Creek above the mill weir']);
    await expect(b.page.locator('.cards .card').first().textContent()).resolves.toContain('45.50321, -110.90112 WGS84');
    await b.context.close();
  });
});

describe('QC that judges itself at the bank', () => {
  it('gives a replicate its verdict against the parent picked from the day, and judges a blank by the blank limits', async () => {
    const { context, page } = await offlinePhone();
    await tap(page.getByRole('button', { name: 'Load demo creek' }));
    await page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 3);
    await page.goto(served.url + '#/new');
    await page.getByLabel('Site', { exact: true }).selectOption({ label: 'WF-01 · Wrenfold Creek at the upper footbridge' });
    if (!(await page.locator('#when').evaluate((d) => (d as HTMLDetailsElement).open))) await tap(page.locator('#when summary'));
    await tap(page.getByText('Replicate', { exact: true }));
    // the parent is picked from the day's environmental samples, by time, site and sample ID
    const options = await page.locator('#parent option').allTextContents();
    expect(options.slice(1).map((o) => o.replace(/^\d\d:\d\d · /, ''))).toEqual(expect.arrayContaining([expect.stringMatching(/^WF-01 · WF-01-\d{8}-0920$/)]));
    await page.locator('#parent').selectOption({ label: options.find((o) => o.includes('WF-01 ·'))! });
    await page.getByLabel('Water temperature').fill('7.0');
    await page.getByLabel('Specific conductance').fill('405');
    await page.getByLabel('pH').fill('8.08');
    await page.getByLabel('Alkalinity', { exact: true }).fill('140');
    const verdict = page.getByTestId('qc-verdict');
    await verdict.getByText('✗ Replicate fails').waitFor();
    const lines = await verdict.locator('li').allTextContents();
    // demo parent (WF-01 today 09:20): medians 7.0 °C, SC 398, pH 8.01; alkalinity 165 mg/L as CaCO₃
    expect(lines).toEqual([
      '✓ Temperature 7.00 vs 7.00: difference 0.00 °C, allowed 0.5 °C.',
      '✓ pH 8.08 vs 8.01: difference 0.07, allowed 0.2.',
      '✓ SC 405 vs 398: RPD 1.7 % (difference 7.00 µS/cm), allowed 5 % or 5 µS/cm.', // 100·7/401.5
      '✗ Alkalinity 140 vs 165: RPD 16.4 % (difference 25.0 mg/L CaCO₃), allowed 10 % or 5 mg/L CaCO₃.', // 100·25/152.5
    ]);
    await verdict.evaluate((el) => el.scrollIntoView({ block: 'center' }));
    await noOverflow(page, '.qc-live, .qc-parent');
    expect(await seriousAxe(page)).toEqual([]);
    await shot(page, 'day-qc-replicate-verdict-360');

    await tap(page.getByText('Blank', { exact: true }));
    await page.getByLabel('Specific conductance').fill('1.8');
    await page.getByLabel('Alkalinity', { exact: true }).fill('');
    await verdict.getByText('✓ Blank passes').waitFor();
    expect(await verdict.locator('li').allTextContents()).toEqual(['✓ SC 1.80 µS/cm in the blank, allowed up to 5 µS/cm.']);
    await verdict.evaluate((el) => el.scrollIntoView({ block: 'center' }));
    await shot(page, 'day-qc-blank-verdict-360');
    await context.close();
  });
});

describe('the day summary, chain of custody and labels', () => {
  it('shows every sample with its ID, QC and meter checks, exports the chain of custody and prints labels with QR codes', async () => {
    const { context, page } = await offlinePhone();
    await tap(page.getByRole('button', { name: 'Load demo creek' }));
    await page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 3);
    const codes = await page.locator('.sample-card .sample-code').allTextContents();
    await tap(page.getByRole('link', { name: 'Day summary, custody and labels' }));
    await page.waitForFunction(() => document.querySelectorAll('.day-row').length === 3);
    expect(await page.locator('.day-row .sample-code').allTextContents()).toEqual(codes);
    // the demo day has only its morning calibrations: the end-of-day check is still to do, and said so
    await expect(page.locator('.end-checks li').allTextContents()).resolves.toEqual([
      expect.stringMatching(/^✗ pH: no passing check after the last sample \(/),
      expect.stringMatching(/^✗ conductance: no passing check after the last sample/),
      expect.stringMatching(/^✗ oxygen: no passing check after the last sample/),
    ]);
    await page.getByRole('link', { name: 'Record the end-of-day check' }).waitFor();
    await tap(page.getByLabel(/Sonde A/));
    await page.waitForFunction(() => (document.querySelector('.day-meters input') as HTMLInputElement).checked);
    await page.getByLabel('Relinquished by').fill('T. Mills');
    await page.getByLabel('Received by').fill('Lab courier');
    await page.getByLabel('Cooler temperature (°C)').fill('4,2');
    await tap(page.getByRole('button', { name: 'Record hand-over now' }));
    await page.locator('.custody-list li').getByText('Lab courier').waitFor();
    await noOverflow(page, '.day-summary');
    expect(await seriousAxe(page)).toEqual([]);
    await page.evaluate(() => scrollTo(0, 0));
    await shot(page, 'day-summary-top-360');
    await page.locator('.custody').evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await shot(page, 'day-summary-custody-360');

    const [coc] = await Promise.all([page.waitForEvent('download'), tap(page.getByRole('button', { name: 'Chain of custody CSV' }))]);
    expect(coc.suggestedFilename()).toMatch(/^bankside_\d{4}-\d{2}-\d{2}_chain_of_custody\.csv$/);
    const cocRows = parseCsv(readFileSync((await coc.path())!, 'utf8')).rows;
    expect(cocRows.map((r) => r.sample_code).sort()).toEqual([...codes].sort());
    for (const r of cocRows) expect([r.transfer, r.relinquished_by, r.received_by, r.cooler_temp_degC]).toEqual(['1', 'T. Mills', 'Lab courier', '4.2']);

    const [summary] = await Promise.all([page.waitForEvent('download'), tap(page.getByRole('button', { name: 'Day summary CSV' }))]);
    const sumRows = parseCsv(readFileSync((await summary.path())!, 'utf8')).rows;
    expect(sumRows.map((r) => r.sample_code)).toEqual(codes);
    for (const r of sumRows) expect(r.meter_check).toBe('within a passing check');

    await tap(page.getByRole('link', { name: 'Bottle labels' }));
    await page.waitForFunction(() => document.querySelectorAll('.label svg.qr').length === 3, null, { timeout: 10_000 });
    const labels = await page.locator('.label').evaluateAll((els) => els.map((el) => ({ code: el.querySelector('.label-code')?.textContent, modules: Number(el.querySelector('svg.qr')?.getAttribute('data-modules')), dark: (el.querySelector('svg.qr path')?.getAttribute('d') ?? '').split('M').length - 1 })));
    expect(labels.map((l) => l.code)).toEqual(codes);
    for (const l of labels) {
      // a 19-character ID in byte mode at level M needs version 2 (25 × 25 modules; ISO/IEC 18004 capacity table, from memory)
      expect(l.modules).toBe(25);
      expect(l.dark).toBeGreaterThan(150);
    }
    await noOverflow(page, '.labels-screen');
    expect(await seriousAxe(page)).toEqual([]);
    await shot(page, 'day-labels-360');
    await context.close();
  });
});
