import { InputError, present, requireRange, type ChemWarning } from './errors';
import { oxygenSaturationMgL, STANDARD_PRESSURE_KPA } from './oxygen';
import { DEFAULT_PROFILE, profileRef, type MethodProfile, type ProfileRef } from './profiles';
import { kelvin } from './water';

/**
 * Nernst slope of an ideal pH electrode, mV per pH unit: 1000 · ln10 · R T / F, with
 * R = 8.314462618 J/(mol·K), F = 96485.33212 C/mol (CODATA 2018). 59.16 mV at 25 °C.
 */
export function nernstSlopeMvPerPh(tempC: number): number {
  if (!present('tempC', tempC)) throw new InputError('tempC', 'tempC is required.');
  requireRange('tempC', tempC, -2, 100, '°C');
  return (1000 * Math.LN10 * 8.314462618 * kelvin(tempC)) / 96485.33212;
}

export interface PhBufferReading {
  /** the buffer's pH at its temperature (from the bottle's table) */
  bufferPH: number;
  /** electrode potential read in the buffer, mV */
  mV: number;
  tempC: number;
}

export type CheckStatus = 'pass' | 'fail' | 'incomplete';

export interface PhCalibrationResult {
  status: CheckStatus;
  pass: boolean;
  buffers: number;
  /** electrode slope as % of the Nernst slope at the buffers' mean temperature */
  slopePercent?: number;
  slopeMvPerPh?: number;
  /** electrode potential at pH 7, mV, with its sign */
  offsetMv?: number;
  /** each buffer read back through the fitted line */
  readBack: Array<{ bufferPH: number; readPH: number; errorPH: number }>;
  warnings: ChemWarning[];
  profile: ProfileRef;
}

/**
 * pH meter calibration from two or more buffers (USGS NFM A6.4; ASTM D1293). The first two
 * buffers give the line mV = E₇ + s (pH − 7): the slope s (as % of Nernst at the buffers' mean
 * temperature) and the offset E₇; further buffers are checks read back through that line. Pass: slope within the profile's limits (default 95–102 %, memory) and
 * |E₇| ≤ 30 mV (memory), and every buffer reading back within ±0.1 pH (a third buffer as check).
 * One buffer gives an offset only, with a warning, never a made-up slope.
 */
