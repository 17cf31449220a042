// Field QC of a sample (replicate against its parent, blank against the blank limits): glue between
// the stored records, their derived values and the engine's verdicts. No storage, no UI.
import { blankVerdict, replicateVerdict, type MethodProfile, type QcValues, type QcVerdict } from '../chemistry';
import type { Derived } from './derive';
import type { Sample } from './schema';

/** The values QC compares, taken from a derived sample (reported medians, SC at 25 °C, DO in mg/L). */
export function qcValues(d: Derived): QcValues {
  const v: QcValues = {};
  if (Number.isFinite(d.input.tempC)) v.temperature = d.input.tempC;
  if (d.input.pH != null) v.pH = d.input.pH;
  if (d.input.scUsPerCm != null) v.sc = d.input.scUsPerCm;
  if (d.doMgL !== undefined) v.do = d.doMgL;
  if (d.input.alkalinityMgLCaCO3 != null) v.alkalinity = d.input.alkalinityMgLCaCO3;
  if (d.input.caMgL != null) v.calcium = d.input.caMgL;
  return v;
}

/**
 * The QC verdict of a replicate or blank; undefined for an environmental sample, and for a replicate
 * whose parent is not known (its verdict then cannot be formed: the caller says so).
 */
export function qcVerdictFor(
  sample: Pick<Sample, 'qc'>,
  derived: Derived,
  parent: { derived: Derived } | undefined,
  profile: MethodProfile,
): QcVerdict | undefined {
  if (sample.qc.type === 'blank') return blankVerdict(qcValues(derived), profile);
  if (sample.qc.type === 'replicate' && parent) return replicateVerdict(qcValues(derived), qcValues(parent.derived), profile);
  return undefined;
}

/** One line for a table or CSV cell: "pass", "fail: SC RPD 12.0 % …", "not judged". */
export function qcSummary(v: QcVerdict | undefined, type: Sample['qc']['type']): string {
  if (type === 'environmental') return '';
  if (!v) return type === 'replicate' ? 'not judged: no parent sample' : 'not judged';
  if (v.pass === undefined) return 'not judged: no comparable values';
  return v.pass ? 'pass' : `fail: ${v.checks.filter((c) => !c.pass).map((c) => c.message).join(' ')}`;
}
