// Whether each sample lies within a passing meter check: pure glue between records and the engine.
import { calibrationCoverage, DEFAULT_PROFILE, type Coverage, type MethodProfile } from '../chemistry';
import type { CalibrationEvent, Sample } from '../records/schema';

const PARAMS = [
  { key: 'pH', has: (s: Sample) => !!s.field.pH },
  { key: 'sc', has: (s: Sample) => !!s.field.conductance },
  { key: 'do', has: (s: Sample) => !!s.field.do },
] as const;

/** The checked parameters in the crew's words. */
export const PARAM_WORDS: Record<string, string> = { pH: 'pH', sc: 'conductance', do: 'oxygen' };

/** Parameters measured in the sample that have no passing check of their meter in the window. */
export function uncoveredParameters(sample: Sample, calibrations: CalibrationEvent[], profile: MethodProfile = DEFAULT_PROFILE): Array<{ parameter: string; coverage: Coverage }> {
  const t = Date.parse(sample.time);
  const out: Array<{ parameter: string; coverage: Coverage }> = [];
  for (const p of PARAMS) {
    if (!p.has(sample)) continue;
    const events = calibrations
      .filter((c) => c.parameter === p.key && (sample.instrumentIds.length === 0 || sample.instrumentIds.includes(c.instrumentId)))
      .map((c) => ({ timeMs: Date.parse(c.time), pass: c.pass }));
    const coverage = calibrationCoverage(t, events, profile);
    if (coverage === 'none') out.push({ parameter: p.key, coverage });
  }
  return out;
}
