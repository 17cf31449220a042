// Measures what a thumb does on a phone: taps, keystrokes and page scrolling, the way a crew
// member would do them (scroll just enough to see the next control, tap it, type, move on).
import type { Locator, Page } from 'playwright-core';
import { openControlled } from './helpers';

export interface Effort {
  taps: number;
  keystrokes: number;
  /** total vertical page movement in CSS px, whatever caused it (a thumb or focus moving) */
  scrollPx: number;
}

/** Start counting page scroll in this document (survives hash navigation, not reloads). */
export async function startScrollMeter(page: Page): Promise<void> {
  await page.evaluate(() => {
    const w = window as unknown as { __scroll: number; __lastY: number; __meter?: boolean };
    w.__scroll = 0;
    w.__lastY = scrollY;
    if (w.__meter) return;
    w.__meter = true;
    addEventListener('scroll', () => {
      w.__scroll += Math.abs(scrollY - w.__lastY);
      w.__lastY = scrollY;
    }, { passive: true });
  });
}

export async function scrolled(page: Page): Promise<number> {
  return page.evaluate(() => Math.round((window as unknown as { __scroll: number }).__scroll));
}

/**
 * The part of the viewport not covered by fixed or sticky bars (header, result strip, save bar,
 * navigation): a control is usable only when it lies inside it.
 */
export async function clearBand(page: Page): Promise<{ top: number; bottom: number }> {
  return page.evaluate(() => {
    let top = 0;
    let bottom = innerHeight;
    for (const el of Array.from(document.querySelectorAll<HTMLElement>('body *'))) {
      const pos = getComputedStyle(el).position;
      if (pos !== 'fixed' && pos !== 'sticky') continue;
      const r = el.getBoundingClientRect();
      if (r.height === 0 || r.bottom <= 0 || r.top >= innerHeight) continue;
      if (r.top < innerHeight / 2) top = Math.max(top, r.bottom);
      else bottom = Math.min(bottom, r.top);
    }
    return { top, bottom };
  });
}

export class Thumb {
  taps = 0;
  keystrokes = 0;
  constructor(private page: Page) {}

  /** Scroll the least a person would to bring the control fully into the clear band. */
  async bringIntoView(target: Locator): Promise<void> {
    for (let i = 0; i < 3; i++) {
      const box = await target.boundingBox();
      if (!box) throw new Error('control not rendered');
      const band = await clearBand(this.page);
      let delta = 0;
      if (box.y < band.top) delta = box.y - band.top - 8;
      else if (box.y + box.height > band.bottom) delta = box.y + box.height - band.bottom + 8;
      if (delta === 0) return;
      await this.page.evaluate((d) => scrollBy({ top: d, behavior: 'instant' }), delta);
    }
  }

  async tap(target: Locator): Promise<void> {
    await this.bringIntoView(target);
    await target.tap();
    this.taps += 1;
  }

  /** A native select: one tap opens it, one picks the option. */
  async choose(target: Locator, label: string): Promise<void> {
    await this.bringIntoView(target);
    await target.selectOption({ label });
    this.taps += 2;
  }

  /**
   * Type into a field: if the keyboard's "next" key (enterkeyhint=next) of the field in focus
   * leads here, press it (one keystroke); otherwise tap the field.
   */
  async fill(target: Locator, text: string): Promise<void> {
    const focused = await target.evaluate((el) => el === document.activeElement);
    if (!focused) {
      const hasNext = await this.page.evaluate(() => document.activeElement?.getAttribute('enterkeyhint') === 'next');
      if (hasNext) {
        await this.page.keyboard.press('Enter');
        this.keystrokes += 1;
      }
      const now = await target.evaluate((el) => el === document.activeElement);
      if (!now) await this.tap(target);
    }
    await this.page.keyboard.type(text);
    this.keystrokes += text.length;
  }
}

/** How many viewport heights the page is, with the keyboard closed. */
export async function screensTall(page: Page): Promise<number> {
  return page.evaluate(() => document.documentElement.scrollHeight / innerHeight);
}

/** The six core readings of one ordinary sample, typed as a crew would (site chosen first). */
export interface CoreValues {
  site: string;
  tempC: string;
  sc: string;
  pH: string;
  doMgL: string;
  alk: string;
  ca: string;
}

export async function enterCore(page: Page, thumb: Thumb, v: CoreValues): Promise<void> {
  await thumb.choose(page.getByLabel('Site', { exact: true }), v.site);
  await thumb.fill(page.getByLabel('Water temperature'), v.tempC);
  await thumb.fill(page.getByLabel('Specific conductance'), v.sc);
  await thumb.fill(page.getByLabel('pH', { exact: true }), v.pH);
  await thumb.fill(page.getByLabel('Dissolved oxygen', { exact: true }), v.doMgL);
  await thumb.fill(page.getByLabel('Alkalinity', { exact: true }), v.alk);
  await thumb.fill(page.getByLabel('Calcium (kit)'), v.ca);
}

/**
 * Open the app under its service worker, visit the given lazy screens while online (so their code
 * is cached), load the demo creek, then cut the network as at the bank.
 */
export async function readyOffline(page: Page, url: string, hashes: string[]): Promise<void> {
  await openControlled(page, url);
  for (const hash of hashes) {
    await page.goto(url + hash);
    await page.locator('h1').waitFor();
  }
  await page.goto(url + '#/today');
  await page.getByRole('button', { name: 'Load demo creek' }).click();
  await page.locator('.sample-card').first().waitFor();
  await page.context().setOffline(true);
  await page.getByText('No signal').waitFor();
}
