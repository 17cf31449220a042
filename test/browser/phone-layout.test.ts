// Every screen at 320, 360 and 390 px, offline with "No signal" showing: nothing wider than the
// phone, the bottom navigation fully on screen, the header its fixed height, every control at least
// 48 × 48 px, no serious axe-core finding; a screenshot of each screen at 360 px.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launch, serveDist, shot, type Served } from './helpers';
import { readyOffline } from './measure';
import { axeViolations } from './axe';
import { AREAS, DETAIL_PAGES, EXTRA_PAGES } from '../../src/ui/router';

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

// invented rows: one good, one with a bad latitude, so the preview shows both kinds of card
const SITES_CSV = 'code,name,type,latitude,longitude,datum,run_order\nWF-09,Wrenfold Creek below the long pool,stream,45.4871,-110.8702,WGS84,4\nWF-10,Wrenfold Creek tributary at the old ford with a long name,stream,95.1,-110.86,WGS84,5\n';
const LAB_CSV = 'sample_id,parameter,value,unit\nNO-SUCH-SAMPLE,chloride,4.2,mg/L\nNO-SUCH-SAMPLE,sulfate,abc,mg/L\n';

async function phone(width: number): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport: { width, height: 740 }, deviceScaleFactor: 2, hasTouch: true, isMobile: true });
  const page = await context.newPage();
  // every lazy screen once while online, so its chunk is cached for the offline walk
  await readyOffline(page, served.url, ['#/new', '#/day', '#/labels', '#/sites', '#/site/demo-site-wf01', '#/checks', '#/send', '#/lab', '#/settings', '#/about']);
  return { context, page };
}

interface Layout {
  docWidth: number;
  wide: string[];
  header: number;
  nav: { top: number; bottom: number; left: number; right: number };
  small: string[];
}

/** What a thumb meets on this screen, measured in the page. */
async function layout(page: Page, width: number): Promise<Layout> {
  return page.evaluate((w) => {
    const name = (el: Element) => {
      const txt = (el.getAttribute('aria-label') || el.textContent || (el as HTMLInputElement).name || el.id || '').trim().replace(/\s+/g, ' ').slice(0, 40);
      return `${el.tagName.toLowerCase()}${el.id ? '#' + el.id : ''} "${txt}"`;
    };
    const visible = (el: Element) => {
      const r = el.getBoundingClientRect();
      const cs = getComputedStyle(el);
      return r.width > 0 && r.height > 0 && cs.visibility !== 'hidden' && cs.display !== 'none';
    };
    const wide: string[] = [];
    for (const el of Array.from(document.querySelectorAll('body *'))) {
      if (!visible(el)) continue;
      // content inside its own scrolling box (or clipped) is allowed to be wider
      let clipped = false;
      for (let p = el.parentElement; p && p !== document.body; p = p.parentElement) {
        const ox = getComputedStyle(p).overflowX;
        if (ox === 'auto' || ox === 'scroll' || ox === 'hidden') { clipped = true; break; }
      }
      if (clipped) continue;
      const r = el.getBoundingClientRect();
      if (r.right > w + 0.5 || r.left < -0.5) wide.push(`${name(el)} ${Math.round(r.left)}…${Math.round(r.right)}`);
    }
    const controls = 'a[href], button, select, textarea, summary, input:not([type=radio]):not([type=checkbox]):not([type=hidden]), label.choice-opt, label.check-line, label.btn';
    const small: string[] = [];
    for (const el of Array.from(document.querySelectorAll(controls))) {
      if (!visible(el) || el.closest('.sr-only, .visually-hidden')) continue; // hidden inputs: their label is the target
      const r = el.getBoundingClientRect();
      if (r.width < 47.5 || r.height < 47.5) small.push(`${name(el)} ${Math.round(r.width)}×${Math.round(r.height)}`);
    }
    const nav = document.querySelector('nav.tabs')!.getBoundingClientRect();
    return {
      docWidth: document.documentElement.scrollWidth,
      wide: wide.slice(0, 10),
      header: document.querySelector('.topbar')!.getBoundingClientRect().height,
      nav: { top: nav.top, bottom: nav.bottom, left: nav.left, right: nav.right },
      small: small.slice(0, 20),
    };
  }, width);
}

interface Screen {
  name: string;
  hash: string;
  /** bring the screen into the state to look at (open folds, load a file) */
  prepare?: (page: Page) => Promise<void>;
}

