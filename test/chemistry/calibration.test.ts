import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  calibrationCoverage,
  conductivityStandardCheck,
  DEFAULT_PROFILE,
  doAirCalibrationCheck,
  InputError,
  median,
  nernstSlopeMvPerPh,
  phCalibration,
  profileProblems,
  replicateRpd,
  stabilization,
  type MethodProfile,
} from '../../src/chemistry';

describe('nernstSlopeMvPerPh', () => {
  it('59.16 mV/pH at 25 °C (field-practice.md; NFM A6.4; standard value), proportional to absolute temperature', () => {
    expect(nernstSlopeMvPerPh(25)).toBeCloseTo(59.16, 2);
    expect(nernstSlopeMvPerPh(0)).toBeCloseTo((59.16 * 273.15) / 298.15, 2); // 54.20
    expect(nernstSlopeMvPerPh(5) / nernstSlopeMvPerPh(25)).toBeCloseTo(278.15 / 298.15, 12);
  });
});

/** Buffer readings of an electrode with a given slope (% Nernst) and offset at pH 7, at tempC. */
function electrode(slopePct: number, offsetMv: number, tempC: number, buffers: number[]) {
  const s = (nernstSlopeMvPerPh(tempC) * slopePct) / 100;
  return buffers.map((pH) => ({ bufferPH: pH, mV: offsetMv - s * (pH - 7), tempC }));
}

describe('phCalibration', () => {
  it.each([5, 15, 25])('recovers slope and offset at %d °C and passes a healthy electrode', (t) => {
    const r = phCalibration(electrode(98.5, -12, t, [4, 7, 10]));
    expect(r.slopePercent).toBeCloseTo(98.5, 6);
    expect(r.offsetMv).toBeCloseTo(-12, 6);
    expect(r.pass).toBe(true);
    expect(r.status).toBe('pass');
    expect(r.profile).toEqual({ profileId: 'bankside-default', profileVersion: 1 });
  });
  it('fails a tired electrode (slope 91 %) and a large offset (+42 mV), saying why (limits 95–102 %, ±30 mV: NFM A6.4, from memory)', () => {
    const weak = phCalibration(electrode(91, 5, 20, [4, 7, 10]));
    expect(weak.pass).toBe(false);
    expect(weak.warnings.map((w) => w.code)).toContain('ph-slope');
    const off = phCalibration(electrode(99, 42, 20, [7, 10]));
    expect(off.pass).toBe(false);
    expect(off.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['ph-offset', 'no-check-buffer']));
  });
  it('a third buffer reading off by 0.2 pH fails the check-buffer test', () => {
    const pts = electrode(99, 0, 20, [4, 7, 10]);
    pts[2] = { ...pts[2]!, mV: pts[2]!.mV - 0.25 * nernstSlopeMvPerPh(20) };
    const r = phCalibration(pts);
    expect(r.warnings.map((w) => w.code)).toContain('ph-check-buffer');
    expect(r.pass).toBe(false);
  });
  it('one buffer: offset only, incomplete, a clear warning and no slope', () => {
    const r = phCalibration([{ bufferPH: 7, mV: 3, tempC: 18 }]);
    expect(r.status).toBe('incomplete');
    expect(r.slopePercent).toBeUndefined();
    expect(r.offsetMv).toBeCloseTo(3, 9);
    expect(r.warnings[0]!.code).toBe('single-buffer');
  });
  it('warns when the sample pH is outside the buffers', () => {
    const r = phCalibration(electrode(99, 0, 20, [4, 7]), DEFAULT_PROFILE, { samplePH: 8.2 });
    expect(r.warnings.map((w) => w.code)).toContain('ph-not-bracketed');
  });
  it('refuses impossible readings', () => {
    expect(() => phCalibration([])).toThrow(InputError);
    expect(() => phCalibration([{ bufferPH: 7, mV: Number.NaN, tempC: 20 }])).toThrow(/mV/);
  });
});

describe('conductivityStandardCheck', () => {
  it('0.01 mol/L KCl = 1413 µS/cm (EPA 120.1; memory): 1450 is +2.6 % and passes ±3 %; 1460 fails', () => {
    const ok = conductivityStandardCheck(1413, 1450);
    expect(ok.deviationPercent).toBeCloseTo(2.6185, 3);
    expect(ok.limitPercent).toBe(3);
    expect(ok.pass).toBe(true);
    expect(conductivityStandardCheck(1413, 1460).pass).toBe(false);
  });
  it('a 100 µS/cm standard allows ±5 % (NFM A6.3; memory)', () => {
    expect(conductivityStandardCheck(100, 104.5).pass).toBe(true);
    expect(conductivityStandardCheck(100, 105.5).pass).toBe(false);
  });
});

