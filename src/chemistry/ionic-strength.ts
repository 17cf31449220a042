import { InputError, present, requireNonNegative, requireRange } from './errors';
import { C35_15_0_US_PER_CM, practicalSalinity } from './salinity';

/**
 * Ionic strength estimators for when the full composition is not known.
 * All return mol/L (≈ mol/kg in fresh water).
 */

/**
 * Default factor for I from specific conductance, (mol/L)/(µS/cm).
 * Published factors: 1.6×10⁻⁵ (Russell 1976, quoted in Standard Methods 2330; Ponnamperuma et al.
 * 1966 — both from memory) and 1.27×10⁻⁵ (Griffin & Jurinak 1973, Soil Sci. 116:26, from memory).
 * Our default, 1.5×10⁻⁵, lies between them and was chosen against 762 real analyses (USGS INL
 * major-ion data with SC, pH and ANC): the ratio of I computed from the full analysis (with ion
 * pairs) to SC had median 1.49×10⁻⁵, quartiles 1.44–1.53×10⁻⁵ and 5–95 % range 1.21–1.66×10⁻⁵
 * (test/chemistry/real-data.test.ts; DEVELOPERS.md). Na–Cl waters run lower (Kwale data: median 1.19×10⁻⁵).
 */
export const DEFAULT_CONDUCTANCE_FACTOR = 1.5e-5;

/**
 * Relative standard uncertainty (1σ) of the SC-based estimate with the generic factor. From the
 * same real data: the central 95 % of I/SC ratios lie within −21 % to +24 % of the median
 * (test/chemistry/real-data.test.ts), so 11 % is taken as the standard uncertainty (2σ covers the
 * central 95 %; the ratio's tails are heavier than normal, its central 68 % spans only ±5.5 %).
 */
export const CONDUCTANCE_ESTIMATE_REL_UNCERTAINTY = 0.11;

/** Relative standard uncertainty of I from practical salinity for water in seawater proportions (DOE 1994 relation; our estimate for estuarine mixing). */
export const SALINITY_ESTIMATE_REL_UNCERTAINTY = 0.03;

/** I = f × SC. scUsPerCm is specific conductance at 25 °C, µS/cm. Valid for fresh water to about 5,000 µS/cm. */
export function ionicStrengthFromConductance(scUsPerCm: number, factor = DEFAULT_CONDUCTANCE_FACTOR): number {
  if (!present('scUsPerCm', scUsPerCm)) throw new InputError('scUsPerCm', 'scUsPerCm is required.');
  requireNonNegative('scUsPerCm', scUsPerCm);
  if (!present('conductanceFactor', factor) || factor <= 0 || factor > 1e-4) {
    throw new InputError('conductanceFactor', `conductanceFactor must be between 0 and 1e-4 (mol/L per µS/cm); got ${factor}.`);
  }
  return factor * scUsPerCm;
}

/**
 * I ≈ 2.5×10⁻⁵ × TDS (mg/L). Langelier (1936) J. AWWA 28:1500 (from memory). Fresh water,
 * TDS to about 5,000 mg/L; ±30 % or so (common practice).
 */
export function ionicStrengthFromTds(tdsMgL: number): number {
  if (!present('tdsMgL', tdsMgL)) throw new InputError('tdsMgL', 'tdsMgL is required.');
  requireNonNegative('tdsMgL', tdsMgL);
  return 2.5e-5 * tdsMgL;
}

/**
 * Ionic strength of seawater-like water from practical salinity S:
 * I = 19.924 S / (1000 − 1.005 S) mol/kg. DOE (1994) handbook / Dickson et al. (2007) Guide to
 * best practices for ocean CO₂ measurements (from memory); I(35) = 0.7227. Valid for water whose
 * ions are in seawater proportions (estuaries, brackish wells near the coast), S 2–42.
 */
export function ionicStrengthFromSalinity(salinity: number): number {
  if (!present('salinity', salinity)) throw new InputError('salinity', 'salinity is required.');
  requireRange('salinity', salinity, 0, 45, '');
  return (19.924 * salinity) / (1000 - 1.005 * salinity);
}

/** I = ½ Σ cᵢ zᵢ², the definition, from (concentration mol/L, charge) pairs without ion pairing. */
export function ionicStrengthFromIons(ions: Array<{ molL: number; charge: number }>): number {
  let s = 0;
  for (const { molL, charge } of ions) {
    requireNonNegative('concentration', molL);
    s += molL * charge * charge;
  }
  return 0.5 * s;
}

