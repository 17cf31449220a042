// Calculated conductance of standard solutions; every index has a number or says why; the extremes.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyzeSample, calculatedConductance, InputError, PSS78_MAX_SC_US_PER_CM, type SampleInput } from '../../src/chemistry';

describe('calculated conductance (Debye–Hückel–Onsager, extended; Robinson & Stokes 1959)', () => {
  it.each([
    // KCl: 0.001 / 0.01 / 0.1 mol/L = 147.0 / 1,413 / 12,890 µS/cm at 25 °C (OIML R 56 / ASTM D1125; from memory)
    ['KCl 0.001 mol/L', { K: 0.001, Cl: 0.001 }, 147.0],
    ['KCl 0.01 mol/L', { K: 0.01, Cl: 0.01 }, 1413],
    ['KCl 0.1 mol/L', { K: 0.1, Cl: 0.1 }, 12890],
    // NaCl 0.01 mol/L: Λ = 118.5 S cm²/mol (Robinson & Stokes 1959, App. 6.1; from memory) → 1,185 µS/cm
    ['NaCl 0.01 mol/L', { Na: 0.01, Cl: 0.01 }, 1185],
  ] as const)('%s → %s µS/cm within 3 %', (_name, ions, expected) => {
    expect(Math.abs(calculatedConductance(ions) / expected - 1)).toBeLessThan(0.03);
  });
  it('CaCl2 0.01 mol/L: Λ(½CaCl2) ≈ 111.5 at 0.02 N (Robinson & Stokes 1959, App. 6.1; from memory) → about 2,230 µS/cm, within 5 %', () => {
    expect(Math.abs(calculatedConductance({ Ca: 0.01, Cl: 0.02 }) / 2230 - 1)).toBeLessThan(0.05);
  });
  it('refuses a negative concentration, naming the ion', () => {
    expect(() => calculatedConductance({ Na: -1 })).toThrow(InputError);
  });
});

describe('every index has a number or says why', () => {
  it('soft water gets an LSI: the SM 2330 B formula where no pH below 14 saturates it (worked value)', () => {
    // Worked by hand (Standard Methods 2330 B formula; from memory): 10 °C, Ca 1 mg/L, alkalinity 5 mg/L as CaCO3, SC 30 µS/cm:
    // pK2 10.490 and pKs 8.409 at 10 °C (Plummer & Busenberg 1982), p[Ca] = log(40078/1) = 4.603,
    // p[Alk] = log(50043/5) = 4.000, I = 30 × 1.5e-5 = 4.5e-4, A(10 °C) = 0.4976, pfm = 0.0103, 5 pfm = 0.051
    // → pHs = 10.490 − 8.409 + 4.603 + 4.000 + 0.051 = 10.735; LSI at pH 6.8 = −3.93; RSI = 2 pHs − pH = 14.67.
    const a = analyzeSample({ tempC: 10, pH: 6.8, scUsPerCm: 30, caMgL: 1, alkalinityMgLCaCO3: 5 });
    expect(a.langelier!.method).toBe('sm-2330-formula');
    expect(Math.abs(a.langelier!.pHs - 10.735)).toBeLessThan(0.02);
    expect(Math.abs(a.langelier!.lsi - -3.935)).toBeLessThan(0.02);
    expect(a.langelier!.rsi).toBeCloseTo(2 * a.langelier!.pHs - 6.8, 10);
  });
  it('moderately soft water: the full-speciation pHs stays within 0.1 of the formula (25 °C, Ca 10, alkalinity 20, SC 60; formula by hand 8.924)', () => {
    const a = analyzeSample({ tempC: 25, pH: 7.0, scUsPerCm: 60, caMgL: 10, alkalinityMgLCaCO3: 20 });
    expect(a.langelier!.method).toBe('speciation');
    expect(Math.abs(a.langelier!.pHs - 8.924)).toBeLessThan(0.1);
  });
  it('LSI is present for every field water with calcium and alkalinity (random soft to hard waters)', () => {
    fc.assert(
      fc.property(
        fc.record({
          tempC: fc.double({ min: 0, max: 35, noNaN: true }), pH: fc.double({ min: 4.5, max: 9.5, noNaN: true }),
          scUsPerCm: fc.double({ min: 5, max: 2000, noNaN: true }), caMgL: fc.double({ min: 0.05, max: 200, noNaN: true }),
          alkalinityMgLCaCO3: fc.double({ min: 0.5, max: 400, noNaN: true }),
        }),
        (w) => {
          const a = analyzeSample(w);
          return a.langelier !== undefined && Number.isFinite(a.langelier.lsi);
        },
      ),
      { seed: 20261202, numRuns: 300 },
    );
  }, 60_000);
  it('gypsum SI without pH, with a notice', () => {
    const a = analyzeSample({ tempC: 15, caMgL: 500, so4MgL: 1200, scUsPerCm: 2500 });
    const withPh = analyzeSample({ tempC: 15, pH: 7.5, caMgL: 500, so4MgL: 1200, scUsPerCm: 2500 });
    expect(Math.abs(a.saturationIndex.gypsum! - withPh.saturationIndex.gypsum!)).toBeLessThan(0.01);
    expect(a.warnings.find((w) => w.code === 'gypsum-without-ph')?.kind).toBe('notice');
  });
  it('SC beyond practical salinity is warned on scUsPerCm, not refused on an internal quantity; beyond 500,000 it is refused on scUsPerCm', () => {
    expect(PSS78_MAX_SC_US_PER_CM).toBeGreaterThan(60000);
    expect(PSS78_MAX_SC_US_PER_CM).toBeLessThan(70000);
    const a = analyzeSample({ tempC: 25, pH: 7.5, scUsPerCm: 250000, alkalinityMgLCaCO3: 100, caMgL: 1000 });
    const w = a.warnings.find((x) => x.code === 'sc-beyond-salinity-scale');
    expect(w?.field).toBe('scUsPerCm');
    expect(a.calciteSiUncertainty!).toBeGreaterThan(0.2);
    try {
      analyzeSample({ tempC: 25, scUsPerCm: 600000 });
      expect.unreachable();
    } catch (e) {
      expect((e as InputError).field).toBe('scUsPerCm');
    }
  });
  it('hydroxide-dominated water: no calcite SI, and a reason', () => {
    const a = analyzeSample({ tempC: 20, pH: 13, scUsPerCm: 5000, caMgL: 20, alkalinityMgLCaCO3: 10 });
    expect(a.saturationIndex.calcite).toBeUndefined();
    expect(a.warnings.some((w) => w.code === 'alkalinity-noncarbonate')).toBe(true);
  });
});