export function phCalibration(
  readings: PhBufferReading[],
  profile: MethodProfile = DEFAULT_PROFILE,
  options: { samplePH?: number } = {},
): PhCalibrationResult {
  if (!Array.isArray(readings) || readings.length === 0) throw new InputError('readings', 'Enter at least one buffer reading.');
  readings.forEach((r, i) => {
    if (!present(`readings[${i}].bufferPH`, r.bufferPH)) throw new InputError(`readings[${i}].bufferPH`, 'Buffer pH is required.');
    requireRange(`readings[${i}].bufferPH`, r.bufferPH, 0, 14, '');
    if (!present(`readings[${i}].mV`, r.mV)) throw new InputError(`readings[${i}].mV`, 'mV is required.');
    requireRange(`readings[${i}].mV`, r.mV, -1000, 1000, 'mV');
    if (!present(`readings[${i}].tempC`, r.tempC)) throw new InputError(`readings[${i}].tempC`, 'Buffer temperature is required.');
    requireRange(`readings[${i}].tempC`, r.tempC, -2, 60, '°C');
  });
  const warnings: ChemWarning[] = [];
  const pc = profile.phCalibration;
  const ref = profileRef(profile);
  const meanT = readings.reduce((s, r) => s + r.tempC, 0) / readings.length;
  const nernst = nernstSlopeMvPerPh(meanT);
  const distinct = new Set(readings.map((r) => r.bufferPH)).size;

  if (distinct < 2) {
    const r = readings[0]!;
    // offset only, assuming the Nernst slope
    const offsetMv = r.mV + nernst * (r.bufferPH - 7);
    warnings.push({
      code: 'single-buffer',
      message: 'Only one buffer: the slope cannot be checked. Calibrate with two buffers that bracket the samples, and a third as a check.',
      field: 'readings',
    });
    return { status: 'incomplete', pass: false, buffers: readings.length, offsetMv, readBack: [], warnings, profile: ref };
  }

  // The first two buffers calibrate (a two-point line); any further buffers are check buffers,
  // read back through that line (field-practice.md §2: two bracketing buffers, a third as check).
  const [b1, b2] = readings.length >= 2 && readings[0]!.bufferPH !== readings[1]!.bufferPH
    ? [readings[0]!, readings[1]!]
    : [readings[0]!, readings.find((r) => r.bufferPH !== readings[0]!.bufferPH)!];
  const n = readings.length;
  const slope = (b2.mV - b1.mV) / (b2.bufferPH - b1.bufferPH); // mV per pH, negative for a working electrode
  const offsetMv = b1.mV - slope * (b1.bufferPH - 7);
  const slopePercent = (-slope / nernst) * 100;
  const readBack = readings.map((r) => {
    const readPH = 7 + (r.mV - offsetMv) / slope;
    return { bufferPH: r.bufferPH, readPH, errorPH: readPH - r.bufferPH };
  });

  const spreadT = Math.max(...readings.map((r) => r.tempC)) - Math.min(...readings.map((r) => r.tempC));
  if (spreadT > 2) {
    warnings.push({ code: 'buffer-temperatures', message: `The buffers differ by ${spreadT.toFixed(1)} °C: let them reach the same temperature as the sample.`, field: 'readings' });
  }
  const slopeOk = slopePercent >= pc.slopeMinPercent && slopePercent <= pc.slopeMaxPercent;
  const offsetOk = Math.abs(offsetMv) <= pc.offsetMaxMv;
  const readBackOk = readBack.every((b) => Math.abs(b.errorPH) <= pc.checkBufferTolerance);
  if (!slopeOk) {
    warnings.push({
      code: 'ph-slope',
      message: `Slope ${slopePercent.toFixed(1)} % of Nernst is outside ${pc.slopeMinPercent}–${pc.slopeMaxPercent} %: clean or replace the electrode, use fresh buffers, and recalibrate.`,
    });
  }
  if (!offsetOk) {
    warnings.push({ code: 'ph-offset', message: `Offset ${offsetMv.toFixed(1)} mV at pH 7 exceeds ±${pc.offsetMaxMv} mV: check the reference junction and fill solution.` });
  }
  if (!readBackOk) {
    const worst = readBack.reduce((a, b) => (Math.abs(b.errorPH) > Math.abs(a.errorPH) ? b : a));
    warnings.push({
      code: 'ph-check-buffer',
      message: `Buffer ${worst.bufferPH} reads back as ${worst.readPH.toFixed(2)} (off by more than ${pc.checkBufferTolerance}): the electrode is not linear; recalibrate.`,
    });
  }
  if (options.samplePH !== undefined) {
    const lo = Math.min(...readings.map((r) => r.bufferPH)), hi = Math.max(...readings.map((r) => r.bufferPH));
    if (options.samplePH < lo || options.samplePH > hi) {
      warnings.push({ code: 'ph-not-bracketed', message: `The sample pH ${options.samplePH} lies outside the buffers (${lo}–${hi}): calibrate with buffers that bracket it.` });
    }
  }
  if (n === 2) {
    warnings.push({ code: 'no-check-buffer', message: 'Two buffers: add a third buffer as a check (within ±0.1 pH).', field: 'readings' });
  }
  const pass = slopeOk && offsetOk && readBackOk;
  return { status: pass ? 'pass' : 'fail', pass, buffers: n, slopePercent, slopeMvPerPh: slope, offsetMv, readBack, warnings, profile: ref };
}

export interface ScStandardCheck {
  deviationPercent: number;
  limitPercent: number;
  pass: boolean;
  profile: ProfileRef;
}

