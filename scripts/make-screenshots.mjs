// Redraws the install-prompt pictures named in the manifest (public/screenshots/) from the real
// app: production build, served locally, the invented demo creek loaded, headless Chromium.
// Run after a visible change: `node scripts/make-screenshots.mjs`.
import { build, preview } from 'vite';
import { chromium } from 'playwright-core';
import { mkdirSync } from 'node:fs';

const out = 'public/screenshots';
mkdirSync(out, { recursive: true });
await build({ logLevel: 'warn' });
const server = await preview({ logLevel: 'warn', preview: { port: 0, host: '127.0.0.1' } });
const url = server.resolvedUrls.local[0];
const browser = await chromium.launch({
  executablePath: process.env.CHROMIUM_PATH || '/usr/bin/chromium',
  args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'],
});
/** A fresh context with the demo creek loaded on today's screen. */
async function demoPage(options) {
  const page = await (await browser.newContext(options)).newPage();
  await page.goto(url);
  await page.getByRole('button', { name: 'Load demo creek' }).click();
  await page.waitForFunction(() => document.querySelectorAll('.sample-card').length >= 3, null, { timeout: 20_000 });
  await page.waitForTimeout(500);
  return page;
}

try {
  // narrow: a phone at 390×844 CSS px, 2× (780×1688 image)
  const page = await demoPage({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
  await page.screenshot({ path: `${out}/today-narrow.png` });
  await page.locator('.sample-card a, a.sample-card').first().click();
  await page.locator('h1', { hasText: 'Sample' }).waitFor();
  await page.waitForTimeout(800);
  await page.screenshot({ path: `${out}/sample-narrow.png` });
  // wide: the same day on an office screen, 1280×800 at 1×
  const wide = await demoPage({ viewport: { width: 1280, height: 800 } });
  await wide.screenshot({ path: `${out}/today-wide.png` });
  console.log(`written: ${out}/today-narrow.png, sample-narrow.png, today-wide.png`);
} finally {
  await browser.close();
  await server.close();
}
