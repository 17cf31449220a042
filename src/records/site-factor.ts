// A site's own SC → ionic-strength factor, from its full analyses (field entries plus imported lab
// results). Once a site has three, its factor replaces the generic one for that site's samples
// (issue 12); the engine computes it (conductanceFactorFromAnalyses), this file gathers the inputs.
import { conductanceFactorFromAnalyses, type SampleInput, type SiteConductanceFactor } from '../chemistry';
import { deriveSample } from './derive';
import type { LabResult, Sample, Settings } from './schema';

/** Lab parameter names (lower case, as labs commonly write them) → engine input field, mg/L. */
export const LAB_PARAMS: Record<string, keyof SampleInput> = {
  calcium: 'caMgL', ca: 'caMgL', magnesium: 'mgMgL', mg: 'mgMgL', sodium: 'naMgL', na: 'naMgL', potassium: 'kMgL', k: 'kMgL',
  chloride: 'clMgL', cl: 'clMgL', sulfate: 'so4MgL', so4: 'so4MgL', 'nitrate as n': 'no3NMgL', no3n: 'no3NMgL',
  fluoride: 'fMgL', f: 'fMgL', silica: 'sio2MgL', sio2: 'sio2MgL', tds: 'tdsMgL', 'alkalinity as caco3': 'alkalinityMgLCaCO3',
};

/** The engine fields a sample's lab results give (mg/L results only; censored "<" values left out). */
export function labInputs(lab: readonly LabResult[]): Partial<Record<keyof SampleInput, number>> {
  const out: Partial<Record<keyof SampleInput, number>> = {};
  for (const l of lab) {
    const field = LAB_PARAMS[l.parameter.trim().toLowerCase()];
    const unit = l.unit.replace(/\s/g, '').toLowerCase();
    if (!field || (unit !== 'mg/l' && unit !== '') || (l.qualifier ?? '').includes('<')) continue;
    out[field] = l.value;
  }
  return out;
}

/** A sample's full analysis: its field-derived input with lab values filling the fields not measured in the field. */
export function fullAnalysisInput(sample: Pick<Sample, 'field' | 'pressure' | 'lab'>, settings: Pick<Settings, 'activityModel' | 'conductanceFactor'>): SampleInput | undefined {
  const d = deriveSample(sample, settings);
  if (d.error || !Number.isFinite(d.input.tempC)) return undefined;
  const input: SampleInput = { ...d.input };
  for (const [k, v] of Object.entries(labInputs(sample.lab)) as Array<[keyof SampleInput, number]>) {
    if (input[k] === undefined || input[k] === null) (input as unknown as Record<string, number>)[k] = v;
  }
  return input;
}

/**
 * Each site's own factor, for the sites with at least three full analyses among `samples`
 * (environmental samples only: blanks and replicates are not the site's water twice).
 */
export function siteFactorsFrom(samples: readonly Sample[], settings: Pick<Settings, 'activityModel' | 'conductanceFactor'>): Record<string, SiteConductanceFactor> {
  const bySite = new Map<string, SampleInput[]>();
  for (const s of samples) {
    if (s.deletedAt || s.qc.type !== 'environmental') continue;
    // cheap pre-check before deriving: a full analysis has sodium and chloride from the field or the lab
    const lab = labInputs(s.lab);
    if ((s.field.ions.naMgL ?? lab.naMgL) === undefined || (s.field.ions.clMgL ?? lab.clMgL) === undefined) continue;
    const input = fullAnalysisInput(s, settings);
    if (!input) continue;
    bySite.set(s.siteId, [...(bySite.get(s.siteId) ?? []), input]);
  }
  const out: Record<string, SiteConductanceFactor> = {};
  for (const [siteId, inputs] of bySite) {
    const f = conductanceFactorFromAnalyses(inputs);
    if (f) out[siteId] = f;
  }
  return out;
}
