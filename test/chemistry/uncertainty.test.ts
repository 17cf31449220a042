// The calcite SI band: a 95 % expanded uncertainty (GUM, JCGM 100:2008, k = 2) with its budget.
import { describe, expect, it } from 'vitest';
import {
  ACTIVITY_MODELS,
  analyzeSample,
  budgetLine,
  DEFAULT_CONDUCTANCE_FACTOR,
  DEFAULT_UNCERTAINTIES,
  InputError,
  LOG_K_UNCERTAINTY,
  MODEL_MAX_IONIC_STRENGTH,
  salinityFromSpecificConductance,
  uncertaintiesFromEvidence,
  type SampleInput,
} from '../../src/chemistry';
import { mulberry32 } from './titration-curve';

const rng = mulberry32;
function normal(r: () => number): number {
  return Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
}

// A typical moderate stream (values of our own choosing).
const STREAM = { tempC: 15, scUsPerCm: 400, pH: 7.9, alkalinityMgLCaCO3: 150, caMgL: 50 };

describe('the band is a 95 % expanded uncertainty', () => {
  it('Monte Carlo coverage: SI ± band holds the true SI 93–99 % of the time (field-only waters across T, pH, hardness; seeded)', () => {
    // Truth drawn at random; the "measured" inputs carry the engine's own stated standard
    // uncertainties as normal errors; the true SC → I factor and the true calcite log K differ
    // from the generic ones by their stated standard uncertainties too.
    const r = rng(20261202);
    const u = DEFAULT_UNCERTAINTIES;
    let inside = 0;
    const N = 1500;
    for (let i = 0; i < N; i++) {
      const truth: SampleInput = {
        tempC: 1 + 29 * r(),
        pH: 6.6 + 2.2 * r(),
        caMgL: 5 + 145 * r(),
        alkalinityMgLCaCO3: 20 + 280 * r(),
        scUsPerCm: 60 + 1400 * r(),
      };
      const factorTrue = DEFAULT_CONDUCTANCE_FACTOR * Math.exp(u.conductanceFactorRel * normal(r));
      const logKError = LOG_K_UNCERTAINTY.calcite * normal(r);
      const siTrue = analyzeSample(truth, { conductanceFactor: factorTrue }).saturationIndex.calcite! - logKError;
      const scU = Math.max(u.scRel, 2.887 / truth.scUsPerCm!);
      const measured: SampleInput = {
        tempC: truth.tempC + u.tempC * normal(r),
        pH: truth.pH! + u.pH * normal(r),
        caMgL: truth.caMgL! * (1 + u.caRel * normal(r)),
        alkalinityMgLCaCO3: truth.alkalinityMgLCaCO3! * (1 + u.alkalinityRel * normal(r)),
        scUsPerCm: truth.scUsPerCm! * (1 + scU * normal(r)),
      };
      const a = analyzeSample(measured);
      if (Math.abs(a.saturationIndex.calcite! - siTrue) <= a.calciteSiUncertainty!) inside++;
    }
    const coverage = inside / N;
    console.log(`Monte Carlo coverage of SI ± band: ${(coverage * 100).toFixed(1)} % of ${N}`);
    expect(coverage).toBeGreaterThanOrEqual(0.93);
    expect(coverage).toBeLessThanOrEqual(0.99);
  }, 60_000);

  it('band = 2 × the combined standard uncertainty, and the budget shares add up to 100 %', () => {
    const a = analyzeSample(STREAM);
    expect(a.calciteSiCoverageFactor).toBe(2);
    expect(a.calciteSiUncertainty!).toBeCloseTo(2 * a.calciteSiStandardUncertainty!, 12);
    const b = a.calciteSiBudget!;
    expect(b.reduce((s, e) => s + e.share, 0)).toBeCloseTo(1, 10);
    expect(Math.hypot(...b.map((e) => e.u))).toBeCloseTo(a.calciteSiStandardUncertainty!, 12);
    // sorted, largest first; pH dominates a moderate stream measured with field meters
    expect(b[0]!.source).toBe('pH');
    expect(b[0]!.share).toBeGreaterThan(0.5);
    expect(budgetLine(b[0]!)).toMatch(/^pH reading: \d+ %: a second stable pH reading or a fresh calibration/);
    for (const s of ['temperature', 'alkalinity', 'calcium', 'sc', 'ionic-strength', 'log-k', 'activity-model']) {
      expect(b.map((e) => e.source)).toContain(s);
    }
  });

  it('pH alone, u = 0.05, moves calcite SI by about 0.06 (published karst uncertainty analysis, 2019, as summarised in field-practice.md; from memory)', () => {
    const a = analyzeSample({ tempC: 12, pH: 7.9, scUsPerCm: 450, alkalinityMgLCaCO3: 180, caMgL: 60 }, { uncertainty: { pH: 0.05 } });
    const ph = a.calciteSiBudget!.find((e) => e.source === 'pH')!;
    expect(ph.u).toBeGreaterThan(0.045);
    expect(ph.u).toBeLessThan(0.07);
    expect(ph.basis).toBe('given');
  });

  it('the calcite log K term is at least its published ±0.02 (Plummer & Busenberg 1982; from memory)', () => {
    const k = analyzeSample(STREAM).calciteSiBudget!.find((e) => e.source === 'log-k')!;
    expect(k.u).toBeGreaterThanOrEqual(0.02);
    expect(k.u).toBeLessThan(0.05);
  });
});

