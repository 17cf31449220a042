import { describe, expect, it } from 'vitest';
import { analyzeSample, ATMOSPHERIC_LOG_PCO2, InputError, type Analysis } from '../../src/chemistry';

/** Every number anywhere in the result is finite. */
function allFinite(x: unknown, path = 'result'): string[] {
  if (typeof x === 'number') return Number.isFinite(x) ? [] : [path];
  if (Array.isArray(x)) return x.flatMap((v, i) => allFinite(v, `${path}[${i}]`));
  if (x && typeof x === 'object') return Object.entries(x).flatMap(([k, v]) => allFinite(v, `${path}.${k}`));
  return [];
}
const codes = (a: Analysis) => a.warnings.map((w) => w.code);

// A typical hard-water stream at the bank: field minimum plus SC (values of our own choosing).
const FIELD = { tempC: 12, pH: 7.9, scUsPerCm: 450, alkalinityMgLCaCO3: 180, caMgL: 60 };

describe('analyzeSample: published reference points', () => {
  it('pure water in equilibrium with the atmosphere has pH ≈ 5.6 (Stumm & Morgan, Aquatic Chemistry; common practice)', () => {
    // Alkalinity 0 (only CO2 dissolved) at pH 5.6 must give about today's log pCO2 (−3.4).
    const a = analyzeSample({ tempC: 25, pH: 5.6, alkalinityMgLCaCO3: 0 });
    expect(Math.abs(a.logPco2! - -3.4)).toBeLessThan(0.05);
    expect(Math.abs(a.logPco2! - ATMOSPHERIC_LOG_PCO2)).toBeLessThan(0.05);
  });
  it('hardness: Ca 40 + Mg 12 mg/L → 149.30 mg/L as CaCO3 (Standard Methods 2340 B; read)', () => {
    const a = analyzeSample({ tempC: 20, caMgL: 40, mgMgL: 12 });
    expect(a.hardnessMgLCaCO3).toBeCloseTo(149.3, 2);
    expect(a.calciumHardnessMgLCaCO3).toBeCloseTo(99.88, 2);
  });
  it('surface seawater is supersaturated with calcite, SI ≈ +0.6 to +0.8 (Ω ≈ 4–6; Stumm & Morgan; common practice)', () => {
    // Standard seawater composition, S = 35 (Millero 2013 Chemical Oceanography, mg/kg; from memory).
    const sw = {
      tempC: 25, pH: 8.1, salinity: 35, alkalinityMgLCaCO3: 117, caMgL: 412, mgMgL: 1284, naMgL: 10781,
      kMgL: 399, clMgL: 19353, so4MgL: 2712,
    };
    const a = analyzeSample(sw);
    expect(a.ionicStrength.source).toBe('composition');
    expect(a.activityModel).toBe('truesdell-jones');
    expect(Math.abs(a.ionicStrength.value! - 0.7227)).toBeLessThan(0.08); // DOE (1994): I(S=35) = 0.7227 (from memory)
    expect(a.saturationIndex.calcite!).toBeGreaterThan(0.4);
    expect(a.saturationIndex.calcite!).toBeLessThan(1.0);
    const bySalinity = analyzeSample(sw, { ionicStrengthFrom: 'salinity' });
    expect(bySalinity.ionicStrength.value).toBeCloseTo(0.7227, 3);
  });
});

describe('analyzeSample: the field minimum', () => {
  it('gives a calcite state with band from T, pH, SC, alkalinity and Ca', () => {
    const a = analyzeSample(FIELD);
    expect(a.ionicStrength.source).toBe('conductance');
    expect(a.ionicStrength.value).toBeCloseTo(450 * 1.5e-5, 10);
    expect(a.activityModel).toBe('extended-debye-huckel');
    expect(a.saturationIndex.calcite).toBeDefined();
    // 95 % band (k = 2): pH's 0.058 alone gives about ±0.12; the rest adds a little
    expect(a.calciteSiUncertainty!).toBeGreaterThan(0.1);
    expect(a.calciteSiUncertainty!).toBeLessThan(0.18);
    expect(a.calciteState).toBe(
      a.saturationIndex.calcite! - a.calciteSiUncertainty! > 0 ? 'supersaturated' : a.saturationIndex.calcite! + a.calciteSiUncertainty! < 0 ? 'undersaturated' : 'near-equilibrium',
    );
    expect(a.saturationIndex.dolomite).toBeUndefined(); // needs Mg
    expect(a.saturationIndex.gypsum).toBeUndefined(); // needs SO4
    expect(allFinite(a)).toEqual([]);
  });
  it('LSI approximates calcite SI and RSI = 2 pHs − pH (Standard Methods 2330 B; Ryznar 1944)', () => {
    const a = analyzeSample(FIELD);
    expect(Math.abs(a.langelier!.lsi - a.saturationIndex.calcite!)).toBeLessThan(0.05);
    expect(a.langelier!.rsi).toBeCloseTo(2 * a.langelier!.pHs - FIELD.pH, 10);
    // at pHs the water is exactly saturated
    const atPhs = analyzeSample({ ...FIELD, pH: a.langelier!.pHs });
    expect(Math.abs(atPhs.saturationIndex.calcite!)).toBeLessThan(1e-5);
  });
  it('says which inputs the calcite state still needs', () => {
    const a = analyzeSample({ tempC: 10, pH: 7.5, scUsPerCm: 300, alkalinityMgLCaCO3: 120 });
    expect(a.calciteState).toBe('unknown');
    expect(a.warnings.find((w) => w.code === 'calcite-needs-inputs')?.message).toMatch(/calcium/);
    expect(a.logPco2).toBeDefined();
    expect(allFinite(a)).toEqual([]);
  });
  it('a water far below saturation reads undersaturated, far above reads supersaturated', () => {
    expect(analyzeSample({ tempC: 8, pH: 6.4, scUsPerCm: 60, alkalinityMgLCaCO3: 15, caMgL: 5 }).calciteState).toBe('undersaturated');
    expect(analyzeSample({ tempC: 15, pH: 8.5, scUsPerCm: 600, alkalinityMgLCaCO3: 220, caMgL: 90 }).calciteState).toBe('supersaturated');
  });
  it('temperature alone gives a result with warnings, no NaN', () => {
    const a = analyzeSample({ tempC: 10 });
    expect(a.ionicStrength.source).toBe('none');
    expect(a.ionicStrength.value).toBeUndefined();
    expect(codes(a)).toEqual(expect.arrayContaining(['ionic-strength-unknown', 'calcite-needs-inputs']));
    expect(allFinite(a)).toEqual([]);
  });
});

