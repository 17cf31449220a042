// Property tests (fast-check, seeded and bounded so CI is repeatable).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { analyzeSample, InputError, type SampleInput } from '../../src/chemistry';

const SEED = 20261202;
const opt = (n = 300) => ({ seed: SEED, numRuns: n });

const maybe = <T>(arb: fc.Arbitrary<T>) => fc.option(arb, { nil: undefined });
const conc = (max: number) => maybe(fc.double({ min: 0, max, noNaN: true }));

/** Any physically possible input in and beyond the field range. */
const anyInput: fc.Arbitrary<SampleInput> = fc.record({
  tempC: fc.double({ min: -2, max: 100, noNaN: true }),
  pH: maybe(fc.double({ min: 0, max: 14, noNaN: true })),
  scUsPerCm: conc(60_000),
  tdsMgL: conc(40_000),
  salinity: maybe(fc.double({ min: 0, max: 42, noNaN: true })),
  alkalinityMgLCaCO3: conc(2_000),
  caMgL: conc(2_000),
  mgMgL: conc(2_000),
  naMgL: conc(12_000),
  kMgL: conc(500),
  clMgL: conc(20_000),
  so4MgL: conc(3_000),
  no3NMgL: conc(50),
  fMgL: conc(10),
  sio2MgL: conc(100),
});

/** Ordinary fresh water at the bank. */
const fieldWater = fc.record({
  tempC: fc.double({ min: 0, max: 35, noNaN: true }),
  pH: fc.double({ min: 6, max: 9, noNaN: true }),
  alkalinityMgLCaCO3: fc.double({ min: 10, max: 400, noNaN: true }),
  caMgL: fc.double({ min: 2, max: 200, noNaN: true }),
  mgMgL: fc.double({ min: 0.5, max: 60, noNaN: true }),
  naMgL: fc.double({ min: 1, max: 200, noNaN: true }),
  kMgL: fc.double({ min: 0.2, max: 20, noNaN: true }),
  clMgL: fc.double({ min: 1, max: 300, noNaN: true }),
  so4MgL: fc.double({ min: 1, max: 500, noNaN: true }),
});

function finiteEverywhere(x: unknown): boolean {
  if (typeof x === 'number') return Number.isFinite(x);
  if (Array.isArray(x)) return x.every(finiteEverywhere);
  if (x && typeof x === 'object') return Object.values(x).every(finiteEverywhere);
  return true;
}

describe('analyzeSample properties', () => {
  it('never returns NaN or Infinity, and never throws anything but InputError, on any possible input', () => {
    let analysed = 0;
    fc.assert(
      fc.property(anyInput, (input) => {
        try {
          const a = analyzeSample(input);
          analysed++;
          return finiteEverywhere(a) && a.warnings.every((w) => w.message.length > 0);
        } catch (e) {
          return e instanceof InputError;
        }
      }),
      opt(500),
    );
    // every generated input is possible, so nearly all must be analysed rather than refused
    expect(analysed).toBeGreaterThan(490);
  });

  it('converges everywhere in the field range with the full major-ion composition', () => {
    fc.assert(
      fc.property(fieldWater, (w) => {
        const a = analyzeSample(w);
        return a.speciation!.converged && a.ionicStrength.source === 'composition';
      }),
      opt(),
    );
  });

  // Monotonicity: with ionic strength held (SC-based) and one model, SI must rise with each driver.
  const fieldMin = fc.record({
    tempC: fc.double({ min: 0, max: 34, noNaN: true }),
    pH: fc.double({ min: 6, max: 8.9, noNaN: true }),
    scUsPerCm: fc.double({ min: 30, max: 1500, noNaN: true }),
    alkalinityMgLCaCO3: fc.double({ min: 10, max: 400, noNaN: true }),
    caMgL: fc.double({ min: 2, max: 200, noNaN: true }),
  });
  const si = (w: SampleInput) => analyzeSample(w, { activityModel: 'extended-debye-huckel' }).saturationIndex.calcite!;

  it('calcite SI rises with pH', () => {
    fc.assert(fc.property(fieldMin, fc.double({ min: 0.01, max: 1, noNaN: true }), (w, d) => si({ ...w, pH: w.pH + d }) > si(w)), opt());
  });
  it('calcite SI rises with calcium', () => {
    fc.assert(fc.property(fieldMin, fc.double({ min: 0.5, max: 50, noNaN: true }), (w, d) => si({ ...w, caMgL: w.caMgL + d }) > si(w)), opt());
  });
  it('calcite SI rises with temperature (retrograde solubility)', () => {
    fc.assert(fc.property(fieldMin, fc.double({ min: 0.5, max: 5, noNaN: true }), (w, d) => si({ ...w, tempC: w.tempC + d }) > si(w)), opt());
  });
  it('the state word always agrees with SI and its band', () => {
    fc.assert(
      fc.property(fieldMin, (w) => {
        const a = analyzeSample(w);
        const s = a.saturationIndex.calcite!, u = a.calciteSiUncertainty!;
        const expected = s - u > 0 ? 'supersaturated' : s + u < 0 ? 'undersaturated' : 'near-equilibrium';
        return a.calciteState === expected && u > 0;
      }),
      opt(),
    );
  });
});

describe('speciation warm start', () => {
  it('starting from a nearby solution converges to the same answer as starting cold', async () => {
    const { speciate } = await import('../../src/chemistry');
    fc.assert(
      fc.property(fieldWater, fc.double({ min: -0.3, max: 0.3, noNaN: true }), (w, dpH) => {
        const base = { tempC: w.tempC, pH: w.pH, alkEqL: w.alkalinityMgLCaCO3 / 50043, ca: w.caMgL / 40078, mg: w.mgMgL / 24305, na: w.naMgL / 22990, k: w.kMgL / 39098, cl: w.clMgL / 35453, so4: w.so4MgL / 96060, model: 'auto' as const };
        const near = speciate(base);
        const cold = speciate({ ...base, pH: base.pH + dpH });
        const warm = speciate({ ...base, pH: base.pH + dpH, start: near.state });
        return Math.abs(cold.logActivity.CO3 - warm.logActivity.CO3) < 1e-8 && Math.abs(cold.logActivity.Ca - warm.logActivity.Ca) < 1e-8 && warm.iterations <= cold.iterations + 1;
      }),
      opt(200),
    );
  });
});
