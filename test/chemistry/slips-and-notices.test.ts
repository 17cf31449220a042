// Unit slips caught, natural extremes left alone, and notices told apart from warnings that need action.
import { describe, expect, it } from 'vitest';
import { analyzeSample, isNotice, MG_CACO3_PER_MEQ, SPECIES, type Analysis } from '../../src/chemistry';
import { inlSamples, kwaleSamples } from '../fixtures/real/load';

const codes = (a: Analysis) => a.warnings.map((w) => w.code);
const actions = (a: Analysis) => a.warnings.filter((w) => !isNotice(w));

// A typical moderate stream (values of our own choosing).
const STREAM = { tempC: 15, scUsPerCm: 400, pH: 7.9, alkalinityMgLCaCO3: 150, caMgL: 50 };

describe('the two commonest unit slips', () => {
  it('calcium typed in mmol/L (1.25 for 50 mg/L) is named, with the likely unit', () => {
    const a = analyzeSample({ ...STREAM, caMgL: 1.25 });
    const w = a.warnings.find((x) => x.code === 'unit-slip-calcium');
    expect(w?.message).toMatch(/mmol\/L/);
    expect(w?.field).toBe('caMgL');
    expect(w?.kind).toBe('action');
    expect(codes(analyzeSample(STREAM))).not.toContain('unit-slip-calcium');
  });
  it('alkalinity typed in meq/L (3.0 for 150 mg/L as CaCO3) is named, with the likely unit', () => {
    const a = analyzeSample({ ...STREAM, alkalinityMgLCaCO3: 3.0 });
    const w = a.warnings.find((x) => x.code === 'unit-slip-alkalinity');
    expect(w?.message).toMatch(/meq\/L/);
    expect(w?.field).toBe('alkalinityMgLCaCO3');
    expect(codes(analyzeSample(STREAM))).not.toContain('unit-slip-alkalinity');
  });
  it('alkalinity above zero below pH 4.5 is named inconsistent (Standard Methods 2320 B endpoint; from memory)', () => {
    const a = analyzeSample({ tempC: 10, pH: 4.0, scUsPerCm: 80, alkalinityMgLCaCO3: 12, caMgL: 4 });
    expect(a.warnings.find((w) => w.code === 'alkalinity-inconsistent-with-ph')?.kind).toBe('action');
    expect(codes(analyzeSample({ tempC: 10, pH: 4.0, scUsPerCm: 80, alkalinityMgLCaCO3: 0, caMgL: 4 }))).not.toContain('alkalinity-inconsistent-with-ph');
  });
  it('real analyses (field readings only): the slips are caught on most INL samples made wrong, and never raised on the right ones (USGS INL, Kwale)', () => {
    const inl = inlSamples().filter((s) => s.sc !== undefined && s.sc > 30 && s.pH !== undefined && s.pH >= 7 && s.anc !== undefined);
    const run = (s: (typeof inl)[number], ca: number, alk: number) =>
      codes(analyzeSample({ tempC: s.tempC ?? 15, pH: s.pH, scUsPerCm: s.sc, alkalinityMgLCaCO3: alk, caMgL: ca }));
    let falseAlarm = 0, caCaught = 0, alkCaught = 0;
    for (const s of inl) {
      const ok = run(s, s.ca, s.anc!);
      if (ok.includes('unit-slip-calcium') || ok.includes('unit-slip-alkalinity')) falseAlarm++;
      if (run(s, s.ca / SPECIES.Ca.molarMass, s.anc!).includes('unit-slip-calcium')) caCaught++;
      if (run(s, s.ca, s.anc! / MG_CACO3_PER_MEQ).includes('unit-slip-alkalinity')) alkCaught++;
    }
    expect(inl.length).toBeGreaterThan(700);
    expect(falseAlarm).toBe(0);
    expect(caCaught / inl.length).toBeGreaterThan(0.9);
    expect(alkCaught / inl.length).toBeGreaterThan(0.9);
    // Kwale: sodium and Na–Cl waters, low calcium, hot springs: natural, no slip alarm
    const h = MG_CACO3_PER_MEQ / SPECIES.HCO3.molarMass;
    const kw = kwaleSamples().filter((s) => codes(analyzeSample({ tempC: s.tempC, pH: s.pH, scUsPerCm: s.ecUsPerCm, alkalinityMgLCaCO3: s.alkHco3MgL * h, caMgL: s.ca })).some((c) => c.startsWith('unit-slip')));
    expect(kw).toEqual([]);
  }, 60_000);
});

