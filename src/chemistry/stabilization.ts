import { InputError, present } from './errors';
import { DEFAULT_PROFILE, profileRef, toleranceAt, type MethodProfile, type ProfileRef, type StabilizedParameter } from './profiles';

export interface TimedReading {
  /** ms since epoch */
  timeMs: number;
  value: number;
}

export interface StabilizationResult {
  stable: boolean;
  /** readings the profile asks for */
  readingsNeeded: number;
  /** the last N readings, oldest first */
  window: number[];
  /** the value to report: the median of the window (NFM A6.0; memory) */
  median: number | undefined;
  /** largest |reading − median| in the window */
  maxDeviation: number | undefined;
  tolerance: number | undefined;
  /** why not stable, in words; empty when stable */
  reason: string;
  windowSeconds: number | undefined;
  profile: ProfileRef;
}

/** Median of a non-empty list (the mean of the two middle values for an even count). */
export function median(values: number[]): number {
  if (values.length === 0) throw new InputError('values', 'The median of no values is undefined.');
  const s = [...values].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/**
 * Field-parameter stabilization (USGS NFM A6.0; criteria from memory, held in the profile): the
 * last N sequential readings (default 5) must each lie within the parameter's tolerance of their
 * median: temperature ±0.2 °C; pH ±0.1; SC ±5 µS/cm at ≤ 100 µS/cm, else ±3 %; DO ±0.2 mg/L;
 * turbidity ±0.5 FNU at ≤ 10 FNU, else ±5 %. The median of the window is the value to report.
 */
export function stabilization(
  readings: TimedReading[],
  parameter: StabilizedParameter,
  profile: MethodProfile = DEFAULT_PROFILE,
): StabilizationResult {
  if (!Array.isArray(readings)) throw new InputError('readings', 'readings must be a list.');
  readings.forEach((r, i) => {
    if (!present(`readings[${i}].value`, r.value)) throw new InputError(`readings[${i}].value`, `Reading ${i + 1} has no value.`);
    if (!present(`readings[${i}].timeMs`, r.timeMs)) throw new InputError(`readings[${i}].timeMs`, `Reading ${i + 1} has no time.`);
  });
  const tol = profile.stabilization.tolerance[parameter];
  if (!tol) throw new InputError('parameter', `No stabilization criterion for '${parameter}' in profile ${profile.id}.`);
  const n = profile.stabilization.readings;
  const ordered = [...readings].sort((a, b) => a.timeMs - b.timeMs);
  const last = ordered.slice(-n);
  const window = last.map((r) => r.value);
  const base = { readingsNeeded: n, window, profile: profileRef(profile) };
  if (window.length === 0) {
    return { ...base, stable: false, median: undefined, maxDeviation: undefined, tolerance: undefined, reason: `No readings yet: take ${n}.`, windowSeconds: undefined };
  }
  const med = median(window);
  const tolerance = toleranceAt(tol, med);
  const maxDeviation = Math.max(...window.map((v) => Math.abs(v - med)));
  const windowSeconds = (last[last.length - 1]!.timeMs - last[0]!.timeMs) / 1000;
  if (window.length < n) {
    return { ...base, stable: false, median: med, maxDeviation, tolerance, windowSeconds, reason: `${window.length} of ${n} readings: keep reading.` };
  }
  const stable = maxDeviation <= tolerance + 1e-12;
  return {
    ...base,
    stable,
    median: med,
    maxDeviation,
    tolerance,
    windowSeconds,
    reason: stable ? '' : `Readings still drift: ±${maxDeviation.toPrecision(2)} around the median, allowed ±${tolerance.toPrecision(2)}. Wait and read again.`,
  };
}

/**
 * Relative percent difference of a replicate pair: RPD = 100 |a − b| / ((a + b)/2)
 * (common QC practice, e.g. EPA SW-846 ch. 1). Undefined when the mean is 0 and the values differ.
 */
export function replicateRpd(a: number, b: number): number | undefined {
  if (!present('a', a)) throw new InputError('a', 'Both replicate values are required.');
  if (!present('b', b)) throw new InputError('b', 'Both replicate values are required.');
  if (a === b) return 0;
  const mean = Math.abs((a + b) / 2);
  return mean === 0 ? undefined : (100 * Math.abs(a - b)) / mean;
}
