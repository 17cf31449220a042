import { SM1030E_LIMITS, type BalanceLimits } from './balance';

/**
 * Method profiles: every acceptance threshold used by the field-method checks lives here, in a
 * named, versioned profile. A check result records the profile id and version it used, so an
 * office can tell which rules a record passed. Agencies and projects copy the default and edit.
 *
 * Default values and their sources (see DEVELOPERS.md for the full list). "memory" = recalled,
 * not read in the source: keep editable and verify against the current manual revision.
 */
export interface Tolerance {
  /** absolute tolerance in the parameter's unit */
  abs?: number;
  /** relative tolerance (fraction) */
  rel?: number;
  /** below this value the absolute tolerance applies, above it the relative one */
  switchAt?: number;
}

export type StabilizedParameter = 'temperature' | 'pH' | 'sc' | 'do' | 'turbidity';

/** Parameters a field QC sample (replicate or blank) is judged on. */
export type QcParameter = 'temperature' | 'pH' | 'sc' | 'do' | 'alkalinity' | 'calcium';

/**
 * A replicate agrees with its parent when the relative percent difference is within `maxRpdPercent`
 * OR the plain difference is within `maxAbsDiff` (near zero an RPD says little); pH and temperature,
 * not ratio quantities, use the plain difference only.
 */
export interface ReplicateLimit {
  maxRpdPercent?: number;
  /** in the parameter's unit: °C, pH, µS/cm, mg/L, mg/L as CaCO₃ */
  maxAbsDiff?: number;
}

/** Field QC acceptance: replicate agreement per parameter, and what a blank may show. */
export interface QcLimits {
  replicate: Record<QcParameter, ReplicateLimit>;
  /** a field blank (deionized water through the same bottles and meters) passes at or below these */
  blank: { scUsPerCm: number; alkalinityMgLCaCO3: number; caMgL: number };
}

/**
 * Default QC limits (common practice, our choice; keep editable): field replicates within 5 % RPD for
 * SC, 10 % for DO and alkalinity, 20 % for kit calcium (coarse steps), pH within 0.2 and temperature
 * within 0.5 °C; a blank at most 5 µS/cm SC, 5 mg/L alkalinity as CaCO₃ and 1 mg/L calcium.
 */
export const DEFAULT_QC_LIMITS: QcLimits = {
  replicate: {
    temperature: { maxAbsDiff: 0.5 },
    pH: { maxAbsDiff: 0.2 },
    sc: { maxRpdPercent: 5, maxAbsDiff: 5 },
    do: { maxRpdPercent: 10, maxAbsDiff: 0.3 },
    alkalinity: { maxRpdPercent: 10, maxAbsDiff: 5 },
    calcium: { maxRpdPercent: 20, maxAbsDiff: 2 },
  },
  blank: { scUsPerCm: 5, alkalinityMgLCaCO3: 5, caMgL: 1 },
};

export interface MethodProfile {
  id: string;
  version: number;
  name: string;
  notes?: string;
  stabilization: {
    /** number of sequential readings that must agree */
    readings: number;
    tolerance: Record<StabilizedParameter, Tolerance>;
  };
  phCalibration: {
    slopeMinPercent: number;
    slopeMaxPercent: number;
    offsetMaxMv: number;
    /** a third (check) buffer must read within this many pH units */
    checkBufferTolerance: number;
  };
  /** SC check standard: ±relAtOrBelow at ≤ switchAtUsPerCm, ±relAbove above */
  scCalibration: { relAtOrBelow: number; relAbove: number; switchAtUsPerCm: number };
  doCalibration: { absMgL: number };
  titration: {
    /** points past the endpoint the Gran fit needs */
    minGranPoints: number;
    minGranR2: number;
    /** Gran vs inflection agreement, relative */
    agreementRel: number;
    /** and absolute, meq/L, for low alkalinity */
    agreementAbsMeqL: number;
  };
  balance: BalanceLimits;
  scRatio: { min: number; max: number };
  tdsMeasuredToCalculated: { min: number; max: number };
  tdsToSc: { min: number; max: number };
  /** a sample must lie within this many hours of a passing check of each meter */
  calibrationWindowHours: number;
  /** replicate and blank acceptance; profiles stored before it existed use {@link DEFAULT_QC_LIMITS} */
  qc?: QcLimits;
  ranges: {
    tempC: [number, number];
    pH: [number, number];
    doMgL: [number, number];
    doPercent: [number, number];
    calciteSi: [number, number];
    logPco2: [number, number];
  };
}