/**
 * Conductivity check standard: % deviation of the meter's SC (at 25 °C) from the standard's value
 * at 25 °C. Limits from the profile: ±5 % at ≤ 100 µS/cm, ±3 % above (NFM A6.3; memory).
 * Example standard: 0.01 mol/L KCl = 1413 µS/cm at 25 °C (EPA 120.1 / ASTM D1125; memory).
 */
export function conductivityStandardCheck(
  standardUsPerCm: number,
  readingUsPerCm: number,
  profile: MethodProfile = DEFAULT_PROFILE,
): ScStandardCheck {
  if (!present('standardUsPerCm', standardUsPerCm)) throw new InputError('standardUsPerCm', 'Enter the standard’s value.');
  requireRange('standardUsPerCm', standardUsPerCm, 0.1, 500000, 'µS/cm');
  if (!present('readingUsPerCm', readingUsPerCm)) throw new InputError('readingUsPerCm', 'Enter the meter reading.');
  requireRange('readingUsPerCm', readingUsPerCm, 0, 500000, 'µS/cm');
  const sc = profile.scCalibration;
  const limit = (standardUsPerCm <= sc.switchAtUsPerCm ? sc.relAtOrBelow : sc.relAbove) * 100;
  const deviationPercent = (100 * (readingUsPerCm - standardUsPerCm)) / standardUsPerCm;
  return { deviationPercent, limitPercent: limit, pass: Math.abs(deviationPercent) <= limit + 1e-9, profile: profileRef(profile) };
}

export interface DoAirCheck {
  theoreticalMgL: number;
  differenceMgL: number;
  readingPercent: number;
  pass: boolean;
  profile: ProfileRef;
}

/**
 * DO air (or air-saturated water) calibration check: the reading against the theoretical
 * saturation at the true barometric pressure, temperature and salinity (Benson & Krause; USGS OWQ
 * memo 2011.03), within ±0.2 mg/L by default (NFM A6.2; memory).
 */
export function doAirCalibrationCheck(
  readingMgL: number,
  tempC: number,
  pressureKPa = STANDARD_PRESSURE_KPA,
  salinity = 0,
  profile: MethodProfile = DEFAULT_PROFILE,
): DoAirCheck {
  if (!present('readingMgL', readingMgL)) throw new InputError('readingMgL', 'Enter the DO reading.');
  requireRange('readingMgL', readingMgL, 0, 30, 'mg/L');
  const theoreticalMgL = oxygenSaturationMgL(tempC, pressureKPa, salinity);
  const differenceMgL = readingMgL - theoreticalMgL;
  return {
    theoreticalMgL,
    differenceMgL,
    readingPercent: (100 * readingMgL) / theoreticalMgL,
    pass: Math.abs(differenceMgL) <= profile.doCalibration.absMgL + 1e-9,
    profile: profileRef(profile),
  };
}

export interface CheckEvent {
  /** ms since epoch */
  timeMs: number;
  pass: boolean;
}

export type Coverage = 'bracketed' | 'before-only' | 'after-only' | 'none';

/**
 * Whether a sample is covered by passing checks of its meter: "all field data must be bracketed
 * by passing calibration or verification" (NFM A6; field-practice.md §2). A passing check within
 * the profile's window before and after the sample → 'bracketed'; one side only → 'before-only' or
 * 'after-only'; neither → 'none' (the sample is flagged).
 */
export function calibrationCoverage(sampleTimeMs: number, events: CheckEvent[], profile: MethodProfile = DEFAULT_PROFILE): Coverage {
  if (!present('sampleTimeMs', sampleTimeMs)) throw new InputError('sampleTimeMs', 'The sample time is required.');
  const win = profile.calibrationWindowHours * 3600_000;
  const passing = events.filter((e) => e.pass && Number.isFinite(e.timeMs));
  const before = passing.some((e) => e.timeMs <= sampleTimeMs && sampleTimeMs - e.timeMs <= win);
  const after = passing.some((e) => e.timeMs > sampleTimeMs && e.timeMs - sampleTimeMs <= win);
  return before && after ? 'bracketed' : before ? 'before-only' : after ? 'after-only' : 'none';
}
