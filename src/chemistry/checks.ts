import type { Analysis, SampleInput } from './analyze';
import { present } from './errors';
import { oxygenPercentSaturation } from './oxygen';
import { DEFAULT_PROFILE, profileRef, type MethodProfile, type ProfileRef } from './profiles';
import { MOLAR_MASS, SPECIES } from './species';

export type DataCheckStatus = 'pass' | 'fail' | 'not-applicable';

export interface DataCheck {
  id:
    | 'charge-balance'
    | 'sc-calculated'
    | 'ion-sum-sc'
    | 'tds-calculated'
    | 'tds-sc'
    | 'range-temperature'
    | 'range-ph'
    | 'range-do'
    | 'range-do-percent'
    | 'range-calcite-si'
    | 'range-pco2';
  label: string;
  status: DataCheckStatus;
  value?: number;
  /** acceptance in words */
  limit: string;
  source: string;
  /** what to do when it fails */
  advice?: string;
  profile: ProfileRef;
}

export interface DataCheckExtras {
  doMgL?: number | null;
  pressureKPa?: number | null;
}

/**
 * Calculated TDS (mg/L), Standard Methods 1030 E (memory): 0.6 × alkalinity (as CaCO₃) + Na + K
 * + Ca + Mg + Cl + SO₄ + SiO₂ + NO₃ (as NO₃) + F. Needs the six major ions and alkalinity.
 */
export function calculatedTdsMgL(input: SampleInput): number | undefined {
  const need = [input.alkalinityMgLCaCO3, input.caMgL, input.mgMgL, input.naMgL, input.clMgL, input.so4MgL];
  if (need.some((v) => v === undefined || v === null)) return undefined;
  const no3 = ((input.no3NMgL ?? 0) * (SPECIES.NO3.molarMass)) / MOLAR_MASS.N;
  return (
    0.6 * input.alkalinityMgLCaCO3! + input.naMgL! + (input.kMgL ?? 0) + input.caMgL! + input.mgMgL! + input.clMgL! +
    input.so4MgL! + (input.sio2MgL ?? 0) + no3 + (input.fMgL ?? 0)
  );
}

/**
 * The office's and the crew's data checks on one sample: Standard Methods 1030 E (anion–cation
 * balance; calculated/measured SC 0.9–1.1; 100 × ion sum vs SC; measured/calculated TDS 1.0–1.2;
 * TDS/SC 0.55–0.70; all memory, in the profile) and the range checks of the profile (common
 * practice). Every result names its source and the profile it used.
 */
export function dataChecks(
  input: SampleInput,
  analysis: Analysis,
  profile: MethodProfile = DEFAULT_PROFILE,
  extras: DataCheckExtras = {},
): DataCheck[] {
  const ref = profileRef(profile);
  const SM = 'Standard Methods 1030 E';
  const out: DataCheck[] = [];
  const ratioCheck = (
    id: DataCheck['id'], label: string, value: number | undefined, lim: { min: number; max: number }, source: string, advice: string,
  ) => {
    out.push({
      id, label, value,
      status: value === undefined ? 'not-applicable' : value >= lim.min && value <= lim.max ? 'pass' : 'fail',
      limit: `${lim.min}–${lim.max}`, source, advice, profile: ref,
    });
  };

  const cb = analysis.chargeBalance;
  out.push({
    id: 'charge-balance',
    label: 'Anion–cation balance (%)',
    status: cb ? (cb.acceptable ? 'pass' : 'fail') : 'not-applicable',
    value: cb?.percent,
    limit: cb?.criterion ?? 'needs Ca, Mg, Na, Cl, SO4 and alkalinity',
    source: SM,
    advice: 'Check each ion’s units and value; an ion may be missing from the analysis.',
    profile: ref,
  });

  const sc = input.scUsPerCm ?? undefined;
  ratioCheck(
    'sc-calculated', 'Calculated / measured SC',
    analysis.calculatedScUsPerCm !== undefined && sc ? analysis.calculatedScUsPerCm / sc : undefined,
    profile.scRatio, `${SM}; Standard Methods 2510`, 'Recheck the SC calibration and the ion results.',
  );
  ratioCheck(
    'ion-sum-sc', '100 × cation sum (meq/L) / SC',
    cb && sc ? (100 * cb.cationsMeqL) / sc : undefined,
    profile.scRatio, SM, 'The ions and SC disagree: look for a unit slip.',
  );
  const tdsCalc = calculatedTdsMgL(input);
  const tds = input.tdsMgL ?? undefined;
  ratioCheck(
    'tds-calculated', 'Measured / calculated TDS',
    tds !== undefined && tdsCalc ? tds / tdsCalc : undefined,
    profile.tdsMeasuredToCalculated, SM, 'Recheck the TDS result or look for a missing constituent.',
  );
  ratioCheck('tds-sc', 'TDS / SC', tds !== undefined && sc ? tds / sc : undefined, profile.tdsToSc, SM, 'Recheck TDS and SC.');

  const range = (id: DataCheck['id'], label: string, v: number | undefined, [lo, hi]: [number, number], advice: string) => {
    out.push({
      id, label, value: v,
      status: v === undefined ? 'not-applicable' : v >= lo && v <= hi ? 'pass' : 'fail',
      limit: `${lo} to ${hi}`, source: 'common practice (profile ranges)', advice, profile: ref,
    });
  };
  const r = profile.ranges;
  range('range-temperature', 'Water temperature (°C)', input.tempC, r.tempC, 'Check the sensor is in the water, not in air or sun.');
  range('range-ph', 'pH', input.pH ?? undefined, r.pH, 'Check against a buffer and re-measure.');
  const doMgL = extras.doMgL ?? undefined;
  range('range-do', 'Dissolved oxygen (mg/L)', doMgL, r.doMgL, 'Check the DO sensor calibration.');
  // the engine's own saturation (salinity from SC, pressure) when it had the DO reading
  let doPct: number | undefined = analysis.oxygen?.percentSaturation;
  if (doPct === undefined && present('doMgL', doMgL) && input.tempC >= 0 && input.tempC <= 40) {
    doPct = oxygenPercentSaturation(doMgL, input.tempC, extras.pressureKPa ?? undefined, Math.min(input.salinity ?? 0, 40));
  }
  range('range-do-percent', 'DO saturation (%)', doPct, r.doPercent, 'Very high or low saturation: check calibration, bubbles or a fouled membrane.');
  range('range-calcite-si', 'Calcite SI', analysis.saturationIndex.calcite, r.calciteSi, 'Check pH, alkalinity and calcium units.');
  range('range-pco2', 'log pCO₂ (atm)', analysis.logPco2, r.logPco2, 'Below the atmosphere: photosynthesis or a high pH reading; above −1.5: check pH and alkalinity.');
  return out;
}