export const DEFAULT_PROFILE: MethodProfile = {
  id: 'bankside-default',
  version: 1,
  name: 'Bankside default (from published field practice)',
  notes:
    'Stabilization and calibration limits after the USGS National Field Manual (A6.x, memory), Standard Methods 1030 E (memory), ' +
    'EPA 120.1; ranges are common practice. Edit a copy to match your quality plan.',
  stabilization: {
    readings: 5,
    tolerance: {
      temperature: { abs: 0.2 },
      pH: { abs: 0.1 },
      sc: { abs: 5, rel: 0.03, switchAt: 100 },
      do: { abs: 0.2 },
      turbidity: { abs: 0.5, rel: 0.05, switchAt: 10 },
    },
  },
  phCalibration: { slopeMinPercent: 95, slopeMaxPercent: 102, offsetMaxMv: 30, checkBufferTolerance: 0.1 },
  scCalibration: { relAtOrBelow: 0.05, relAbove: 0.03, switchAtUsPerCm: 100 },
  doCalibration: { absMgL: 0.2 },
  titration: { minGranPoints: 3, minGranR2: 0.995, agreementRel: 0.05, agreementAbsMeqL: 0.05 },
  balance: SM1030E_LIMITS,
  scRatio: { min: 0.9, max: 1.1 },
  tdsMeasuredToCalculated: { min: 1.0, max: 1.2 },
  tdsToSc: { min: 0.55, max: 0.7 },
  calibrationWindowHours: 24,
  qc: DEFAULT_QC_LIMITS,
  ranges: {
    tempC: [-0.5, 40],
    pH: [5, 9.5],
    doMgL: [0, 20],
    doPercent: [20, 130],
    calciteSi: [-3, 2],
    logPco2: [-3.5, -1.5],
  },
};

/** Tolerance at a given value: absolute below `switchAt`, relative above (or whichever is given). */
export function toleranceAt(t: Tolerance, value: number): number {
  if (t.switchAt !== undefined && t.abs !== undefined && t.rel !== undefined) {
    return Math.abs(value) <= t.switchAt ? t.abs : t.rel * Math.abs(value);
  }
  if (t.abs !== undefined) return t.abs;
  if (t.rel !== undefined) return t.rel * Math.abs(value);
  return 0;
}

/** Reference to the profile a check used, stored with every result. */
export interface ProfileRef {
  profileId: string;
  profileVersion: number;
}

export function profileRef(p: MethodProfile): ProfileRef {
  return { profileId: p.id, profileVersion: p.version };
}

/**
 * Plain checks on a user profile (the engine has no schema library): returns the problems in
 * words, empty when the profile is usable.
 */
export function profileProblems(p: MethodProfile): string[] {
  const out: string[] = [];
  if (!p.id || typeof p.id !== 'string') out.push('The profile needs an id.');
  if (!Number.isInteger(p.version) || p.version < 1) out.push('The profile version must be a whole number ≥ 1.');
  if (!Number.isInteger(p.stabilization.readings) || p.stabilization.readings < 3) out.push('Stabilization needs at least 3 readings.');
  const pc = p.phCalibration;
  if (!(pc.slopeMinPercent > 50 && pc.slopeMinPercent < pc.slopeMaxPercent && pc.slopeMaxPercent < 120)) {
    out.push('pH slope limits must satisfy 50 < min < max < 120 %.');
  }
  if (!(pc.offsetMaxMv > 0)) out.push('pH offset limit must be positive.');
  if (!(p.doCalibration.absMgL > 0)) out.push('DO calibration tolerance must be positive.');
  if (!(p.scRatio.min < 1 && p.scRatio.max > 1)) out.push('SC ratio limits must bracket 1.');
  if (!(p.calibrationWindowHours > 0)) out.push('The calibration window must be positive.');
  for (const [k, t] of Object.entries(p.stabilization.tolerance)) {
    if ((t.abs ?? 0) < 0 || (t.rel ?? 0) < 0 || (t.abs === undefined && t.rel === undefined)) {
      out.push(`Stabilization tolerance for ${k} must be given and ≥ 0.`);
    }
  }
  return out;
}
