// Cold start offline with 4× CPU throttling: Bankside against a bare Preact page, both built and
// served with a precaching service worker. Measures first contentful paint and the time until the
// new-sample form accepts input. Used by bench.mjs.
import { build, preview } from 'vite';
import preact from '@preact/preset-vite';
import { VitePWA } from 'vite-plugin-pwa';

async function serve(outDir) {
  const server = await preview({ configFile: false, root: process.cwd(), build: { outDir }, preview: { port: 0, host: '127.0.0.1' }, logLevel: 'silent' });
  return { url: server.resolvedUrls.local[0], close: () => server.close() };
}

export async function buildBare() {
  await build({
    configFile: false,
    root: 'test/bench/bare',
    logLevel: 'silent',
    build: { outDir: '../../../dist-bare', emptyOutDir: true },
    plugins: [preact(), VitePWA({ registerType: 'autoUpdate', injectRegister: 'inline', manifest: false })],
  });
}

async function measure(browser, url, hash, inputSelector) {
  const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const warm = await context.newPage();
  await warm.goto(url);
  await warm.evaluate(async () => { await navigator.serviceWorker.ready; });
  await warm.reload();
  await warm.waitForFunction(() => navigator.serviceWorker.controller !== null, null, { timeout: 20_000 });
  await warm.close();
  await context.setOffline(true);
  const runs = [];
  for (let i = 0; i < 5; i++) {
    const page = await context.newPage();
    const cdp = await context.newCDPSession(page);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    const t0 = Date.now();
    await page.goto(url + hash, { waitUntil: 'commit' });
    await page.waitForSelector(inputSelector, { state: 'visible', timeout: 30_000 });
    await page.locator(inputSelector).focus();
    const ready = Date.now() - t0;
    const fcp = await page.evaluate(() => performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? NaN);
    runs.push({ ready, fcp });
    await page.close();
  }
  await context.close();
  const med = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
  return { fcp: med(runs.map((r) => r.fcp)), ready: med(runs.map((r) => r.ready)) };
}

export async function coldStart(browser) {
  await build({ logLevel: 'silent' });
  await buildBare();
  const app = await serve('dist');
  const bare = await serve('dist-bare');
  try {
    const a = await measure(browser, app.url, '#/new', '#temp-0');
    const b = await measure(browser, bare.url, '', '#temp-0');
    return { app: a, bare: b };
  } finally {
    await app.close();
    await bare.close();
  }
}
