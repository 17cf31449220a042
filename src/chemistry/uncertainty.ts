import { InputError } from './errors';

/**
 * Uncertainty of the calcite saturation index: the standard uncertainties (1σ) of every input
 * and constant, the evidence a sample carries about its own, and the budget that says which
 * source dominates and what would narrow it.
 *
 * Method: GUM (JCGM 100:2008): each input is moved by its standard uncertainty, the SI change is
 * that source's standard-uncertainty contribution (§5.1.3, by finite differences), contributions
 * add in quadrature (§5.1.2), and the band shown is the expanded uncertainty U = k·u_c with
 * k = 2 (≈ 95 % for a near-normal result, §6.3). A tolerance ±a accepted by the method profile
 * with no better knowledge is a rectangular distribution, u = a/√3 (§4.3.7); a resolution step
 * δ gives u = δ/√12 (§F.2.2.1).
 */

/** Coverage factor of the band shown: U = 2 u_c, about 95 % (GUM §6.3). */
export const COVERAGE_FACTOR = 2;

/**
 * Standard uncertainties (1σ): absolute for pH (pH units) and temperature (°C), relative
 * (fraction of the value) otherwise.
 */
export interface Uncertainties {
  pH: number;
  tempC: number;
  /** relative standard uncertainty of SC */
  scRel: number;
  alkalinityRel: number;
  caRel: number;
  /** relative standard uncertainty of the SC → I estimate itself (the conductance factor) */
  conductanceFactorRel: number;
}

const RECT = 1 / Math.sqrt(3);

/**
 * Defaults, standard uncertainties of common field meters and kits:
 * - pH 0.1/√3 = 0.058: the profile's check-buffer and stabilization tolerance ±0.1 (USGS NFM
 *   A6.4; from memory) as a rectangular limit. Meter specifications run ±0.05–0.2 (common practice).
 * - temperature 0.2/√3 = 0.12 °C: the profile's ±0.2 °C (NFM A6.1; from memory).
 * - SC 0.03/√3 = 1.7 %: the profile's ±3 % (NFM A6.3; from memory); below 100 µS/cm the
 *   profile's ±5 µS/cm applies instead ({@link SC_ABS_U_US_PER_CM}).
 * - alkalinity 3 %: a field titration to an inflection or Gran endpoint, replicates within
 *   about 5 % (NFM 6.6; from memory).
 * - calcium 5 %: an EDTA titration kit in the field (common practice; laboratory methods do
 *   better, kits with a coarse step worse: a kit's step is added, see {@link uncertaintiesFromEvidence}).
 * - conductance factor 11 %: I/SC of 761 USGS INL full analyses (test/chemistry/real-data.test.ts)
 *   spans −21 % to +24 % of its median over its central 95 %: ±2 × 11 % covers it. The central 68 %
 *   is narrower (±5.5 %): the ratio has heavy tails, so 11 % is chosen for the 95 % band.
 */
export const DEFAULT_UNCERTAINTIES: Uncertainties = {
  pH: 0.1 * RECT,
  tempC: 0.2 * RECT,
  scRel: 0.03 * RECT,
  alkalinityRel: 0.03,
  caRel: 0.05,
  conductanceFactorRel: 0.11,
};

/** Absolute standard uncertainty of SC at low conductance, µS/cm: the profile's ±5 µS/cm at ≤ 100 µS/cm, as rectangular (NFM A6.3; from memory). */
export const SC_ABS_U_US_PER_CM = 5 * RECT;

/**
 * Standard uncertainties of the constants (log10 units, 25 °C):
 * - calcite log Ksp −8.48 ± 0.02 (Plummer & Busenberg 1982, GCA 46:1011; from memory).
 * - log K₂ of carbonic acid (HCO₃⁻ = H⁺ + CO₃²⁻) −10.329: 0.01, the spread between Harned &
 *   Scholes (1941) and later determinations compiled by Plummer & Busenberg (1982) (from memory).
 * - ion pairs CaHCO₃⁺ 1.106 ± 0.07 and CaCO₃° 3.224 ± 0.14 (Plummer & Busenberg 1982; from
 *   memory), taken as standard uncertainties.
 */
