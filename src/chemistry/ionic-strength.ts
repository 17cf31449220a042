import { InputError, present, requireNonNegative, requireRange } from './errors';

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
 * Relative standard uncertainty of the SC-based estimate (fraction). From the same real data:
 * the central 90 % of ratios fell within −19 % to +11 % of the median (test/chemistry/real-data.test.ts),
 * so ±15 % is used as the half-width of the estimate in Ca–Mg–HCO₃ waters.
 */
export const CONDUCTANCE_ESTIMATE_REL_UNCERTAINTY = 0.15;

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
