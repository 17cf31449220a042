// A site's own SC → ionic-strength factor, from its full analyses (field entries plus imported lab
// results). Once a site has three, its factor replaces the generic one for that site's samples
// (issue 12); the engine computes it (conductanceFactorFromAnalyses), this file gathers the inputs.
import { conductanceFactorFromAnalyses, type SampleInput, type SiteConductanceFactor } from '../chemistry';
import { deriveSample } from './derive';
import type { Sample, Settings } from './schema';
import { labEngineInputs } from './lab-units';

/** The engine fields a sample's lab results give (converted from any recognised unit; censored values left out). */
export const labInputs = labEngineInputs;

/** A sample's full analysis: its field-derived input with lab values filling the fields not measured in the field. */
export function fullAnalysisInput(sample: Pick<Sample, 'field' | 'pressure' | 'lab'>, settings: Pick<Settings, 'activityModel' | 'conductanceFactor'>): SampleInput | undefined {
  // deriveSample already fills what the field did not measure from the lab results
  const d = deriveSample(sample, settings);
  if (d.error || !Number.isFinite(d.input.tempC)) return undefined;
  return { ...d.input };
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
