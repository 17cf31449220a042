// The sample screen's pure helpers: dates in the device's locale, history in words, one refused
// entry marked on its own box without blanking the rest, warnings sorted into action and notice,
// the chart's fixed SI scale. Expected values are our own rules (src/ui/*), no published values.
// Source of the expected values: our own display rules; the SI scale −1…+1.5 is common practice for calcite plots.
import { describe, expect, it } from 'vitest';
import { showDate, showDateTime, showOffset, showTime, showAge } from '../../src/ui/format';
import { describeChange } from '../../src/ui/history-words';
import { deriveLive } from '../../src/ui/forms/live-derive';
import { emptyForm, formToSample, type SampleForm } from '../../src/ui/forms/sample-form';
import { splitWarnings, warningKind } from '../../src/ui/warning-kinds';
import { DEFAULT_PROFILE } from '../../src/chemistry';
import { DEFAULT_SETTINGS } from '../../src/records/defaults';
import { widen, SI_RANGE } from '../../src/ui/chart-scale';

const T = (v: string) => [{ v, t: '2026-06-14T09:30:00-06:00' }];

function form(patch: Partial<SampleForm>): SampleForm {
  return { ...emptyForm(new Date('2026-06-14T15:30:00Z')), siteId: 'demo-site-wf01', time: '2026-06-14T09:30:00-06:00', ...patch };
}

describe('dates and times in the device locale, a sample at its own offset', () => {
  const en = (o: Intl.DateTimeFormatOptions, d: Date) => new Intl.DateTimeFormat(undefined, { ...o, timeZone: 'UTC' }).format(d);
  it('shows the wall-clock time the crew wrote, whatever the phone’s zone', () => {
    // 09:30 at −06:00 is 15:30 UTC; the crew recorded 09:30
    expect(showTime('2026-06-14T09:30:00-06:00')).toBe(en({ hour: '2-digit', minute: '2-digit' }, new Date(Date.UTC(2026, 5, 14, 9, 30))));
    expect(showDate('2026-06-14')).toBe(en({ day: 'numeric', month: 'short', year: 'numeric' }, new Date(Date.UTC(2026, 5, 14, 12))));
    expect(showDateTime('2026-06-14T23:50:00+09:00')).toContain(en({ day: 'numeric' }, new Date(Date.UTC(2026, 5, 14))));
  });
  it('says the offset and an age in words; odd input comes back as it was', () => {
    expect(showOffset('2026-06-14T09:30:00-06:00')).toBe('UTC−06:00');
    expect(showOffset('2026-06-14T09:30:00Z')).toBe('UTC');
    expect(showAge(4_400)).toBe('4 s ago');
    expect(showAge(125_000)).toBe('2 min ago');
    expect(showTime('not a time')).toBe('not a time');
  });
});

describe('history in words', () => {
  it('names the reading, its number and its unit', () => {
    expect(describeChange({ path: 'field.do.values.0.value', from: 9.8, to: 9.6 })).toBe('DO reading 1: 9.8 → 9.6 mg/L');
    expect(describeChange({ path: 'field.do.values.1.value', from: 101, to: 99 }, '%')).toBe('DO reading 2: 101 → 99 %');
    expect(describeChange({ path: 'field.tempC.values.0.value', from: 9.4, to: 9.5 })).toBe('Temperature reading 1: 9.4 → 9.5 °C');
    expect(describeChange({ path: 'field.ions.clMgL', from: undefined, to: 4.2 })).toBe('Chloride: (empty) → 4.2 mg/L');
    expect(describeChange({ path: 'pressure.value', from: 29.9, to: 845 })).toBe('Barometric pressure: 29.9 → 845');
    expect(describeChange({ path: 'siteId', from: 'a', to: 'b' }, 'mg/L', (id) => (id === 'a' ? 'WF-01' : 'WF-02'))).toBe('Site: WF-01 → WF-02');
  });
  it('never shows a stored path, even for a field it has no name for', () => {
    const line = describeChange({ path: 'field.alkalinity.titration.countsPerMl', from: 800, to: 810 });
    expect(line).not.toMatch(/field\.|\.\d|countsPerMl/);
    expect(describeChange({ path: 'someNewThing.innerValue', from: 1, to: 2 })).toBe('Inner Value: 1 → 2');
  });
});

describe('one refused entry stays on its own box', () => {
  const core = { temp: T('9.4'), cond: T('450'), pH: T('8.1'), do: T('9.8'), alk: '180', kitValue: '60' };
  it('a pressure of 29.9 hPa is marked on the pressure box; SI and the state are still computed', () => {
    const good = form(core);
    const slip = form({ ...core, pressure: '29.9', pressureUnit: 'hPa' });
    const a = deriveLive(good, formToSample(good).record, [], DEFAULT_SETTINGS, DEFAULT_PROFILE);
    const b = deriveLive(slip, formToSample(slip).record, [], DEFAULT_SETTINGS, DEFAULT_PROFILE);
    expect(b.errors.pressure).toMatch(/^Barometric pressure 29\.9 hPa is outside \d+–\d+ hPa: check the value and its unit\.$/);
    expect(b.derived.error).toBeUndefined();
    expect(b.derived.analysis?.saturationIndex.calcite).toBeCloseTo(a.derived.analysis!.saturationIndex.calcite!, 10);
    expect(b.derived.analysis?.calciteState).toBe(a.derived.analysis?.calciteState);
    expect(Object.keys(a.errors)).toEqual([]);
  });
  it('the allowed range is said in the unit the crew typed (kPa here)', () => {
    const slip = form({ ...core, pressure: '2.99', pressureUnit: 'kPa' });
    const r = deriveLive(slip, formToSample(slip).record, [], DEFAULT_SETTINGS, DEFAULT_PROFILE);
    expect(r.errors.pressure).toMatch(/^Barometric pressure 2\.99 kPa is outside [\d.]+–[\d.]+ kPa/);
  });
});

describe('warnings: action beside Save, notices in the details', () => {
  it('the engine’s own kind decides; codes without one fall back to the list', () => {
    expect(warningKind({ code: 'pco2-high', message: '', kind: 'action' })).toBe('action');
    expect(warningKind({ code: 'ph-unusual', message: '', kind: 'notice' })).toBe('notice');
    expect(warningKind({ code: 'ionic-strength-estimated', message: '' })).toBe('notice');
    expect(warningKind({ code: 'gran-poor-fit', message: '' })).toBe('action');
    expect(warningKind({ code: 'calcite-needs-inputs', message: '' })).toBe('missing');
  });
  it('a good ordinary sample has nothing to act on', () => {
    const f = form({ temp: T('9.4'), cond: T('450'), pH: T('8.1'), do: T('9.8'), alk: '180', kitValue: '60' });
    const r = deriveLive(f, formToSample(f).record, [], DEFAULT_SETTINGS, DEFAULT_PROFILE);
    expect(splitWarnings(r.derived.warnings).action.map((w) => w.code)).toEqual([]);
  });
});

describe('site chart scale', () => {
  it('keeps −1…+1.5 unless a value or its band needs more, then widens by half steps', () => {
    expect(widen(SI_RANGE, -0.2, 0.3, 0.1)).toEqual([-1, 1.5]);
    expect(widen(SI_RANGE, -0.2 - 0.07, -0.2 + 0.07, 0.1)).toEqual([-1, 1.5]); // a 0.07 change does not fill the plot
    expect(widen(SI_RANGE, -4.1, 0.3, 0.1)).toEqual([-4.5, 1.5]);
    expect(widen(SI_RANGE, 0, 1.9, 0.1)).toEqual([-1, 2]);
  });
});