describe("a sample's own evidence replaces the defaults", () => {
  it('a good check buffer (0.01 off) narrows the pH term; a bad one (0.1 off) keeps it wide', () => {
    const base = analyzeSample(STREAM);
    const good = analyzeSample(STREAM, { evidence: { pHCheckBufferError: 0.01 } });
    const bad = analyzeSample(STREAM, { evidence: { pHCheckBufferError: 0.1 } });
    expect(good.calciteSiUncertainty!).toBeLessThan(base.calciteSiUncertainty! * 0.8);
    expect(bad.calciteSiUncertainty!).toBeGreaterThan(good.calciteSiUncertainty!);
    expect(good.calciteSiBudget!.find((e) => e.source === 'pH')!.basis).toBe('check');
  });
  it('scattered pH readings widen it: u² = u_cal² + s²/n', () => {
    const e = uncertaintiesFromEvidence({ pHReadings: [7.8, 8.0, 7.9, 8.1, 7.7] });
    const s = Math.sqrt(((0.1 ** 2) * 2 + (0.2 ** 2) * 2) / 4); // sample sd of the five readings
    expect(e.uncertainty.pH!).toBeCloseTo(Math.hypot(DEFAULT_UNCERTAINTIES.pH, s / Math.sqrt(5)), 12);
    expect(e.basis.pH).toBe('readings');
  });
  it("a kit's step adds step/√12 (GUM F.2.2.1): a 20 mg/L drop-count step on 50 mg/L calcium", () => {
    const e = uncertaintiesFromEvidence({ caKitStepMgL: 20 }, { caMgL: 50 });
    expect(e.uncertainty.caRel!).toBeCloseTo(Math.hypot(0.05, 20 / Math.sqrt(12) / 50), 12);
    const a = analyzeSample(STREAM, { evidence: { caKitStepMgL: 20 } });
    const ca = a.calciteSiBudget!.find((x) => x.source === 'calcium')!;
    expect(ca.basis).toBe('kit-step');
    expect(ca.action).toMatch(/finer step/);
    expect(a.calciteSiUncertainty!).toBeGreaterThan(analyzeSample(STREAM).calciteSiUncertainty!);
  });
  it('refuses an impossible step, naming it', () => {
    expect(() => uncertaintiesFromEvidence({ caKitStepMgL: -1 })).toThrow(InputError);
  });
});

describe('the activity model: blended, and its doubt inside the band', () => {
  // Na–Cl water with calcium and alkalinity, full analysis, so I is computed (values of our choosing).
  const nacl = (molL: number): SampleInput => ({
    tempC: 25, pH: 8.0, alkalinityMgLCaCO3: 120, caMgL: 60, mgMgL: 5, so4MgL: 10,
    naMgL: molL * 22990, clMgL: molL * 35453,
  });
  it.each([0.005, 0.05, 0.1, 0.3, 0.5, 0.7, 1.2])('at NaCl %s mol/L every model valid there lies within the band of auto', (m) => {
    const auto = analyzeSample(nacl(m));
    const I = auto.ionicStrength.value!;
    for (const model of ACTIVITY_MODELS) {
      if (model === 'debye-huckel' || I > MODEL_MAX_IONIC_STRENGTH[model]) continue;
      const other = analyzeSample(nacl(m), { activityModel: model });
      expect(Math.abs(other.saturationIndex.calcite! - auto.saturationIndex.calcite!)).toBeLessThanOrEqual(auto.calciteSiUncertainty!);
    }
  });
  it('SI has no step along an NaCl series from 0.001 to 1.5 mol/L (auto blends over I = 0.05–0.1)', () => {
    let prev: number | undefined;
    let worst = 0;
    for (let i = 0; i <= 600; i++) {
      const m = 0.001 * Math.pow(1500, i / 600); // 1.2 % steps
      const si = analyzeSample(nacl(m)).saturationIndex.calcite!;
      if (prev !== undefined) worst = Math.max(worst, Math.abs(si - prev));
      prev = si;
    }
    // a 1.2 % step in NaCl moves SI smoothly by well under 0.01; the old switch jumped by up to 0.07
    expect(worst).toBeLessThan(0.006);
  }, 30_000);
});