describe('no NaN at the extremes the engine accepts', () => {
  function finiteEverywhere(x: unknown): boolean {
    if (typeof x === 'number') return Number.isFinite(x);
    if (Array.isArray(x)) return x.every(finiteEverywhere);
    if (x && typeof x === 'object') return Object.values(x).every(finiteEverywhere);
    return true;
  }
  const edge = <T>(...v: T[]) => fc.constantFrom(...v);
  // every combination of the range ends and a few inner values (100 °C, pH 14, 2,000 mg/L Ca, …)
  const extreme: fc.Arbitrary<SampleInput> = fc.record({
    tempC: edge(-2, 0, 25, 40, 60, 100),
    pH: edge(undefined, 0, 2, 4.4, 7, 10.5, 12, 14),
    scUsPerCm: edge(undefined, 0, 1e-300, 1.8, 400, 5000, 53000, 250000, 500000),
    alkalinityMgLCaCO3: edge(undefined, 0, 0.001, 150, 2000, 500000),
    caMgL: edge(undefined, 0, 1e-300, 50, 2000, 500000),
    mgMgL: edge(undefined, 0, 2000),
    naMgL: edge(undefined, 0, 12000, 200000),
    clMgL: edge(undefined, 0, 20000, 300000),
    so4MgL: edge(undefined, 0, 3000, 100000),
    salinity: edge(undefined, 0, 42, 45),
    tdsMgL: edge(undefined, 0, 40000),
    doMgL: edge(undefined, 0, 60),
    pressureKPa: edge(undefined, 30, 101.325, 120),
  });
  it('any combination of range ends: a finite result or an InputError naming a field', () => {
    fc.assert(
      fc.property(extreme, (input) => {
        try {
          return finiteEverywhere(analyzeSample(input));
        } catch (e) {
          return e instanceof InputError && e.field.length > 0;
        }
      }),
      { seed: 20261202, numRuns: 1500 },
    );
  }, 120_000);
});

describe('warned beyond the chosen model’s range', () => {
  it('sulfate-rich water above I = 0.5 is warned under Truesdell–Jones; NaCl water at the same I is not', () => {
    // Na2SO4-type water, I ≈ 0.8 (values of our choosing)
    const sulfate = analyzeSample({ tempC: 20, pH: 7.8, alkalinityMgLCaCO3: 200, caMgL: 400, mgMgL: 1500, naMgL: 12000, kMgL: 50, clMgL: 1000, so4MgL: 30000 });
    expect(sulfate.ionicStrength.value!).toBeGreaterThan(0.5);
    expect(sulfate.warnings.find((w) => w.code === 'activity-model-out-of-range')?.message).toMatch(/sulfate-rich/);
    const nacl = analyzeSample({ tempC: 20, pH: 7.8, alkalinityMgLCaCO3: 200, caMgL: 400, mgMgL: 300, naMgL: 14000, kMgL: 50, clMgL: 22000, so4MgL: 500 });
    expect(nacl.ionicStrength.value!).toBeGreaterThan(0.5);
    expect(nacl.ionicStrength.value!).toBeLessThan(2);
    expect(nacl.warnings.map((w) => w.code)).not.toContain('activity-model-out-of-range');
  });
  it('a chosen model used beyond its range is warned (Davies at I ≈ 0.7)', () => {
    const a = analyzeSample({ tempC: 25, pH: 8.1, scUsPerCm: 53087, alkalinityMgLCaCO3: 117, caMgL: 412 }, { activityModel: 'davies' });
    expect(a.warnings.map((w) => w.code)).toContain('activity-model-out-of-range');
  });
});
