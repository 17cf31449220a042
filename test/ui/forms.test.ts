// Parsing rules are our own (source: src/ui/forms/parse.ts); no published values are involved.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseDecimal } from '../../src/ui/forms/parse';
import { applyFormToSample, emptyForm, formFromSample, formToSample } from '../../src/ui/forms/sample-form';
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

describe('editing a stored sample keeps every stored field (form ↔ record round trip)', () => {
  const time = fc.record({ d: fc.integer({ min: 1, max: 28 }), h: fc.integer({ min: 0, max: 23 }), m: fc.integer({ min: 0, max: 59 }) })
    .map(({ d, h, m }) => `2026-06-${String(d).padStart(2, '0')}T${String(h).padStart(2, '0')}:${String(m).padStart(2, '0')}:00-06:00`);
  const num = (min: number, max: number) => fc.integer({ min: Math.round(min * 100), max: Math.round(max * 100) }).map((i) => i / 100);
  const reading = (min: number, max: number) => fc.record({ values: fc.array(fc.record({ time, value: num(min, max) }), { minLength: 1, maxLength: 4 }), override: fc.option(fc.string({ maxLength: 30 }), { nil: undefined }) }, { requiredKeys: ['values'] });
  const otherKit = fc.record({ analyte: fc.constantFrom('magnesium', 'ammonia-n', 'chloride', 'sulfate'), value: num(0, 500), unit: fc.constantFrom('mg/L', 'mmol/L', 'meq/L'), step: fc.option(num(0, 5), { nil: undefined }) }, { requiredKeys: ['analyte', 'value', 'unit'] });
  const caKit = fc.oneof(
    fc.record({ analyte: fc.constant('calcium'), value: num(0, 500), unit: fc.constantFrom('mg/L', 'mmol/L', 'meq/L'), step: fc.option(num(0, 5), { nil: undefined }) }, { requiredKeys: ['analyte', 'value', 'unit'] }),
    fc.record({ analyte: fc.constant('calcium-hardness'), value: num(0, 500), unit: fc.constant('mg/L CaCO3'), step: fc.option(num(0, 5), { nil: undefined }) }, { requiredKeys: ['analyte', 'value', 'unit'] }),
  );
  const thKit = fc.record({ analyte: fc.constant('total-hardness'), value: num(0, 900), unit: fc.constant('mg/L CaCO3'), step: fc.option(num(0, 5), { nil: undefined }) }, { requiredKeys: ['analyte', 'value', 'unit'] });
  const sample = fc.record({
    t: time,
    crew: fc.array(fc.stringMatching(/^[A-Z][a-z]{1,8}$/), { maxLength: 3 }),
    fieldDayId: fc.option(fc.constant('day-7'), { nil: undefined }),
    appearance: fc.string({ maxLength: 40 }),
    weather: fc.string({ maxLength: 40 }),
    remarks: fc.string({ maxLength: 60 }),
    createdBy: fc.string({ maxLength: 20 }),
    demo: fc.option(fc.boolean(), { nil: undefined }),
    profileVersion: fc.integer({ min: 1, max: 4 }),
    qc: fc.oneof(fc.constant({ type: 'environmental' as const }), fc.record({ type: fc.constantFrom('replicate' as const, 'blank' as const), parentId: fc.constant('sample-parent') })),
    method: fc.constantFrom('in-situ' as const, 'flow-through' as const, 'grab' as const),
    flow: fc.constantFrom('low' as const, 'dry' as const, 'unknown' as const),
    qualifiers: fc.subarray(['estimated', 'unstable', 'outside-calibration', 'suspect'] as const),
    tempC: reading(-2, 40),
    pH: fc.option(reading(0, 14), { nil: undefined }),
    doR: fc.option(fc.tuple(reading(0, 20), fc.constantFrom('mg/L' as const, '%' as const)), { nil: undefined }),
    cond: fc.option(fc.record({ mode: fc.constantFrom('sc' as const, 'ec' as const), values: fc.array(fc.record({ time, value: num(0, 5000) }), { minLength: 1, maxLength: 3 }), alpha: num(0, 0.05), tempC: fc.option(num(0, 30), { nil: undefined }) }, { requiredKeys: ['mode', 'values', 'alpha'] }), { nil: undefined }),
    alk: fc.option(fc.oneof(
      fc.record({ kind: fc.constant('direct' as const), value: num(0, 900), unit: fc.constantFrom('mg/L CaCO3' as const, 'meq/L' as const, 'mg/L HCO3' as const) }),
      fc.record({ kind: fc.constant('titration' as const), titration: fc.record({ sampleVolumeMl: num(1, 200), titrantNormality: num(0.01, 2), correctionFactor: num(0.5, 1.5), equipment: fc.constantFrom('buret' as const, 'digital-titrator' as const), countsPerMl: fc.constantFrom(800, 400), filtered: fc.boolean(), points: fc.array(fc.record({ amount: num(0, 50), pH: num(3, 9) }), { minLength: 2, maxLength: 5 }) }) }),
    ), { nil: undefined }),
    kits: fc.tuple(fc.option(caKit, { nil: undefined }), fc.option(thKit, { nil: undefined }), fc.array(otherKit, { maxLength: 2 }), fc.boolean()),
    pressure: fc.option(fc.record({ value: num(500, 1100), unit: fc.constantFrom('hPa' as const, 'kPa' as const, 'mmHg' as const), source: fc.constantFrom('station' as const, 'sea-level' as const, 'estimated' as const) }), { nil: undefined }),
    mgMgL: fc.option(num(0, 100), { nil: undefined }),
  }).map((g) => {
    const [ca, th, others, thFirst] = g.kits;
    const kits = [...(thFirst ? [th, ca] : [ca, th]).filter((k) => k !== undefined), ...others];
    return Sample.parse({
      id: 'sample-1', createdAt: g.t, updatedAt: g.t, siteId: 'site-1', time: g.t, localDate: g.t.slice(0, 10),
      crew: g.crew, method: g.method, flow: g.flow, weather: g.weather, appearance: g.appearance, qc: g.qc,
      ...(g.fieldDayId ? { fieldDayId: g.fieldDayId } : {}), ...(g.demo !== undefined ? { demo: g.demo } : {}),
      ...(g.pressure ? { pressure: g.pressure } : {}),
      field: {
        tempC: g.tempC, ...(g.pH ? { pH: g.pH } : {}), ...(g.doR ? { do: { ...g.doR[0], unit: g.doR[1] } } : {}),
        ...(g.cond ? { conductance: { ...g.cond, unit: 'uS/cm' } } : {}), ...(g.alk ? { alkalinity: g.alk } : {}),
        kits, ions: g.mgMgL !== undefined ? { mgMgL: g.mgMgL } : {},
      },
      lab: [{ parameter: 'Mg', value: 4.2, unit: 'mg/L', importedAt: g.t }],
      remarks: g.remarks, qualifiers: g.qualifiers, profileId: 'project-x', profileVersion: g.profileVersion, revision: 3, createdBy: g.createdBy,
    });
  });

  it('property: open a stored sample, save without edits: the record is unchanged, field for field', () => {
    fc.assert(
      fc.property(sample, (s) => {
        const r = formToSample(formFromSample(s));
        expect(r.errors).toEqual({});
        expect(Sample.parse(applyFormToSample(s, r.record))).toEqual(s);
      }),
      { seed: 13, numRuns: 300 },
    );
  }, 30_000);

  it('an edit of one reading changes that reading only: field day, appearance, overrides, kit step, other kits and created-by stay', () => {
    fc.assert(
      fc.property(sample, (s) => {
        const form = formFromSample(s);
        form.temp = [...form.temp.slice(0, -1), { ...form.temp.at(-1)!, v: '11.5' }];
        const next = Sample.parse(applyFormToSample(s, formToSample(form).record));
        expect(next.field.tempC!.values.at(-1)!.value).toBe(11.5);
        expect({ ...next, field: { ...next.field, tempC: s.field.tempC } }).toEqual(s);
        expect(next.field.tempC!.override).toBe(s.field.tempC!.override);
      }),
      { seed: 14, numRuns: 200 },
    );
  }, 30_000);
});