describe('analyzeSample: choices and warnings', () => {
  const full = {
    tempC: 11, pH: 8.4, scUsPerCm: 256, alkalinityMgLCaCO3: 120, caMgL: 31, mgMgL: 8.5, naMgL: 9.8, kMgL: 2.2,
    clMgL: 6.5, so4MgL: 7.2,
  };
  it('uses the composition when the major ions are known, and reports the SC estimate beside it', () => {
    const a = analyzeSample(full);
    expect(a.ionicStrength.source).toBe('composition');
    expect(a.ionicStrength.fromConductance).toBeCloseTo(256 * 1.5e-5, 10);
    expect(Math.abs(a.ionicStrength.value! / a.ionicStrength.fromConductance! - 1)).toBeLessThan(0.2);
    expect(a.chargeBalance!.acceptable).toBe(true);
    expect(Math.abs(a.calculatedScUsPerCm! / 256 - 1)).toBeLessThan(0.1);
    expect(a.saturationIndex.dolomite).toBeDefined();
    expect(a.saturationIndex.gypsum!).toBeLessThan(-2);
  });
  it('honours an explicit ionic-strength source and activity model', () => {
    const a = analyzeSample(full, { ionicStrengthFrom: 'conductance', activityModel: 'davies' });
    expect(a.ionicStrength.source).toBe('conductance');
    expect(a.activityModel).toBe('davies');
    expect(() => analyzeSample({ tempC: 10, pH: 7 }, { ionicStrengthFrom: 'tds' })).toThrow(/tdsMgL/);
  });
  it('warns when the chosen model is used beyond its range', () => {
    const a = analyzeSample({ ...FIELD, scUsPerCm: 2000 }, { activityModel: 'debye-huckel' });
    expect(codes(a)).toContain('activity-model-out-of-range');
    expect(codes(analyzeSample(FIELD))).not.toContain('activity-model-out-of-range');
  });
  it('catches SC entered in mS/cm (a real slip: USGS INL well NRF 6, 2023, see the real-data test)', () => {
    const a = analyzeSample({ ...full, scUsPerCm: 0.256 });
    expect(codes(a)).toContain('possible-unit-slip');
    const partial = analyzeSample({ ...FIELD, scUsPerCm: 0.45 });
    expect(codes(partial)).toContain('possible-unit-slip');
    expect(codes(analyzeSample(full))).not.toContain('possible-unit-slip');
  });
  it('catches calcium entered in mmol/L-sized numbers against SC only when gross, a mismatch otherwise', () => {
    const a = analyzeSample({ ...FIELD, caMgL: 600 }); // 30 meq/L against SC 450 (≈ 4.5 meq/L)
    expect(codes(a)).toEqual(expect.arrayContaining(['sc-ion-mismatch']));
  });
  it('flags CO2 below the atmosphere and the downstream rise of SI for CO2-rich water', () => {
    expect(codes(analyzeSample({ tempC: 20, pH: 9.3, scUsPerCm: 300, alkalinityMgLCaCO3: 100, caMgL: 30 }))).toContain('pco2-below-atmosphere');
    expect(codes(analyzeSample({ tempC: 9, pH: 7.0, scUsPerCm: 500, alkalinityMgLCaCO3: 220, caMgL: 80 }))).toContain('si-will-rise-downstream');
  });
  it('charge balance fails Standard Methods 1030 E when an anion is missing', () => {
    const a = analyzeSample({ ...full, clMgL: 0, so4MgL: 0, naMgL: 60 });
    expect(a.chargeBalance!.acceptable).toBe(false);
    expect(codes(a)).toContain('charge-balance');
  });
});

describe('analyzeSample: impossible input is refused with the field named', () => {
  it.each([
    [{ tempC: 10, pH: 15 }, 'pH'],
    [{ tempC: 10, pH: -1 }, 'pH'],
    [{ tempC: 120 }, 'tempC'],
    [{ tempC: -5 }, 'tempC'],
    [{ tempC: 10, caMgL: -3 }, 'caMgL'],
    [{ tempC: 10, scUsPerCm: Number.NaN }, 'scUsPerCm'],
    [{ tempC: 10, alkalinityMgLCaCO3: Number.POSITIVE_INFINITY }, 'alkalinityMgLCaCO3'],
    [{ tempC: Number.NaN }, 'tempC'],
  ])('%o → InputError on %s', (input, field) => {
    try {
      analyzeSample(input as never);
      expect.unreachable('should throw');
    } catch (e) {
      expect(e).toBeInstanceOf(InputError);
      expect((e as InputError).field).toBe(field);
    }
  });
  it('odd but possible values give warnings instead', () => {
    const a = analyzeSample({ tempC: 45, pH: 10.2, scUsPerCm: 3 });
    expect(codes(a)).toEqual(expect.arrayContaining(['temperature-unusual', 'ph-unusual', 'sc-unusual']));
  });
});
