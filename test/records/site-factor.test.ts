// A site's own conductance factor in the app: from its full analyses (field entries plus imported lab
// results), replacing the generic factor for that site's samples, and named in exports. The analyses
// are real: USGS INL well NRF 10, eastern Snake River Plain aquifer (test/fixtures/real/PROVENANCE.md).
import { describe, expect, it } from 'vitest';
import { conductanceFactorFromAnalyses } from '../../src/chemistry';
import { Sample, DEFAULT_SETTINGS } from '../../src/records/schema';
import { deriveSample } from '../../src/records/derive';
import { fullAnalysisInput, siteFactorsFrom } from '../../src/records/site-factor';
import { parseCsv, wideCsv } from '../../src/exchange/csv';
import { inlSamples } from '../fixtures/real/load';

const T = '2026-06-14T12:00:00-06:00';
const well = inlSamples().filter((s) => s.site === 'NRF 10' && s.sc !== undefined && s.pH !== undefined && s.anc !== undefined);

function sampleOf(i: number, siteId: string, withLab: boolean): Sample {
  const s = well[i]!;
  const v = (value: number) => ({ values: [{ time: T, value }] });
  const lab = withLab
    ? ([['magnesium', s.mg], ['sodium', s.na], ['potassium', s.k], ['chloride', s.cl], ['sulfate', s.so4]] as const).map(([parameter, value]) => ({ parameter, value, unit: 'mg/L', importedAt: T }))
    : [];
  return Sample.parse({
    id: `s${i}-${siteId}`, siteId, time: T, localDate: '2026-06-14', createdAt: T, updatedAt: T,
    field: {
      tempC: v(s.tempC ?? 12), pH: v(s.pH!), conductance: { mode: 'sc', values: [{ time: T, value: s.sc! }], unit: 'uS/cm' },
      alkalinity: { kind: 'direct', value: s.anc!, unit: 'mg/L CaCO3' }, kits: [{ analyte: 'calcium', value: s.ca, unit: 'mg/L' }], ions: {},
    },
    lab,
  });
}

describe('site conductance factor in the app', () => {
  it('three full analyses (field readings + lab major ions) give the site its own factor, the same the engine gives', () => {
    expect(well.length).toBeGreaterThan(10);
    const samples = [0, 1, 2, 3].map((i) => sampleOf(i, 'nrf10', true));
    const factors = siteFactorsFrom(samples, DEFAULT_SETTINGS);
    const engine = conductanceFactorFromAnalyses(samples.map((s) => fullAnalysisInput(s, DEFAULT_SETTINGS)!));
    expect(factors.nrf10).toEqual(engine);
    expect(factors.nrf10!.n).toBe(4);
    // two full analyses are not enough; field-only samples do not count
    expect(siteFactorsFrom([sampleOf(0, 'b', true), sampleOf(1, 'b', true), sampleOf(2, 'b', false)], DEFAULT_SETTINGS).b).toBeUndefined();
  });
  it("replaces the generic factor for that site's field-only samples, and the export names it as the ionic-strength source", () => {
    const samples = [...[0, 1, 2].map((i) => sampleOf(i, 'nrf10', true)), sampleOf(5, 'nrf10', false), sampleOf(6, 'other', false)];
    const factors = siteFactorsFrom(samples, DEFAULT_SETTINGS);
    const d = deriveSample(samples[3]!, { ...DEFAULT_SETTINGS, siteFactors: factors });
    expect(d.analysis!.ionicStrength.conductanceFactor).toEqual({ value: factors.nrf10!.factor, source: 'site', n: 3 });
    expect(deriveSample(samples[4]!, { ...DEFAULT_SETTINGS, siteFactors: factors }).analysis!.ionicStrength.conductanceFactor!.source).toBe('generic');
    const rows = parseCsv(wideCsv({ samples, sites: [], settings: DEFAULT_SETTINGS })).rows;
    expect(rows[3]!.ionic_strength_source).toBe('conductance-site-factor (3 full analyses)');
    expect(rows[4]!.ionic_strength_source).toBe('conductance');
  });
});