describe('extreme but natural values are not unit slips (issue 14)', () => {
  it('a soft peat stream with SI about −5 gets no unit alarm, only notices', () => {
    const a = analyzeSample({ tempC: 8, pH: 5.2, scUsPerCm: 40, caMgL: 2, alkalinityMgLCaCO3: 2 });
    expect(a.saturationIndex.calcite!).toBeLessThan(-4);
    expect(a.warnings.find((w) => w.code === 'si-extreme')?.kind).toBe('notice');
    expect(actions(a).filter((w) => /unit/i.test(w.message))).toEqual([]);
    expect(a.calciteState).toBe('undersaturated');
  });
  it('a field blank with SC 1.8 µS/cm gets no "check units" alarm', () => {
    const a = analyzeSample({ tempC: 15, pH: 5.8, scUsPerCm: 1.8 });
    expect(codes(a)).not.toContain('possible-unit-slip');
    expect(a.warnings.filter((w) => /unit|mS\/cm/.test(w.message))).toEqual([]);
    expect(a.warnings.find((w) => w.code === 'sc-unusual')?.kind).toBe('notice');
  });
  it('… but SC in mS/cm with ions that need far more is still caught', () => {
    expect(codes(analyzeSample({ ...STREAM, scUsPerCm: 0.4 }))).toContain('possible-unit-slip');
  });
  it('an SI above +2 (beyond natural waters but for lime-dosed ones) still asks for a check', () => {
    const a = analyzeSample({ tempC: 20, pH: 9.6, scUsPerCm: 900, caMgL: 150, alkalinityMgLCaCO3: 300 });
    expect(a.saturationIndex.calcite!).toBeGreaterThan(2);
    expect(a.warnings.find((w) => w.code === 'si-extreme')?.kind).toBe('action');
    expect(codes(analyzeSample({ tempC: 10, pH: 7.9, scUsPerCm: 600, caMgL: 80, alkalinityMgLCaCO3: 250 }))).not.toContain('si-extreme');
  });
});

describe('notices are told apart from warnings that need action', () => {
  it('"ionic strength estimated" and "pCO2 is N× the atmosphere" are notices; a failed balance is an action', () => {
    const a = analyzeSample({ tempC: 9, pH: 7.0, scUsPerCm: 500, alkalinityMgLCaCO3: 220, caMgL: 80 });
    expect(a.warnings.find((w) => w.code === 'ionic-strength-estimated')?.kind).toBe('notice');
    expect(a.warnings.find((w) => w.code === 'si-will-rise-downstream')?.kind).toBe('notice');
    const b = analyzeSample({ tempC: 11, pH: 8.4, scUsPerCm: 256, alkalinityMgLCaCO3: 120, caMgL: 31, mgMgL: 8.5, naMgL: 60, kMgL: 2.2, clMgL: 0, so4MgL: 0 });
    expect(b.warnings.find((w) => w.code === 'charge-balance')?.kind).toBe('action');
    expect(a.warnings.every((w) => w.kind === 'notice' || w.kind === 'action')).toBe(true);
  });
});

describe('dissolved oxygen through analyzeSample', () => {
  it('SC 50,000 µS/cm, 20 °C, 7.4 mg/L is 98.7 % of saturation, not 81 % (Benson & Krause salinity term, USGS OWQ memo 2011.03; read)', () => {
    const a = analyzeSample({ tempC: 20, scUsPerCm: 50000, doMgL: 7.4, pressureKPa: 101.325 });
    expect(a.oxygen!.salinity).toBeGreaterThan(32);
    expect(a.oxygen!.salinity).toBeLessThan(33.5);
    expect(a.oxygen!.percentSaturation).toBeCloseTo(98.7, 1);
    // fresh water at 20 °C and 1 atm: 9.092 mg/L (Benson & Krause via field-practice tables; from memory)
    const fresh = analyzeSample({ tempC: 20, doMgL: 9.092, pressureKPa: 101.325 });
    expect(fresh.oxygen!.saturationMgL).toBeCloseTo(9.092, 2);
    expect(fresh.oxygen!.percentSaturation).toBeCloseTo(100, 1);
  });
  it('pressure lowers saturation (half an atmosphere about halves it) and a missing pressure is a notice', () => {
    const low = analyzeSample({ tempC: 10, doMgL: 8, pressureKPa: 70 });
    const sea = analyzeSample({ tempC: 10, doMgL: 8 });
    expect(low.oxygen!.saturationMgL / sea.oxygen!.saturationMgL).toBeCloseTo(70 / 101.325, 1);
    expect(sea.warnings.find((w) => w.code === 'oxygen-pressure-assumed')?.kind).toBe('notice');
    expect(codes(low)).not.toContain('oxygen-pressure-assumed');
  });
  it('a % reading gives mg/L; outside Benson & Krause no number and a reason, never NaN', () => {
    const p = analyzeSample({ tempC: 15, doPercent: 100, pressureKPa: 101.325 });
    expect(p.oxygen!.doMgL).toBeCloseTo(p.oxygen!.saturationMgL, 10);
    const hot = analyzeSample({ tempC: 60, doMgL: 3 });
    expect(hot.oxygen).toBeUndefined();
    expect(codes(hot)).toContain('oxygen-out-of-range');
  });
});
