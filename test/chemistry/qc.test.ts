// Field QC verdicts. RPD = 100 |a − b| / mean (common QC practice, e.g. EPA SW-846 ch. 1; from memory);
// the limits are the default profile's (common practice, our choice), so the expected verdicts follow
// from the arithmetic shown beside each value.
import { describe, expect, it } from 'vitest';
import { blankVerdict, DEFAULT_PROFILE, replicateVerdict, type MethodProfile } from '../../src/chemistry';

describe('replicate against its parent', () => {
  it('judges each parameter by RPD or plain difference with the profile limits', () => {
    const v = replicateVerdict({ temperature: 7.9, pH: 8.3, sc: 420, alkalinity: 150 }, { temperature: 7.8, pH: 8.06, sc: 400, alkalinity: 168, calcium: 62 }, DEFAULT_PROFILE);
    const by = Object.fromEntries(v.checks.map((c) => [c.parameter, c]));
    expect(Object.keys(by)).toEqual(['temperature', 'pH', 'sc', 'alkalinity']); // calcium missing on one side: not judged
    expect(by.temperature!.pass).toBe(true); // 0.1 °C ≤ 0.5
    expect(by.pH!.difference).toBeCloseTo(0.24, 10);
    expect(by.pH!.pass).toBe(false); // 0.24 > 0.2
    expect(by.sc!.rpdPercent).toBeCloseTo((100 * 20) / 410, 10); // 4.878 % ≤ 5 %
    expect(by.sc!.pass).toBe(true);
    expect(by.alkalinity!.rpdPercent).toBeCloseTo((100 * 18) / 159, 10); // 11.3 % > 10 % and 18 > 5 mg/L
    expect(by.alkalinity!.pass).toBe(false);
    expect(v.pass).toBe(false);
    expect(by.pH!.message).toBe('pH 8.30 vs 8.06: difference 0.24, allowed 0.2.');
    expect(v.profile).toEqual({ profileId: 'bankside-default', profileVersion: 1 });
  });

  it('near zero the plain difference decides (an RPD of two tiny values says little)', () => {
    const v = replicateVerdict({ sc: 6 }, { sc: 9 });
    expect(v.checks[0]!.rpdPercent).toBeCloseTo(40, 10); // 100·3/7.5
    expect(v.pass).toBe(true); // 3 µS/cm ≤ 5
  });

  it('has no verdict when nothing is comparable, and uses a stricter profile when asked', () => {
    expect(replicateVerdict({ sc: 400 }, { pH: 7 }).pass).toBeUndefined();
    const strict: MethodProfile = { ...DEFAULT_PROFILE, id: 'strict', version: 2, qc: { ...DEFAULT_PROFILE.qc!, replicate: { ...DEFAULT_PROFILE.qc!.replicate, sc: { maxRpdPercent: 2 } } } };
    const v = replicateVerdict({ sc: 420 }, { sc: 400 }, strict);
    expect(v.pass).toBe(false); // 4.9 % > 2 %
    expect(v.profile).toEqual({ profileId: 'strict', profileVersion: 2 });
  });

  it('a stored profile without QC limits falls back to the defaults', () => {
    const old = { ...DEFAULT_PROFILE, id: 'older' } as MethodProfile;
    delete old.qc;
    expect(replicateVerdict({ sc: 420 }, { sc: 400 }, old).pass).toBe(true);
  });
});

describe('field blank against the blank limits', () => {
  it('passes a clean blank (SC 1.8 µS/cm) and fails one with calcium carried over', () => {
    const ok = blankVerdict({ temperature: 12, pH: 5.6, sc: 1.8, alkalinity: 2 });
    expect(ok.pass).toBe(true);
    expect(ok.checks.map((c) => c.parameter)).toEqual(['sc', 'alkalinity']); // pH and temperature are not blank criteria
    const bad = blankVerdict({ sc: 1.8, calcium: 1.5 });
    expect(bad.pass).toBe(false);
    expect(bad.checks.find((c) => c.parameter === 'calcium')!.message).toBe('Calcium 1.50 mg/L in the blank, allowed up to 1 mg/L.');
  });
});