describe('doAirCalibrationCheck', () => {
  it('compares with Benson & Krause saturation at true pressure: 9.05 at 20 °C, 1 atm is within ±0.2 mg/L of 9.09', () => {
    const r = doAirCalibrationCheck(9.05, 20, 101.325);
    expect(r.theoreticalMgL).toBeCloseTo(9.092, 2);
    expect(r.pass).toBe(true);
    expect(doAirCalibrationCheck(9.05, 20, 90).pass).toBe(false); // at 90 kPa saturation is only ~8.07
  });
});

describe('calibrationCoverage', () => {
  const h = 3600_000;
  it('bracketed, one-sided or none by the profile window (24 h)', () => {
    const t = 100 * h;
    expect(calibrationCoverage(t, [{ timeMs: t - 2 * h, pass: true }, { timeMs: t + 3 * h, pass: true }])).toBe('bracketed');
    expect(calibrationCoverage(t, [{ timeMs: t - 2 * h, pass: true }])).toBe('before-only');
    expect(calibrationCoverage(t, [{ timeMs: t - 2 * h, pass: false }])).toBe('none');
    expect(calibrationCoverage(t, [{ timeMs: t - 30 * h, pass: true }])).toBe('none');
  });
});

describe('stabilization (NFM A6.0 criteria held in the profile; memory)', () => {
  const at = (values: number[]) => values.map((value, i) => ({ timeMs: i * 30_000, value }));
  it('pH: five readings within ±0.1 of their median are stable; the median is reported', () => {
    const r = stabilization(at([7.42, 7.38, 7.35, 7.33, 7.34, 7.35, 7.36]), 'pH');
    expect(r.stable).toBe(true);
    expect(r.window).toEqual([7.35, 7.33, 7.34, 7.35, 7.36]);
    expect(r.median).toBe(7.35);
    expect(r.windowSeconds).toBe(120);
  });
  it('SC switches from ±5 µS/cm to ±3 % above 100 µS/cm', () => {
    expect(stabilization(at([60, 64, 63, 62, 61]), 'sc').stable).toBe(true);
    expect(stabilization(at([60, 68, 63, 62, 61]), 'sc').stable).toBe(false); // 68 is 6 from the median 62
    expect(stabilization(at([800, 820, 810, 790, 805]), 'sc').stable).toBe(true); // ±24 allowed
  });
  it('too few readings: not stable, says how many more', () => {
    const r = stabilization(at([10.1, 10.1]), 'temperature');
    expect(r.stable).toBe(false);
    expect(r.reason).toMatch(/2 of 5/);
  });
  it('property: stable exactly when every reading of the window lies within tolerance of the median', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 6, max: 9, noNaN: true }), { minLength: 5, maxLength: 12 }), (vals) => {
        const r = stabilization(at(vals), 'pH');
        const w = vals.slice(-5);
        const m = median(w);
        const expected = w.every((v) => Math.abs(v - m) <= 0.1 + 1e-12);
        return r.stable === expected && r.median === m && r.median! >= Math.min(...w) && r.median! <= Math.max(...w);
      }),
      { seed: 7, numRuns: 300 },
    );
  });
  it('property: order of entry does not matter, only time', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 30, noNaN: true }), { minLength: 5, maxLength: 9 }), (vals) => {
        const readings = at(vals);
        const a = stabilization(readings, 'temperature');
        const b = stabilization([...readings].reverse(), 'temperature');
        return a.stable === b.stable && a.median === b.median;
      }),
      { seed: 8, numRuns: 200 },
    );
  });
  it('replicate RPD: 100 |a − b| / mean (common QC practice)', () => {
    expect(replicateRpd(10, 11)).toBeCloseTo(9.5238, 3);
    expect(replicateRpd(5, 5)).toBe(0);
    expect(replicateRpd(-1, 1)).toBeUndefined();
  });
});

describe('method profiles', () => {
  it('the default profile is valid and every result names it', () => {
    expect(profileProblems(DEFAULT_PROFILE)).toEqual([]);
  });
  it('a user profile changes the verdict, and is recorded with its id and version', () => {
    const loose: MethodProfile = {
      ...DEFAULT_PROFILE, id: 'project-x', version: 3,
      phCalibration: { ...DEFAULT_PROFILE.phCalibration, slopeMinPercent: 90 },
    };
    const pts = electrode(92, 0, 20, [4, 7, 10]);
    expect(phCalibration(pts).pass).toBe(false);
    const r = phCalibration(pts, loose);
    expect(r.pass).toBe(true);
    expect(r.profile).toEqual({ profileId: 'project-x', profileVersion: 3 });
  });
  it('catches a broken user profile in words', () => {
    const bad = { ...DEFAULT_PROFILE, version: 0, stabilization: { ...DEFAULT_PROFILE.stabilization, readings: 1 } };
    expect(profileProblems(bad)).toHaveLength(2);
  });
});
