// The calcite SI band at the bank: shown as a 95 % band, opening to its budget (issue 12).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launch, openControlled, phoneContext, serveDist, shot, type Served } from './helpers';

let browser: Browser;
let served: Served;
let context: BrowserContext;
let page: Page;

beforeAll(async () => {
  browser = await launch();
  served = await serveDist();
  context = await phoneContext(browser);
  page = await context.newPage();
  await openControlled(page, served.url);
  await context.setOffline(true);
});
afterAll(async () => {
  await context?.close();
  await browser?.close();
  await served?.close();
});

describe('the band and its budget', () => {
  it('a demo sample shows "± x (95 %)", and the opened Calcite SI row lists each source with what narrows it', async () => {
    await page.getByRole('button', { name: 'Load demo creek' }).click();
    await page.waitForFunction(() => document.querySelectorAll('.sample-card').length === 3, undefined, { timeout: 10_000 });
    await page.locator('.sample-card').first().click();
    const results = page.locator('#results');
    await results.waitFor();
    if (!(await results.evaluate((el) => (el as HTMLDetailsElement).open))) await results.locator('summary').first().click();
    await expect(page.getByTestId('calcite-si').textContent()).resolves.toMatch(/± \d\.\d\d \(95 %\)/);
    await page.getByTestId('calcite-si-row').click();
    const budget = page.getByTestId('band-budget');
    await budget.waitFor();
    const text = (await budget.textContent()) ?? '';
    expect(text).toMatch(/95 times in 100/);
    expect(text).toMatch(/pH reading: \d+ %: a second stable pH reading/);
    await page.setViewportSize({ width: 360, height: 780 });
    await budget.scrollIntoViewIfNeeded();
    await shot(page, 'band-budget');
    // notices sit folded apart from the warnings that need action
    const notices = page.locator('details.notices');
    await expect(notices.count()).resolves.toBe(1);
    await expect(notices.locator('summary').textContent()).resolves.toMatch(/Notes on this result \(\d+\)/);
    await expect(page.locator('.warnings li[data-code="ionic-strength-estimated"]').count()).resolves.toBe(0);
  });
});
