import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launch, openControlled, phoneContext, serveDist, shot, type Served } from './helpers';
import { axeViolations } from './axe';

let browser: Browser;
let served: Served;
let context: BrowserContext;
let page: Page;

/** Wait until exactly n elements match (lists fill asynchronously from IndexedDB). */
async function waitCount(p: Page, selector: string, n: number): Promise<void> {
  await p.waitForFunction(([sel, k]) => document.querySelectorAll(sel as string).length === k, [selector, n] as const, { timeout: 10_000 });
}

beforeAll(async () => {
  browser = await launch();
  served = await serveDist();
  context = await phoneContext(browser);
  page = await context.newPage();
  await openControlled(page, served.url);
  // Everything below happens with no network, as at the bank.
  await context.setOffline(true);
});
afterAll(async () => {
  await context?.close();
  await browser?.close();
  await served?.close();
});

describe('the field app at phone size, offline', () => {
  it('loads the invented demo creek from the first screen', async () => {
    await page.getByRole('button', { name: 'Load demo creek' }).click();
    await page.getByRole('list', { name: 'Samples of the day' }).waitFor();
    // the list refreshes as each demo record lands; today's part of the scenario has 3 visits
    await waitCount(page, '.sample-card', 3);
    await expect(page.locator('.sample-card .tag', { hasText: 'demo' }).count()).resolves.toBe(3);
    await expect(page.locator('.sample-card [data-state="supersaturated"]').count()).resolves.toBeGreaterThan(0);
    await shot(page, 'today-demo');
  });

  it('records a sample by its labelled fields; the state word follows pH as it is typed; it survives a reload', async () => {
    await page.getByRole('navigation').getByRole('link', { name: 'New', exact: true }).click();
    await page.getByLabel('Site', { exact: true }).selectOption({ label: 'WF-01 · Wrenfold Creek at the upper footbridge' });
    await page.getByLabel('Water temperature').fill('9,4');
    await page.getByLabel('Specific conductance').fill('450');
    await page.getByLabel('Alkalinity', { exact: true }).fill('180');
    await page.getByLabel('Calcium (kit)').fill('60');
    const state = page.locator('.results .state');
    await page.getByLabel('pH').fill('6.9');
    await expect(state.getAttribute('data-state')).resolves.toBe('undersaturated');
    await shot(page, 'new-sample-undersaturated');
    await page.getByLabel('pH').fill('8,4');
    await page.waitForFunction(() => document.querySelector('.results .state')?.getAttribute('data-state') === 'supersaturated');
    await expect(state.textContent()).resolves.toContain('Supersaturated');
    await expect(page.getByTestId('ionic-strength').textContent()).resolves.toContain('mol/L');
    // a bad value is explained beside its field, never read as zero
    await page.getByLabel('Calcium (kit)').fill('6o');
    await page.getByText('“6o” is not a number').waitFor();
    await page.getByLabel('Calcium (kit)').fill('60');
    await shot(page, 'new-sample-supersaturated');
    await page.getByRole('button', { name: 'Save sample' }).click();
    await page.getByText('Sample saved on this phone.').waitFor();
    await waitCount(page, '.sample-card', 4);

    await page.reload();
    await waitCount(page, '.sample-card', 4);
    const mine = page.locator('.sample-card', { hasText: 'pH 8.40' });
    await expect(mine.count()).resolves.toBe(1);
    await mine.click();
    await expect(page.getByLabel('pH').inputValue()).resolves.toBe('8.4');
  });

  it('keeps a half-typed sample when the page is closed mid-entry', async () => {
    await page.goto(served.url + '#/new');
    await page.getByLabel('Water temperature').fill('11.2');
    await page.getByLabel('pH').fill('7,65');
    await page.waitForTimeout(700); // autosave debounce is 400 ms
    await page.close();
    page = await context.newPage();
    await page.goto(served.url + '#/new');
    await page.getByText('Restored your unsaved entry').waitFor();
    await expect(page.getByLabel('pH').inputValue()).resolves.toBe('7,65');
    await expect(page.getByLabel('Water temperature').inputValue()).resolves.toBe('11.2');
    await page.getByRole('button', { name: 'Discard it' }).click();
  });

  it('logs a pH calibration with slope and offset, and lists it', async () => {
    await page.goto(served.url + '#/checks');
    await page.getByLabel('Buffer 1 reading').fill('-3.0');
    await page.getByLabel('Buffer 2 reading').fill('171.0');
    await page.getByLabel('Buffer 3 reading').fill('-172.1');
    for (const i of [1, 2, 3]) await page.getByLabel(`Buffer ${i} temperature`).fill('20');
    const verdict = page.getByTestId('check-verdict');
    await expect(verdict.textContent()).resolves.toMatch(/Pass.*Slope 99\.\d % of Nernst, offset -3\.0 mV/);
    await page.getByRole('button', { name: 'Save check' }).click();
    await page.getByText('Saved: pH check passed.').waitFor();
    await expect(page.locator('.cards .card', { hasText: 'pH check · ✓ pass' }).count()).resolves.toBeGreaterThan(1);
    await shot(page, 'meter-checks');
  });

  it('shows a site history chart loaded on demand', async () => {
    await page.goto(served.url + '#/sites');
    await page.getByRole('link', { name: /WF-02/ }).click();
    await page.locator('.chart canvas').first().waitFor({ timeout: 10_000 });
    // two panels: SI with its band and the SI = 0 line, log pCO₂ below
    await expect(page.locator('.chart canvas').count()).resolves.toBe(2);
    await shot(page, 'site-chart');
  });

  it('a project profile: copy the default, change a limit, and the checks use the new version', async () => {
    await page.goto(served.url + '#/settings');
    await page.getByRole('button', { name: 'Make an editable copy' }).click();
    await page.getByLabel('pH slope minimum').fill('90');
    await page.getByRole('button', { name: 'Save as a new version' }).click();
    await page.getByText('Saved as version 2.').waitFor();
    await page.goto(served.url + '#/checks');
    await page.getByText('Method profile: Project profile (edited copy of the default), version 2.').waitFor();
    // a 92 % electrode fails the default (95 %) but passes this profile
    for (const [i, mv] of [[1, '0'], [2, `${(0.92 * 58.17 * 3).toFixed(1)}`], [3, `${(-0.92 * 58.17 * 3.01).toFixed(1)}`]] as const) {
      await page.getByLabel(`Buffer ${i} reading`).fill(mv);
      await page.getByLabel(`Buffer ${i} temperature`).fill('20');
    }
    await expect(page.getByTestId('check-verdict').textContent()).resolves.toMatch(/^✓ Pass · Slope 92\.\d % of Nernst/);
  });

  it('has no serious or critical accessibility violations (axe-core) on the main screens', async () => {
    for (const hash of ['#/today', '#/new', '#/checks', '#/sites', '#/settings', '#/about']) {
      await page.goto(served.url + hash);
      await page.locator('h1').waitFor();
      await page.waitForTimeout(200);
      const bad = (await axeViolations(page)).filter((v) => v.impact === 'serious' || v.impact === 'critical');
      expect(bad, `${hash}: ${JSON.stringify(bad)}`).toEqual([]);
    }
  });
});