/**
 * SC range (µS/cm at 25 °C) over which the fresh-water factor hands over to the seawater
 * relation, blended by a smoothstep in log SC: fresh below 3,000, seawater proportions above
 * 30,000 (our choice: about practical salinity 1.6 to 19, where estuarine and coastal water
 * dominate the brackish samples).
 */
export const BRACKISH_BLEND_US_PER_CM = { from: 3000, to: 30000 } as const;

/** Practical salinity 42, the top of PSS-78, as specific conductance at 25 °C (µS/cm). */
export const PSS78_MAX_SC_US_PER_CM = (() => {
  let lo = 0, hi = 5;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (practicalSalinity(mid, 25) < 42) lo = mid; else hi = mid;
  }
  return lo * C35_15_0_US_PER_CM;
})();

/** Weight of the seawater relation in the SC-based estimate (0 fresh, 1 seawater proportions). */
export function seawaterWeight(scUsPerCm: number): number {
  const { from, to } = BRACKISH_BLEND_US_PER_CM;
  if (scUsPerCm <= from) return 0;
  if (scUsPerCm >= to) return 1;
  const x = Math.log(scUsPerCm / from) / Math.log(to / from);
  return x * x * (3 - 2 * x);
}

/** Practical salinity from SC at 25 °C; beyond PSS-78's top (S 42) extended in proportion to SC. */
export function salinityFromScExtended(scUsPerCm: number): number {
  if (scUsPerCm <= 0) return 0;
  if (scUsPerCm <= PSS78_MAX_SC_US_PER_CM) return Math.max(0, practicalSalinity(scUsPerCm / C35_15_0_US_PER_CM, 25));
  return 42 * (scUsPerCm / PSS78_MAX_SC_US_PER_CM);
}

export interface ScIonicStrength {
  /** mol/L */
  value: number;
  /** relative standard uncertainty (fraction) */
  relUncertainty: number;
  /** weight of the seawater relation, 0–1 */
  seawaterWeight: number;
  /** practical salinity from SC (PSS-78 at 25 °C, extended beyond S 42) */
  salinity: number;
  /** true when SC is beyond the PSS-78 range and the value is extrapolated */
  beyondPss78: boolean;
}

/**
 * One continuous ionic-strength estimate from specific conductance, fresh water to seawater:
 *   I = (1 − w) f SC + w I_sw(S(SC)),
 * f the fresh-water factor ({@link DEFAULT_CONDUCTANCE_FACTOR} or a site's own), I_sw the
 * seawater-proportion relation ({@link ionicStrengthFromSalinity}) of the PSS-78 salinity at
 * 25 °C, w = {@link seawaterWeight}. Relative standard uncertainty: the blend of the two
 * estimates' own, plus the half-difference of the two estimates weighted by 2w(1 − w) (the
 * doubt about which relation the water follows). With `siteFactor` the site's own factor is
 * used at every SC (its analyses are the best evidence for that water). Beyond S = 42 the
 * seawater relation is extended in proportion to SC (flagged `beyondPss78`, uncertainty ≥ 20 %).
 */
export function ionicStrengthFromSpecificConductance(
  scUsPerCm: number,
  factor = DEFAULT_CONDUCTANCE_FACTOR,
  factorRel = CONDUCTANCE_ESTIMATE_REL_UNCERTAINTY,
  siteFactor = false,
): ScIonicStrength {
  const fresh = ionicStrengthFromConductance(scUsPerCm, factor);
  const salinity = salinityFromScExtended(scUsPerCm);
  const beyondPss78 = scUsPerCm > PSS78_MAX_SC_US_PER_CM;
  if (siteFactor) return { value: fresh, relUncertainty: factorRel, seawaterWeight: 0, salinity, beyondPss78 };
  const w = seawaterWeight(scUsPerCm);
  if (w === 0) return { value: fresh, relUncertainty: factorRel, seawaterWeight: 0, salinity, beyondPss78 };
  const s = Math.min(salinity, 42);
  let sw = (19.924 * s) / (1000 - 1.005 * s);
  if (beyondPss78) sw *= scUsPerCm / PSS78_MAX_SC_US_PER_CM;
  const value = (1 - w) * fresh + w * sw;
  const between = fresh > 0 && sw > 0 ? Math.abs(Math.log(fresh / sw)) / 2 : 0;
  let rel = (1 - w) * factorRel + w * SALINITY_ESTIMATE_REL_UNCERTAINTY + 2 * w * (1 - w) * between;
  // beyond S = 42 the brine's proportions are unknown: at least 20 % (our choice)
  if (beyondPss78) rel = Math.max(rel, 0.2);
  return { value, relUncertainty: rel, seawaterWeight: w, salinity, beyondPss78 };
}
