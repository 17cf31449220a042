// A site's own conductance factor from its full analyses, checked on real analyses from one aquifer:
// USGS INL wells in the eastern Snake River Plain aquifer (test/fixtures/real/PROVENANCE.md).
import { describe, expect, it } from 'vitest';
import { analyzeSample, conductanceFactorFromAnalyses, DEFAULT_CONDUCTANCE_FACTOR, InputError, type SampleInput } from '../../src/chemistry';
import { inlSamples, quantile, type InlSample } from '../fixtures/real/load';

const full = (s: InlSample): SampleInput => ({
  tempC: s.tempC ?? 15, pH: s.pH, scUsPerCm: s.sc, alkalinityMgLCaCO3: s.anc,
  caMgL: s.ca, mgMgL: s.mg, naMgL: s.na, kMgL: s.k, clMgL: s.cl, so4MgL: s.so4, fMgL: s.f, no3NMgL: s.no3N, sio2MgL: s.sio2,
});
const usable = inlSamples().filter((s) => s.sc !== undefined && s.sc > 10 && s.pH !== undefined && s.anc !== undefined);
const bySite = new Map<string, InlSample[]>();
for (const s of usable) bySite.set(s.site, [...(bySite.get(s.site) ?? []), s]);
const wells = [...bySite.entries()].filter(([, v]) => v.length >= 12).map(([site, v]) => ({ site, v: v.sort((a, b) => a.datetime.localeCompare(b.datetime)) }));

describe('conductanceFactorFromAnalyses', () => {
  it('needs three usable full analyses; refuses a non-array', () => {
    const one = usable.slice(0, 2).map(full);
    expect(conductanceFactorFromAnalyses(one)).toBeUndefined();
    expect(conductanceFactorFromAnalyses([...one, { tempC: 10, pH: 7, scUsPerCm: 300, caMgL: 40 }])).toBeUndefined(); // partial: skipped
    expect(conductanceFactorFromAnalyses(usable.slice(0, 3).map(full))!.n).toBe(3);
    expect(() => conductanceFactorFromAnalyses('x' as never)).toThrow(InputError);
  });
  it('a site factor from each well’s first 5 analyses predicts I of its later samples better than the generic factor, and its band covers them', () => {
    expect(wells.length).toBeGreaterThanOrEqual(5);
    const errSite: number[] = [], errGeneric: number[] = [];
    let covered = 0, total = 0;
    for (const { v } of wells) {
      const f = conductanceFactorFromAnalyses(v.slice(0, 5).map(full))!;
      expect(f.n).toBe(5);
      // Published factors 1.27e-5 (Griffin & Jurinak 1973) to 1.6e-5 (Russell 1976; from memory): the wells sit near them
      expect(f.factor).toBeGreaterThan(1.1e-5);
      expect(f.factor).toBeLessThan(1.8e-5);
      for (const s of v.slice(5)) {
        const iTrue = analyzeSample(full(s)).ionicStrength.value!;
        const fieldOnly = { tempC: s.tempC ?? 15, pH: s.pH, scUsPerCm: s.sc, alkalinityMgLCaCO3: s.anc, caMgL: s.ca };
        const site = analyzeSample(fieldOnly, { siteConductanceFactor: f });
        const generic = analyzeSample(fieldOnly);
        expect(site.ionicStrength.conductanceFactor!.source).toBe('site');
        const e = Math.log(site.ionicStrength.value! / iTrue);
        errSite.push(Math.abs(e));
        errGeneric.push(Math.abs(Math.log(generic.ionicStrength.value! / iTrue)));
        total++;
        if (Math.abs(e) <= 2 * site.ionicStrength.relUncertainty) covered++;
      }
    }
    console.log(`site factor: median |error| ${(quantile(errSite, 0.5) * 100).toFixed(1)} % vs generic ${(quantile(errGeneric, 0.5) * 100).toFixed(1)} %; 2σ covers ${((covered / total) * 100).toFixed(0)} % of ${total}`);
    expect(quantile(errSite, 0.5)).toBeLessThan(quantile(errGeneric, 0.5));
    expect(covered / total).toBeGreaterThan(0.9);
  }, 60_000);
  it('the band narrows where the site has earned it: its own factor replaces the generic 11 %', () => {
    const { v } = wells[0]!;
    const own = conductanceFactorFromAnalyses(v.slice(0, 8).map(full))!;
    expect(own.relUncertainty).toBeLessThan(0.11);
    const s = v[v.length - 1]!;
    const w = { tempC: s.tempC ?? 15, pH: s.pH, scUsPerCm: s.sc, alkalinityMgLCaCO3: s.anc, caMgL: s.ca };
    const generic = analyzeSample(w).calciteSiBudget!.find((b) => b.source === 'ionic-strength')!;
    const site = analyzeSample(w, { siteConductanceFactor: own }).calciteSiBudget!.find((b) => b.source === 'ionic-strength')!;
    expect(site.basis).toBe('site-factor');
    expect(site.u).toBeLessThan(generic.u);
  });
  it('a unit slip among the analyses does not move the factor (USGS INL well NRF 6, SC 1.88 on 2023-05-23)', () => {
    const nrf6 = inlSamples().filter((x) => x.site === 'NRF 6' && x.sc !== undefined && x.pH !== undefined && x.anc !== undefined).map(full);
    expect(nrf6.some((x) => x.scUsPerCm === 1.88)).toBe(true);
    const withSlip = conductanceFactorFromAnalyses(nrf6)!;
    const without = conductanceFactorFromAnalyses(nrf6.filter((x) => x.scUsPerCm !== 1.88))!;
    expect(Math.abs(withSlip.factor / without.factor - 1)).toBeLessThan(0.02);
  });
});
