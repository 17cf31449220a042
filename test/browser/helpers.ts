// Shared plumbing for browser tests: a real Chromium and a real `vite preview` of dist/.
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { preview, type PreviewServer } from 'vite';
import { createServer } from 'node:net';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';

export const CHROMIUM = process.env.CHROMIUM_PATH || '/usr/bin/chromium';
export const SHOTS = join(process.cwd(), 'test-output', 'screenshots');

export const CHROMIUM_ARGS = [
  '--no-sandbox',
  '--disable-gpu',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
  '--no-first-run',
];

/**
 * Content-Security-Policy violations reported by any page of any browser test (the app ships a
 * strict policy in index.html). test/browser/setup.ts fails every test that leaves one here.
 */
export const cspViolations: string[] = [];

/** Report every `securitypolicyviolation` of the context's pages into {@link cspViolations}. */
export async function watchCsp(context: BrowserContext): Promise<void> {
  await context.exposeBinding('__banksideCspViolation', (_source, text: string) => {
    cspViolations.push(text);
  });
  await context.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      const report = (window as unknown as { __banksideCspViolation(t: string): void }).__banksideCspViolation;
      void report(`${e.effectiveDirective} blocked ${e.blockedURI || 'inline'} at ${e.sourceFile}:${e.lineNumber}`);
    });
  });
}

/** Headless Chromium whose every new context (and page) reports CSP violations. */
export async function launch(): Promise<Browser> {
  const browser = await chromium.launch({ executablePath: CHROMIUM, headless: true, args: CHROMIUM_ARGS });
  const newContext = browser.newContext.bind(browser);
  browser.newContext = async (options) => {
    const context = await newContext(options);
    await watchCsp(context);
    return context;
  };
  browser.newPage = async (options) => {
    const context = await browser.newContext(options);
    const page = await context.newPage();
    page.on('close', () => void context.close());
    return page;
  };
  return browser;
}

/** A browser profile on disk (install state needs one: an incognito context is never installable). */
export async function launchPersistent(userDataDir: string): Promise<BrowserContext> {
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: CHROMIUM,
    headless: true,
    args: CHROMIUM_ARGS,
    viewport: { width: 390, height: 844 },
    deviceScaleFactor: 2,
  });
  await watchCsp(context);
  return context;
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const addr = s.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      s.close(() => resolve(port));
    });
  });
}

export interface Served {
  url: string;
  close(): Promise<void>;
}

/** Serve dist/ with vite preview on a free loopback port (each test gets its own origin). */
export async function serveDist(): Promise<Served> {
  const port = await freePort();
  const server: PreviewServer = await preview({
    configFile: 'vite.config.ts',
    logLevel: 'warn',
    preview: { port, strictPort: true, host: '127.0.0.1', open: false },
  });
  return {
    url: `http://127.0.0.1:${port}/`,
    close: () => server.close(),
  };
}

/** A phone-sized context (390×844 CSS px at 2× like a current mid-range phone). */
export async function phoneContext(browser: Browser): Promise<BrowserContext> {
  return browser.newContext({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 2, hasTouch: true, isMobile: true });
}

/** Open the app and wait until our service worker controls the page. */
export async function openControlled(page: Page, url: string): Promise<void> {
  await page.goto(url);
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  // 'prompt' registration does not claim the first page: a reload brings it under control.
  await page.reload();
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null, null, { timeout: 20_000 });
}

export async function shot(page: Page, name: string): Promise<string> {
  mkdirSync(SHOTS, { recursive: true });
  const path = join(SHOTS, `${name}.png`);
  await page.screenshot({ path, fullPage: false });
  return path;
}

const MIME: Record<string, string> = {
  '.html': 'text/html; charset=utf-8', '.js': 'text/javascript', '.css': 'text/css', '.png': 'image/png',
  '.svg': 'image/svg+xml', '.webmanifest': 'application/manifest+json', '.json': 'application/json', '.txt': 'text/plain',
};

/**
 * A plain static server over dist/ whose files can be swapped while it runs: used to "deploy" a
 * new release (a changed sw.js) to a page that is open.
 */
export async function serveSwappable(opts: { folder?: string } = {}): Promise<Served & { replace(path: string, body: string): void; requests: string[] }> {
  const folder = opts.folder ?? '/';
  const { createServer } = await import('node:http');
  const { readFile } = await import('node:fs/promises');
  const { extname } = await import('node:path');
  const overrides = new Map<string, string>();
  const requests: string[] = [];
  const server = createServer(async (req, res) => {
    const full = decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname);
    requests.push(full);
    // served under `folder` only: anything the app asks for outside it is a 404, as on a shared host
    if (!full.startsWith(folder) || full.includes('..')) return void res.writeHead(404).end('not found');
    const path = '/' + full.slice(folder.length);
    const file = path === '/' ? '/index.html' : path;
    try {
      const body = overrides.get(file) ?? (await readFile(join(process.cwd(), 'dist', file)));
      res.writeHead(200, { 'Content-Type': MIME[extname(file)] ?? 'application/octet-stream', 'Cache-Control': 'no-cache' });
      res.end(body);
    } catch {
      res.writeHead(404).end('not found');
    }
  });
  const port = await freePort();
  await new Promise<void>((r) => server.listen(port, '127.0.0.1', () => r()));
  return {
    url: `http://127.0.0.1:${port}${folder}`,
    requests,
    replace: (p: string, body: string) => overrides.set(p, body),
    close: () => new Promise<void>((r) => { server.closeAllConnections(); server.close(() => r()); }),
  };
}

/** The production app in a phone-sized context, controlled by its service worker, then offline. */
export async function offlinePhoneApp(): Promise<{ served: Served; context: BrowserContext; page: Page; close(): Promise<void> }> {
  const browser = await launch();
  const served = await serveDist();
  const context = await phoneContext(browser);
  const page = await context.newPage();
  await openControlled(page, served.url);
  await context.setOffline(true);
  return {
    served,
    context,
    page,
    close: async () => {
      await context.close();
      await browser.close();
      await served.close();
    },
  };
}
