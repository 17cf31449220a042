// The lab import at phone size in real Chromium, offline: a lab report as labs write it (units in
// their usual spellings, censored values, a client sample ID column) is previewed row by row,
// stored at once, and its major ions change the sample's chemistry (composition-based ionic
// strength and a charge balance) while the field values stay. Fixture: test/fixtures/exchange/lab-as-written.csv (invented).
// Source of the expected values: the invented fixture above; the chemistry numbers themselves are checked in test/chemistry.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { join } from 'node:path';
import { offlinePhoneApp, shot } from './helpers';

let app: Awaited<ReturnType<typeof offlinePhoneApp>>;
let page: Page;

beforeAll(async () => {
  app = await offlinePhoneApp();
  page = app.page;
  await page.getByRole('button', { name: 'Load demo creek' }).click();
  await page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 3, null, { timeout: 20_000 });
});
afterAll(async () => app?.close());

describe('lab results import', () => {
  it('previews a lab report as written, stores it at once, and the lab ions feed the chemistry', async () => {
    const sampleUrl = await page.locator('a.sample-card').nth(1).getAttribute('href');
    await page.locator('a.sample-card').nth(1).click();
    await page.getByText('Ionic strength').first().waitFor({ state: 'attached' });
    await expect(page.getByText('from the full ion analysis').count()).resolves.toBe(0);
    await expect(page.getByText('Charge balance').count()).resolves.toBe(0);

    await page.goto(app.served.url + '#/send');
    await page.getByRole('link', { name: 'Import a lab results file' }).click();
    await expect(page.locator('h1').textContent()).resolves.toBe('Lab results');
    await page.getByLabel('Lab results file (CSV)').setInputFiles(join(process.cwd(), 'test/fixtures/exchange/lab-as-written.csv'));
    await page.locator('main p.lead[role="status"]').waitFor();
    await expect(page.locator('main p.lead[role="status"]').textContent()).resolves.toBe('14 of 14 rows ready');
    await expect(page.getByLabel('Client sample ID column').inputValue()).resolves.toBe('Client Sample ID');
    await expect(page.getByLabel('Detection limit column').inputValue()).resolves.toBe('MDL');
    await expect(page.getByRole('list', { name: 'Lab rows to import' }).getByRole('listitem').filter({ hasText: 'Fluoride' }).textContent()).resolves.toContain('not detected (< 0.05) mg/L');
    await shot(page, 'lab-import-preview');
    await page.getByRole('button', { name: 'Store all 14 rows' }).click();
    await expect(page.locator('main p.notice[role="status"]').textContent()).resolves.toBe('Stored 14 lab values on 1 samples. Field values were not changed.');

    await page.goto(app.served.url + sampleUrl);
    await page.getByText('from the full ion analysis').first().waitFor({ state: 'attached', timeout: 10_000 });
    await expect(page.getByText('Charge balance').count()).resolves.toBeGreaterThan(0);
    await shot(page, 'lab-import-sample-after');
  });

  it('refuses the rows it cannot read, names them, and stores nothing of a file until asked', async () => {
    await page.goto(app.served.url + '#/lab');
    const bad = ['Client Sample ID,Analyte,Result,Units', 'demo-sample-2-0,Sodium,4.1,furlongs', 'demo-sample-2-0,Nitrate,0.4,mg/L', 'nobody,Sodium,3,mg/L', 'demo-sample-2-0,Chloride,5.5,mg/L'].join('\n');
    await page.getByLabel('Lab results file (CSV)').setInputFiles({ name: 'bad.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
    await page.locator('main p.lead[role="status"]').waitFor();
    await expect(page.locator('main p.lead[role="status"]').textContent()).resolves.toBe('1 of 4 rows ready; 3 with problems (listed first)');
    const text = await page.getByRole('list', { name: 'Lab rows to import' }).textContent();
    expect(text).toContain('unit “furlongs” is not a UCUM unit');
    expect(text).toContain('say whether nitrate is “as N” or “as NO3”');
    expect(text).toContain('sample “nobody” is not on this phone');
    await expect(page.getByRole('button', { name: 'Store the 1 ready rows (leave out 3)' }).isVisible()).resolves.toBe(true);
  });
});
