// The sample screen as a gloved crew uses it, at 360 × 740, offline: crew and usual units from
// Settings, the keypad's "next" through the core readings, a warning visible with Save, a unit slip
// marked on its own box, the time picker keeping the offset, delete asked once with undo in place,
// history in words, folds remembered per crew, and a fresh position fix with its accuracy and age.
// Readings are invented for the demo creek.
// Source of the limits: the 5 s fix age and 30 m accuracy warning are our own choices (common practice for a fresh GPS fix).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Locator, Page } from 'playwright-core';
import { launch, serveDist, shot, type Served } from './helpers';
import { enterCore, readyOffline, Thumb } from './measure';

let browser: Browser;
let served: Served;
let context: BrowserContext;
let page: Page;

const SITE = 'WF-01 · Wrenfold Creek at the upper footbridge';

/** Open a folded section (it may already be open: folds are remembered per crew). */
async function openFold(p: Page, id: string): Promise<void> {
  await p.waitForFunction((i) => document.getElementById(i) !== null, id);
  if ((await p.locator(`#${id}`).getAttribute('open')) === null) await p.locator(`#${id} > summary`).click();
  await p.waitForFunction((i) => document.getElementById(i)?.hasAttribute('open'), id);
}

async function inView(l: Locator): Promise<boolean> {
  return l.evaluate((el) => {
    const r = el.getBoundingClientRect();
    const nav = document.querySelector('nav.tabs')!.getBoundingClientRect();
    return r.top >= 56 && r.bottom <= nav.top && r.height > 0;
  });
}

beforeAll(async () => {
  browser = await launch();
  served = await serveDist();
  context = await browser.newContext({ viewport: { width: 360, height: 740 }, deviceScaleFactor: 2, hasTouch: true, isMobile: true });
  await context.grantPermissions(['geolocation']);
  await context.setGeolocation({ latitude: 45.4871, longitude: -110.8702, accuracy: 45 });
  // record the options the app asks the platform for (the platform's own answer is unchanged)
  await context.addInitScript(() => {
    const g = navigator.geolocation;
    const orig = g.getCurrentPosition.bind(g);
    (window as unknown as { __geoOptions: PositionOptions[] }).__geoOptions = [];
    g.getCurrentPosition = (ok, fail, opts) => {
      (window as unknown as { __geoOptions: PositionOptions[] }).__geoOptions.push(opts ?? {});
      orig(ok, fail, opts);
    };
  });
  page = await context.newPage();
  await readyOffline(page, served.url, ['#/new', '#/sites', '#/settings']);
});
afterAll(async () => {
  await context?.close();
  await browser?.close();
  await served?.close();
});