export const LOG_K_UNCERTAINTY = { calcite: 0.02, carbonic2: 0.01, CaHCO3: 0.07, CaCO3aq: 0.14 } as const;

/** The sources a band is made of. */
export type UncertaintySource =
  | 'pH'
  | 'temperature'
  | 'alkalinity'
  | 'calcium'
  | 'sc'
  | 'ionic-strength'
  | 'log-k'
  | 'activity-model';

/** Where a source's standard uncertainty came from. */
export type UncertaintyBasis = 'default' | 'readings' | 'check' | 'kit-step' | 'site-factor' | 'given' | 'estimate';

export interface BudgetEntry {
  source: UncertaintySource;
  /** what it is, in words ("pH reading") */
  label: string;
  /** this source's standard-uncertainty contribution to calcite SI (1σ, log units) */
  u: number;
  /** share of the combined variance, 0–1 (the shares add up to 1) */
  share: number;
  basis: UncertaintyBasis;
  /** what would narrow it, in words; empty when nothing at the bank can */
  action: string;
}

/** Evidence a sample carries about its own uncertainty. Every field is optional. */
export interface SampleEvidence {
  /** the readings of the stabilization window, as reported (pH units, °C, µS/cm) */
  pHReadings?: readonly number[];
  tempReadings?: readonly number[];
  scReadings?: readonly number[];
  /** reading minus nominal value of the check buffer read after the last pH calibration (pH units) */
  pHCheckBufferError?: number;
  /** the kit's smallest step, in the unit of the value it applies to */
  caKitStepMgL?: number;
  alkalinityKitStepMgLCaCO3?: number;
}

/** The standard uncertainties a sample's evidence gives, with their basis. */
export interface EvidenceUncertainties {
  uncertainty: Partial<Uncertainties>;
  basis: Partial<Record<UncertaintySource, UncertaintyBasis>>;
}

/** Standard uncertainty of a pH check buffer's own value: ±0.02 (common practice for technical buffers), rectangular. */
const BUFFER_U = 0.02 * RECT;

function spreadOfMean(values: readonly number[] | undefined): number | undefined {
  if (!values || values.length < 2) return undefined;
  const n = values.length;
  const mean = values.reduce((s, v) => s + v, 0) / n;
  const s2 = values.reduce((s, v) => s + (v - mean) * (v - mean), 0) / (n - 1);
  return Math.sqrt(s2 / n);
}

function checkFinite(field: string, v: number | undefined): void {
  if (v !== undefined && (!Number.isFinite(v) || v < 0)) throw new InputError(field, `${field} must be a number ≥ 0.`);
}

/**
 * Standard uncertainties from a sample's own evidence (GUM type A for the readings, type B for
 * the rest); a source without evidence keeps its default.
 * - pH: u² = u_cal² + s²/n. u_cal from a check buffer read after calibration with error d:
 *   d as a rectangular limit plus the buffer's own ±0.02, u_cal = √(d²/3 + 0.02²/3); without a
 *   check, the default 0.058. s/√n: standard deviation of the n window readings over √n.
 * - temperature, SC: the default (the meter's tolerance) combined with s/√n of the readings.
 * - calcium, alkalinity: the default relative uncertainty combined with the kit's step δ/√12
 *   relative to the value (GUM §F.2.2.1).
 * @param values the reported values the relative figures refer to (mg/L, mg/L as CaCO₃, µS/cm)
 */