describe('fresh to brackish: one continuous estimate', () => {
  it('SI has no step along SC 1,000 → 40,000 µS/cm (field readings only)', () => {
    let prev: number | undefined, prevI: number | undefined;
    let worst = 0, worstI = 0;
    for (let i = 0; i <= 400; i++) {
      const sc = 1000 * Math.pow(40, i / 400); // about 0.9 % steps
      const a = analyzeSample({ tempC: 18, pH: 7.9, scUsPerCm: sc, alkalinityMgLCaCO3: 110, caMgL: 60 });
      const si = a.saturationIndex.calcite!, I = a.ionicStrength.value!;
      if (prev !== undefined) {
        worst = Math.max(worst, Math.abs(si - prev));
        worstI = Math.max(worstI, Math.abs(I / prevI! - 1));
      }
      prev = si; prevI = I;
    }
    expect(worst).toBeLessThan(0.01);
    expect(worstI).toBeLessThan(0.02); // the old switch at 5,000 µS/cm dropped I by 29 % in one step
  }, 30_000);
  it('seawater from field readings agrees with its full analysis within the band (Millero 2013 composition, mg/kg; from memory)', () => {
    const sw = { tempC: 25, pH: 8.1, alkalinityMgLCaCO3: 117, caMgL: 412 };
    const full = analyzeSample({ ...sw, salinity: 35, mgMgL: 1284, naMgL: 10781, kMgL: 399, clMgL: 19353, so4MgL: 2712 });
    const field = analyzeSample({ ...sw, scUsPerCm: 53087 }); // S = 35 at 25 °C (PSS-78)
    expect(field.impliedSeawaterIonsMgL!.naMgL).toBeGreaterThan(10000);
    expect(Math.abs(field.saturationIndex.calcite! - full.saturationIndex.calcite!)).toBeLessThan(field.calciteSiUncertainty!);
    expect(Math.abs(field.saturationIndex.calcite! - full.saturationIndex.calcite!)).toBeLessThan(0.1);
  });
  it.each([0.1, 0.3, 0.6])('an estuarine mix (%s seawater) from field readings agrees with its full analysis within the band', (f) => {
    // seawater (Millero 2013, mg/kg; from memory) mixed with a hard fresh water of our choosing
    const sea = { caMgL: 412, mgMgL: 1284, naMgL: 10781, kMgL: 399, clMgL: 19353, so4MgL: 2712, alkalinityMgLCaCO3: 117 };
    const fresh = { caMgL: 45, mgMgL: 8, naMgL: 12, kMgL: 2, clMgL: 15, so4MgL: 20, alkalinityMgLCaCO3: 150 };
    const mix = Object.fromEntries(Object.keys(sea).map((k) => [k, f * sea[k as keyof typeof sea] + (1 - f) * fresh[k as keyof typeof fresh]])) as typeof sea;
    // its SC at 25 °C: the conductance whose PSS-78 salinity is f × 35 (bisection)
    let lo = 0, hi = 60000;
    for (let i = 0; i < 60; i++) {
      const mid = (lo + hi) / 2;
      if (salinityFromSpecificConductance(mid).salinity < 35 * f) lo = mid; else hi = mid;
    }
    const base = { tempC: 20, pH: 7.9 };
    const full = analyzeSample({ ...base, ...mix });
    const field = analyzeSample({ ...base, scUsPerCm: lo, caMgL: mix.caMgL, alkalinityMgLCaCO3: mix.alkalinityMgLCaCO3 });
    expect(Math.abs(field.saturationIndex.calcite! - full.saturationIndex.calcite!)).toBeLessThan(field.calciteSiUncertainty!);
  });
});