describe('the sample screen at 360 × 740, offline', () => {
  it('takes the crew and the usual units from Settings', async () => {
    await page.goto(served.url + '#/settings');
    await page.getByLabel('Your name (recorded with each change)').fill('R. Okafor');
    await page.getByLabel('Usual alkalinity unit').selectOption('meq/L');
    await page.getByLabel('Usual dissolved oxygen unit').selectOption('%');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Settings saved.').waitFor();
    await page.goto(served.url + '#/new');
    // Settings are read once the screen is up; an untouched new form then takes them
    await page.waitForFunction(() => (document.getElementById('alkUnit') as HTMLSelectElement | null)?.value === 'meq/L');
    await expect(page.getByLabel('Dissolved oxygen unit').inputValue()).resolves.toBe('%');
    await expect(page.locator('#when .fold-extra').textContent()).resolves.toContain('R. Okafor');
    // back to the usual units for the rest of the file
    await page.goto(served.url + '#/settings');
    await page.getByLabel('Usual alkalinity unit').selectOption('mg/L CaCO3');
    await page.getByLabel('Usual dissolved oxygen unit').selectOption('mg/L');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Settings saved.').waitFor();
  });

  it('the keypad "next" goes through the six core readings in field order, "done" on the last', async () => {
    await page.goto(served.url + '#/new');
    const order = await page.locator('.core input[enterkeyhint]').evaluateAll((els) => els.map((e) => `${e.id}:${e.getAttribute('enterkeyhint')}:${e.getAttribute('inputmode')}`));
    expect(order).toEqual(['temp-0:next:decimal', 'cond-0:next:decimal', 'ph-0:next:decimal', 'do-0:next:decimal', 'alk:next:decimal', 'kit:done:decimal']);
    await page.getByLabel('Water temperature').focus();
    const visited: string[] = [];
    for (let i = 0; i < 5; i++) {
      await page.keyboard.press('Enter');
      visited.push(await page.evaluate(() => document.activeElement?.id ?? ''));
    }
    expect(visited).toEqual(['cond-0', 'ph-0', 'do-0', 'alk', 'kit']);
    await page.keyboard.press('Enter'); // done: closes the keyboard, does not save
    await expect(page.evaluate(() => document.activeElement?.tagName)).resolves.toBe('BODY');
    await expect(page.getByText('Before saving, add').count()).resolves.toBe(0);
  });

  it('a warning that needs action is on screen whenever Save is', async () => {
    await page.goto(served.url + '#/new');
    const thumb = new Thumb(page);
    // pH 4.6 in a hard-water stream: a reading to check before leaving
    await enterCore(page, thumb, { site: SITE, tempC: '9.4', sc: '450', pH: '4.6', doMgL: '9.8', alk: '180', ca: '60' });
    const save = page.getByRole('button', { name: 'Save sample' });
    await thumb.bringIntoView(save);
    const warning = page.locator('.save-warnings li').first();
    await warning.waitFor();
    expect(await inView(save)).toBe(true);
    expect(await inView(warning)).toBe(true);
    await shot(page, 'sample-warning-beside-save-360');
    // standing notices are not among them: they sit in the result's details
    const codes = await page.locator('.save-warnings li').evaluateAll((els) => els.map((e) => e.getAttribute('data-code')));
    expect(codes).not.toContain('ionic-strength-estimated');
  });

  it('a pressure slip (29.9 in hPa) marks its own box; the state and SI stay on screen', async () => {
    await page.goto(served.url + '#/new');
    await page.getByLabel('Water temperature').fill('9.4');
    await page.getByLabel('Specific conductance').fill('450');
    await page.getByLabel('pH', { exact: true }).fill('8.1');
    await page.getByLabel('Dissolved oxygen', { exact: true }).fill('9.8');
    await page.getByLabel('Alkalinity', { exact: true }).fill('180');
    await page.getByLabel('Calcium (kit)').fill('60');
    const si = await page.locator('.save-state .mini-si').textContent();
    await openFold(page, 'conditions');
    await page.getByLabel('Barometric pressure (true, at the site)').fill('29.9');
    const box = page.getByLabel('Barometric pressure (true, at the site)');
    await expect(box.getAttribute('aria-invalid')).resolves.toBe('true');
    await page.getByText(/^Barometric pressure 29\.9 hPa is outside \d+–\d+ hPa: check the value and its unit\.$/).waitFor();
    await expect(page.locator('.save-state .mini-si').textContent()).resolves.toBe(si);
    await expect(page.locator('.save-state .state').getAttribute('data-state')).resolves.toBe('supersaturated');
    await shot(page, 'sample-pressure-slip-360');
    await page.getByLabel('Barometric pressure (true, at the site)').fill('');
  });

  it('records the time from the platform picker and keeps the sample’s UTC offset', async () => {
    await page.goto(served.url + '#/new');
    await openFold(page, 'when');
    const label = await page.locator('label[for=time]').textContent();
    const offset = /\((UTC[^)]*)\)/.exec(label ?? '')?.[1];
    expect(offset).toMatch(/^UTC([+−]\d{2}:\d{2})?$/);
    await expect(page.getByLabel(/Sampling time/).getAttribute('type')).resolves.toBe('datetime-local');
    await page.getByLabel(/Sampling time/).fill('2026-06-14T09:30');
    await page.getByLabel('Site', { exact: true }).selectOption({ label: SITE });
    await page.getByLabel('Water temperature').fill('9.4');
    await page.getByLabel('pH', { exact: true }).fill('8.1');
    await page.getByLabel('Dissolved oxygen', { exact: true }).fill('9.8');
    await page.getByRole('button', { name: 'Save sample' }).click();
    await page.getByText('Sample saved on this phone.').waitFor({ timeout: 5000 }).catch(async (err) => {
      await shot(page, 'debug-time-save');
      throw err;
    });
    expect(page.url()).toContain('date=2026-06-14');
    const card = page.locator('.sample-card', { hasText: 'pH 8.10' });
    await card.click();
    await page.getByRole('button', { name: 'Save changes' }).waitFor();
    await expect(page.locator('#when .fold-extra').textContent()).resolves.toMatch(/09:30|9:30/);
    await openFold(page, 'when');
    await expect(page.getByLabel(/Sampling time/).inputValue()).resolves.toBe('2026-06-14T09:30');
    await expect(page.locator('label[for=time]').textContent()).resolves.toContain(offset!);
  });

  it('history says what changed in words; delete asks once and is undone on the same screen', async () => {
    // still on the sample saved above
    await page.getByLabel('Dissolved oxygen', { exact: true }).fill('9.6');
    await page.getByRole('button', { name: 'Save changes' }).click();
    await page.getByText('Sample saved on this phone.').waitFor();
    await page.locator('.sample-card', { hasText: 'pH 8.10' }).click();
    await page.getByRole('button', { name: 'Save changes' }).waitFor();
    await page.getByText(/^History/).click();
    await page.getByText('DO reading 1: 9.8 → 9.6 mg/L').waitFor();
    await expect(page.locator('.history').textContent()).resolves.not.toMatch(/field\.|values\.\d/);

    await page.getByRole('button', { name: /Delete this sample/ }).click();
    await page.getByRole('alertdialog', { name: 'Delete this sample?' }).waitFor();
    await shot(page, 'sample-delete-asks-360');
    await page.getByRole('button', { name: 'Delete', exact: true }).click();
    await page.getByText('This sample is deleted.').first().waitFor();
    expect(page.url()).toContain('#/sample/');
    await expect(page.getByRole('button', { name: 'Save changes' }).isDisabled()).resolves.toBe(true);
    const undo = page.getByRole('button', { name: 'Undo delete' }).last();
    expect(await inView(undo)).toBe(true);
    await undo.click();
    await page.getByRole('button', { name: /Delete this sample/ }).waitFor();
    await expect(page.getByText('This sample is deleted.').count()).resolves.toBe(0);
    await expect(page.getByRole('button', { name: 'Save changes' }).isDisabled()).resolves.toBe(false);
  });

  it('optional sections stay open or closed per crew', async () => {
    await page.goto(served.url + '#/new');
    await expect(page.locator('#ions').getAttribute('open')).resolves.toBeNull();
    await page.locator('#ions > summary').click();
    await page.goto(served.url + '#/today');
    await page.goto(served.url + '#/new');
    await page.waitForFunction(() => document.getElementById('ions')?.hasAttribute('open'));
    // another crew on the same phone starts with its own choice
    await page.goto(served.url + '#/settings');
    await page.getByLabel('Your name (recorded with each change)').fill('T. Lindqvist');
    await page.getByRole('button', { name: 'Save settings' }).click();
    await page.getByText('Settings saved.').waitFor();
    await page.goto(served.url + '#/new');
    await page.locator('.core').waitFor();
    // the form may render before the new operator's name is read from storage: wait for its folds
    await page.waitForFunction(() => document.getElementById('ions')?.hasAttribute('open') === false);
  });

  it('"Use my position" asks for a fresh fix and shows its accuracy and age, warning above 30 m', async () => {
    await page.goto(served.url + '#/sites');
    await context.setGeolocation({ latitude: 45.4871, longitude: -110.8702, accuracy: 45 });
    await page.getByRole('button', { name: 'Use my position' }).click();
    const info = page.getByTestId('fix-info');
    await info.waitFor();
    await expect(info.textContent()).resolves.toMatch(/Fix ±45 m, taken \d+ s ago\..*Coarser than 30 m/);
    await expect(page.getByLabel('Latitude (WGS84)').inputValue()).resolves.toBe('45.487100');
    const opts = await page.evaluate(() => (window as unknown as { __geoOptions: PositionOptions[] }).__geoOptions);
    expect(opts.at(-1)!.maximumAge).toBeLessThanOrEqual(5000);
    expect(opts.at(-1)!.enableHighAccuracy).toBe(true);
    await shot(page, 'sites-position-fix-360');
  });
});
