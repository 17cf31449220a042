// Parsing rules are our own (source: src/ui/forms/parse.ts); no published values are involved.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseDecimal } from '../../src/ui/forms/parse';
import { emptyForm, formFromSample, formToSample } from '../../src/ui/forms/sample-form';
import { Sample } from '../../src/records/schema';

describe('parseDecimal', () => {
  it('accepts a decimal comma or point, and signs', () => {
    expect(parseDecimal('7,85', { label: 'pH' })).toEqual({ ok: true, value: 7.85 });
    expect(parseDecimal(' 7.85 ', { label: 'pH' })).toEqual({ ok: true, value: 7.85 });
    expect(parseDecimal('-0,4', { label: 'temperature' })).toEqual({ ok: true, value: -0.4 });
    expect(parseDecimal(',5', { label: 'x' })).toEqual({ ok: true, value: 0.5 });
  });
  it('empty is missing, never zero; required empty is an error in words', () => {
    expect(parseDecimal('', { label: 'pH' })).toEqual({ ok: true, value: undefined });
    const r = parseDecimal('  ', { label: 'pH', required: true });
    expect(r.ok).toBe(false);
  });
  it.each(['abc', '7..8', '1.234,5', '0x10', '7,8,9', '--1', '1e', 'NaN', 'Infinity'])('refuses %s with a message', (s) => {
    const r = parseDecimal(s, { label: 'pH' });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.error.length).toBeGreaterThan(10);
  });
  it('explains range errors with the unit', () => {
    const r = parseDecimal('15', { label: 'pH', min: 0, max: 14 });
    expect(r).toEqual({ ok: false, error: 'pH 15 is above 14: check the reading and its unit.' });
  });
  it('property: any finite number written with point or comma parses back to itself', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), fc.boolean(), (x, comma) => {
        const s = comma ? String(x).replace('.', ',') : String(x);
        const r = parseDecimal(s, { label: 'x' });
        return r.ok && r.value === x;
      }),
      { seed: 11, numRuns: 500 },
    );
  });
  it('property: arbitrary text never becomes a silent zero', () => {
    fc.assert(
      fc.property(fc.string(), (s) => {
        const r = parseDecimal(s, { label: 'x' });
        if (!r.ok) return true;
        if (r.value === undefined) return s.trim() === '';
        return r.value !== 0 || /0/.test(s);
      }),
      { seed: 12, numRuns: 1000 },
    );
  });
});

describe('sample form ↔ record', () => {
  it('maps raw strings to a valid record; mS/cm converts; bad fields are named, not zeroed', () => {
    const f = emptyForm(new Date('2026-06-14T15:30:00Z'));
    f.siteId = 'site-1';
    f.time = '2026-06-14T09:30:00-06:00';
    f.temp = [{ v: '9,4', t: '2026-06-14T09:30:00-06:00' }];
    f.condUnit = 'mS/cm';
    f.cond = [{ v: '0,301', t: '2026-06-14T09:30:00-06:00' }];
    f.pH = [{ v: '7.8x', t: '' }];
    f.alk = '160';
    f.kitValue = '150';
    f.kitUnit = 'mg/L CaCO3';
    const r = formToSample(f);
    expect(r.errors).toEqual({ 'pH.0': '“7.8x” is not a number. Use digits with one decimal point or comma.' });
    expect(r.record.field!.conductance!.values[0]!.value).toBeCloseTo(301, 9);
    expect(r.record.field!.pH).toBeUndefined();
    expect(r.record.field!.kits).toEqual([{ analyte: 'calcium-hardness', value: 150, unit: 'mg/L CaCO3', fraction: 'total' }]);
    // a kit run on filtered water records the dissolved fraction (WQX Result Sample Fraction)
    expect(formToSample({ ...f, kitFiltered: true }).record.field!.kits![0]!.fraction).toBe('dissolved');
    expect(Sample.safeParse({ ...r.record, id: 'x', createdAt: f.time, updatedAt: f.time, localDate: '2026-06-14' }).success).toBe(true);
  });
  it('round-trips a stored sample through the form unchanged', () => {
    const f = emptyForm();
    f.siteId = 'site-1';
    f.time = '2026-06-14T09:30:00-06:00';
    f.temp = [{ v: '9.4', t: '2026-06-14T09:30:00-06:00' }, { v: '9.5', t: '2026-06-14T09:30:30-06:00' }];
    f.pH = [{ v: '7.81', t: '2026-06-14T09:30:00-06:00' }];
    f.alkMode = 'titration';
    f.titNormality = '1.6';
    f.titEquipment = 'digital-titrator';
    f.titPoints = [{ amount: '0', pH: '8.0' }, { amount: '150', pH: '4.4' }, { amount: '170', pH: '3.5' }];
    f.ions.clMgL = '7,9';
    const rec = formToSample(f).record;
    const stored = Sample.parse({ ...rec, id: 's1', createdAt: f.time, updatedAt: f.time, localDate: '2026-06-14' });
    const back = formToSample(formFromSample(stored)).record;
    expect(back.field).toEqual(rec.field);
    expect(back.time).toBe(rec.time);
  });
});