export function uncertaintiesFromEvidence(
  ev: SampleEvidence,
  values: { caMgL?: number | undefined; alkalinityMgLCaCO3?: number | undefined; scUsPerCm?: number | undefined } = {},
): EvidenceUncertainties {
  checkFinite('caKitStepMgL', ev.caKitStepMgL);
  checkFinite('alkalinityKitStepMgLCaCO3', ev.alkalinityKitStepMgLCaCO3);
  if (ev.pHCheckBufferError !== undefined && !Number.isFinite(ev.pHCheckBufferError)) {
    throw new InputError('pHCheckBufferError', 'pHCheckBufferError must be a finite number.');
  }
  const d = DEFAULT_UNCERTAINTIES;
  const uncertainty: Partial<Uncertainties> = {};
  const basis: EvidenceUncertainties['basis'] = {};

  const phRead = spreadOfMean(ev.pHReadings);
  const phCal = ev.pHCheckBufferError !== undefined ? Math.sqrt((ev.pHCheckBufferError ** 2) / 3 + BUFFER_U ** 2) : undefined;
  if (phRead !== undefined || phCal !== undefined) {
    uncertainty.pH = Math.hypot(phCal ?? d.pH, phRead ?? 0);
    basis.pH = phCal !== undefined ? 'check' : 'readings';
  }
  const tRead = spreadOfMean(ev.tempReadings);
  if (tRead !== undefined) {
    uncertainty.tempC = Math.hypot(d.tempC, tRead);
    basis.temperature = 'readings';
  }
  const scRead = spreadOfMean(ev.scReadings);
  if (scRead !== undefined && values.scUsPerCm !== undefined && values.scUsPerCm > 0) {
    uncertainty.scRel = Math.hypot(d.scRel, scRead / values.scUsPerCm);
    basis.sc = 'readings';
  }
  const step = (stepV: number | undefined, value: number | undefined, rel: number) =>
    stepV !== undefined && stepV > 0 && value !== undefined && value > 0 ? Math.hypot(rel, stepV / Math.sqrt(12) / value) : undefined;
  const ca = step(ev.caKitStepMgL, values.caMgL, d.caRel);
  if (ca !== undefined) {
    uncertainty.caRel = ca;
    basis.calcium = 'kit-step';
  }
  const alk = step(ev.alkalinityKitStepMgLCaCO3, values.alkalinityMgLCaCO3, d.alkalinityRel);
  if (alk !== undefined) {
    uncertainty.alkalinityRel = alk;
    basis.alkalinity = 'kit-step';
  }
  return { uncertainty, basis };
}

const LABELS: Record<UncertaintySource, string> = {
  pH: 'pH reading',
  temperature: 'temperature reading',
  alkalinity: 'alkalinity',
  calcium: 'calcium',
  sc: 'SC reading',
  'ionic-strength': 'ionic strength estimate',
  'log-k': 'published constants (log K)',
  'activity-model': 'activity model',
};

function actionFor(source: UncertaintySource, basis: UncertaintyBasis): string {
  switch (source) {
    case 'pH':
      return basis === 'check'
        ? 'a second stable pH reading narrows this'
        : 'a second stable pH reading or a fresh calibration with a check buffer narrows this';
    case 'temperature':
      return 'a thermometer checked against a reference narrows this';
    case 'alkalinity':
      return basis === 'kit-step' ? 'a titration with a finer step (digital titrator or Gran) narrows this' : 'a duplicate titration narrows this';
    case 'calcium':
      return basis === 'kit-step' ? 'a calcium kit with a finer step, or a lab calcium, narrows this' : 'a duplicate calcium titration or a lab calcium narrows this';
    case 'sc':
      return 'checking the SC meter against a standard narrows this';
    case 'ionic-strength':
      return basis === 'site-factor'
        ? 'more full analyses of this site narrow this'
        : 'the major ions (or three full analyses of this site, for its own conductance factor) narrow this';
    case 'log-k':
      return '';
    case 'activity-model':
      return '';
  }
}

/** Turn per-source contributions (1σ, SI units) into a budget sorted by share, largest first. */
export function makeBudget(contributions: ReadonlyArray<{ source: UncertaintySource; u: number; basis: UncertaintyBasis }>): BudgetEntry[] {
  const total = contributions.reduce((s, c) => s + c.u * c.u, 0);
  return contributions
    .filter((c) => c.u > 0)
    .map((c) => ({
      source: c.source,
      label: LABELS[c.source],
      u: c.u,
      share: total > 0 ? (c.u * c.u) / total : 0,
      basis: c.basis,
      action: actionFor(c.source, c.basis),
    }))
    .sort((a, b) => b.share - a.share);
}

/** A budget line in words: "pH reading: 70 %: a second stable pH reading … narrows this". */
export function budgetLine(e: BudgetEntry): string {
  const pct = e.share >= 0.995 ? 100 : e.share < 0.01 ? '< 1' : Math.round(e.share * 100);
  return `${e.label}: ${pct} %${e.action ? `: ${e.action}` : ''}`;
}
