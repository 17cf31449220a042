import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { readFileSync } from 'node:fs';
import { launch, openControlled, phoneContext, serveDist, shot, type Served } from './helpers';

let browser: Browser;
let served: Served | null;

beforeAll(async () => {
  browser = await launch();
  served = await serveDist();
});
afterAll(async () => {
  await served?.close();
  await browser?.close();
});

describe('offline app shell (production build + service worker)', () => {
  it('opens and navigates with the network cut and the server stopped', async () => {
    const context = await phoneContext(browser);
    const page = await context.newPage();
    const url = served!.url;
    await openControlled(page, url);
    await page.getByText('Ready offline').waitFor({ timeout: 15_000 });
    await shot(page, 'shell-today-online');

    // No network at the bank: both the browser's network and the server are gone.
    await context.setOffline(true);
    await served!.close();
    served = null;

    await page.reload();
    await expect(page.locator('h1').textContent()).resolves.toBe("Today's samples");
    await page.getByRole('link', { name: 'Sites' }).click();
    await expect(page.locator('h1').textContent()).resolves.toBe('Sites');
    await page.getByRole('link', { name: 'Checks' }).click();
    await expect(page.locator('h1').textContent()).resolves.toBe('Meter checks');
    await page.getByRole('link', { name: 'More' }).click();
    await page.getByRole('link', { name: 'Cautions' }).click();
    await expect(page.locator('h1').textContent()).resolves.toBe('Cautions');
    await shot(page, 'shell-cautions-offline');

    // A deep link typed or bookmarked while offline is answered by the shell too.
    await page.goto(url + '#/send');
    await expect(page.locator('h1').textContent()).resolves.toBe('Send to office');
    await page.getByText('No signal').waitFor({ timeout: 5_000 });
    await context.close();
  });

  it('is installable: our manifest with any and maskable icons, served and precached', async () => {
    const context = await phoneContext(browser);
    const page = await context.newPage();
    const s = await serveDist();
    try {
      await page.goto(s.url);
      const href = await page.locator('link[rel="manifest"]').getAttribute('href');
      expect(href).toBeTruthy();
      const manifest = await page.evaluate(async (h) => (await fetch(h!)).json(), href);
      expect(manifest.short_name).toBe('Bankside');
      expect(manifest.display).toBe('standalone');
      const purposes = (manifest.icons as Array<{ sizes: string; purpose: string }>).map((i) => `${i.sizes} ${i.purpose}`);
      expect(purposes).toEqual(expect.arrayContaining(['192x192 any', '512x512 any', '192x192 maskable', '512x512 maskable']));
      // The built worker is a classic script (no top-level import/export) so it registers everywhere.
      const sw = readFileSync('dist/sw.js', 'utf8');
      expect(sw).not.toMatch(/^\s*(import|export)\s/m);
      for (const icon of ['icons/icon-192.png', 'icons/maskable-512.png', 'index.html', 'manifest.webmanifest']) {
        expect(sw).toContain(icon);
      }
    } finally {
      await s.close();
      await context.close();
    }
  });
});