const SCREENS: Screen[] = [
  { name: 'today', hash: '#/today' },
  { name: 'new-sample', hash: '#/new' },
  {
    name: 'new-sample-all-open',
    hash: '#/new',
    prepare: async (page) => {
      const closed = page.locator('details.fold:not([open]) > summary');
      while ((await closed.count()) > 0) await closed.first().click();
      await page.getByRole('radio', { name: 'Titration points' }).check();
      await page.getByRole('button', { name: 'New site here' }).click();
    },
  },
  {
    name: 'sample',
    hash: '#/today',
    prepare: async (page) => {
      await page.locator('.sample-card').first().click();
      await page.getByRole('button', { name: 'Save changes' }).waitFor();
    },
  },
  { name: 'day-summary', hash: '#/day' },
  { name: 'labels', hash: '#/labels' },
  { name: 'sites', hash: '#/sites' },
  {
    name: 'site',
    hash: '#/site/demo-site-wf02',
    prepare: async (page) => {
      await page.locator('.chart canvas').first().waitFor();
    },
  },
  { name: 'checks', hash: '#/checks' },
  { name: 'send', hash: '#/send' },
  {
    name: 'lab-preview',
    hash: '#/lab',
    prepare: async (page) => {
      await page.getByLabel('Lab results file (CSV)').setInputFiles({ name: 'lab.csv', mimeType: 'text/csv', buffer: Buffer.from(LAB_CSV) });
      await page.getByText(/rows ready/).waitFor();
    },
  },
  {
    name: 'sites-import-preview',
    hash: '#/sites',
    prepare: async (page) => {
      await page.locator('#site-import > summary').click();
      await page.locator('#site-import input[type=file]').setInputFiles({ name: 'sites.csv', mimeType: 'text/csv', buffer: Buffer.from(SITES_CSV) });
      await page.getByLabel('Site import preview').waitFor();
    },
  },
  { name: 'more', hash: '#/more' },
  { name: 'settings', hash: '#/settings' },
  { name: 'cautions', hash: '#/cautions' },
  { name: 'about', hash: '#/about' },
  { name: 'not-found', hash: '#/sample/%' },
];

async function visit(page: Page, s: Screen): Promise<void> {
  await page.goto(served.url + s.hash);
  await page.locator('h1').waitFor();
  await s.prepare?.(page);
  await page.waitForTimeout(150);
}

it('the walk below covers every route the app has', () => {
  const walked = new Set(SCREENS.map((s) => s.hash.replace(/^#\/([a-z]+).*$/, '$1')));
  walked.add('sample'); // opened from the day list
  walked.add('not-found'); // the malformed link #/sample/% above
  const routes = [...AREAS, ...EXTRA_PAGES, ...DETAIL_PAGES].map((r) => r.id);
  expect(routes.filter((r) => !walked.has(r))).toEqual([]);
});

describe.each([320, 360, 390])('every screen at %i px, offline', (width) => {
  let context: BrowserContext;
  let page: Page;
  beforeAll(async () => {
    ({ context, page } = await phone(width));
  });
  afterAll(async () => {
    await context?.close();
  });

  it('nothing wider than the phone, navigation fully visible, header fixed, targets ≥ 48 px', async () => {
    const problems: string[] = [];
    for (const s of SCREENS) {
      await visit(page, s);
      const l = await layout(page, width);
      if (l.docWidth > width) problems.push(`${s.name}: page ${l.docWidth} px wide: ${l.wide.join('; ')}`);
      else if (l.wide.length) problems.push(`${s.name}: wider than the phone: ${l.wide.join('; ')}`);
      if (l.header > 56.5) problems.push(`${s.name}: header ${l.header} px tall`);
      if (l.nav.bottom > 740.5 || l.nav.top < 600 || l.nav.left < -0.5 || l.nav.right > width + 0.5) problems.push(`${s.name}: navigation at ${JSON.stringify(l.nav)}`);
      if (l.small.length) problems.push(`${s.name}: controls under 48 px: ${l.small.join('; ')}`);
      if (width === 360) {
        await page.evaluate(() => scrollTo(0, 0));
        await shot(page, `phone-360-${s.name}`);
      }
    }
    expect(problems, problems.join('\n')).toEqual([]);
  });

  if (width === 360) {
    it('no serious or critical axe-core finding on the screens changed for the phone', async () => {
      const found: string[] = [];
      for (const s of SCREENS) {
        await visit(page, s);
        const bad = (await axeViolations(page)).filter((v) => v.impact === 'serious' || v.impact === 'critical');
        if (bad.length) found.push(`${s.name}: ${JSON.stringify(bad)}`);
      }
      expect(found, found.join('\n')).toEqual([]);
    });
  }
});
