import { describe, expect, it } from 'vitest';
import { analyzeSample, calculatedTdsMgL, dataChecks, type DataCheck } from '../../src/chemistry';

// A balanced fresh water (USGS INL sample 13115000, 1968-04-01, see test/fixtures/real; SC 256).
const water = {
  tempC: 11, pH: 8.4, scUsPerCm: 256, alkalinityMgLCaCO3: 120, caMgL: 31, mgMgL: 8.5, naMgL: 9.8, kMgL: 2.2,
  clMgL: 6.5, so4MgL: 7.2, sio2MgL: 28,
};
const byId = (list: DataCheck[], id: DataCheck['id']) => list.find((c) => c.id === id)!;

describe('dataChecks (Standard Methods 1030 E; profile ranges)', () => {
  it('passes a good analysis and names source and profile on every check', () => {
    const c = dataChecks(water, analyzeSample(water), undefined, { doMgL: 10.4 });
    expect(byId(c, 'charge-balance').status).toBe('pass');
    expect(byId(c, 'sc-calculated').status).toBe('pass');
    expect(byId(c, 'ion-sum-sc').status).toBe('pass');
    // Benson & Krause saturation at 11 °C, 1 atm is 11.03 mg/L (USGS OWQ memo 2011.03 table; from memory)
    expect(byId(c, 'range-do-percent').value!).toBeCloseTo((100 * 10.4) / 11.03, 0);
    expect(byId(c, 'tds-calculated').status).toBe('not-applicable');
    for (const check of c) {
      expect(check.source.length).toBeGreaterThan(5);
      expect(check.profile.profileId).toBe('bankside-default');
    }
  });
  it('calculated TDS = 0.6 alkalinity + the ions (SM 1030 E; memory) and the TDS checks use it', () => {
    expect(calculatedTdsMgL(water)).toBeCloseTo(0.6 * 120 + 9.8 + 2.2 + 31 + 8.5 + 6.5 + 7.2 + 28, 9);
    const withTds = { ...water, tdsMgL: 180 };
    const c = dataChecks(withTds, analyzeSample(withTds));
    expect(byId(c, 'tds-calculated').value).toBeCloseTo(180 / 165.2, 9);
    expect(byId(c, 'tds-calculated').status).toBe('pass');
    expect(byId(c, 'tds-sc').value).toBeCloseTo(180 / 256, 9);
    expect(byId(c, 'tds-sc').status).toBe('fail'); // 0.70 upper limit
  });
  it('fails the SC checks when SC is off by a factor', () => {
    const slip = { ...water, scUsPerCm: 2.56 };
    const c = dataChecks(slip, analyzeSample(slip));
    expect(byId(c, 'sc-calculated').status).toBe('fail');
    expect(byId(c, 'ion-sum-sc').status).toBe('fail');
  });
  it('range checks: pH 10 and warm water fail, missing values are not applicable', () => {
    const odd = { tempC: 42, pH: 10 };
    const c = dataChecks(odd, analyzeSample(odd));
    expect(byId(c, 'range-ph').status).toBe('fail');
    expect(byId(c, 'range-temperature').status).toBe('fail');
    expect(byId(c, 'range-do').status).toBe('not-applicable');
    expect(byId(c, 'charge-balance').status).toBe('not-applicable');
  });
});
