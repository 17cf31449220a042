import { InputError, present, requireNonNegative, requireRange } from './errors';
import { kelvin } from './water';

export const STANDARD_PRESSURE_KPA = 101.325;

/**
 * Dissolved-oxygen solubility (mg/L) in water in equilibrium with water-saturated air.
 * Benson & Krause (1980, 1984) as given in USGS OWQ Technical Memorandum 2011.03 and Standard
 * Methods 4500-O (read):
 *   ln C* = −139.34411 + 1.575701×10⁵/T − 6.642308×10⁷/T² + 1.243800×10¹⁰/T³ − 8.621949×10¹¹/T⁴
 *   salinity: ln C*_S = ln C* − S (0.017674 − 10.754/T + 2140.7/T²)
 *   pressure (P atm): C*_P = C* P (1 − P_wv/P)(1 − θP) / ((1 − P_wv)(1 − θ)),
 *     ln P_wv = 11.8571 − 3840.70/T − 216961/T², θ = 0.000975 − 1.426×10⁻⁵ t + 6.436×10⁻⁸ t²
 * Units: tempC °C, pressureKPa true (station) barometric pressure in kPa, salinity practical.
 * Valid 0–40 °C, salinity 0–40, 0.5–1.1 atm (50.7–111.5 kPa); outside, InputError.
 */
export function oxygenSaturationMgL(tempC: number, pressureKPa = STANDARD_PRESSURE_KPA, salinity = 0): number {
  if (!present('tempC', tempC)) throw new InputError('tempC', 'tempC is required.');
  requireRange('tempC', tempC, 0, 40, '°C (Benson & Krause range)');
  if (!present('pressureKPa', pressureKPa)) throw new InputError('pressureKPa', 'pressureKPa must be a number.');
  requireRange('pressureKPa', pressureKPa, 50.7, 111.5, 'kPa (0.5–1.1 atm)');
  if (!present('salinity', salinity)) throw new InputError('salinity', 'salinity must be a number.');
  requireRange('salinity', salinity, 0, 40, '');
  const T = kelvin(tempC);
  let lnC = -139.34411 + 1.575701e5 / T - 6.642308e7 / T ** 2 + 1.2438e10 / T ** 3 - 8.621949e11 / T ** 4;
  lnC -= salinity * (0.017674 - 10.754 / T + 2140.7 / T ** 2);
  const c = Math.exp(lnC);
  const P = pressureKPa / STANDARD_PRESSURE_KPA;
  const pwv = Math.exp(11.8571 - 3840.7 / T - 216961 / T ** 2);
  const theta = 0.000975 - 1.426e-5 * tempC + 6.436e-8 * tempC ** 2;
  return (c * P * (1 - pwv / P) * (1 - theta * P)) / ((1 - pwv) * (1 - theta));
}

/** Percent saturation of a DO reading: 100 × DO / C*(t, P, S). Same sources and range. */
export function oxygenPercentSaturation(doMgL: number, tempC: number, pressureKPa = STANDARD_PRESSURE_KPA, salinity = 0): number {
  if (!present('doMgL', doMgL)) throw new InputError('doMgL', 'doMgL is required.');
  requireNonNegative('doMgL', doMgL);
  return (100 * doMgL) / oxygenSaturationMgL(tempC, pressureKPa, salinity);
}

/** DO in mg/L from a percent-saturation reading (the inverse). */
export function oxygenMgLFromPercent(percent: number, tempC: number, pressureKPa = STANDARD_PRESSURE_KPA, salinity = 0): number {
  if (!present('percent', percent)) throw new InputError('percent', 'percent is required.');
  requireNonNegative('percent', percent);
  return (percent / 100) * oxygenSaturationMgL(tempC, pressureKPa, salinity);
}

/** Pressure unit conversions to kPa (exact definitions: 1 hPa = 0.1 kPa; 1 mmHg = 0.133322387 kPa). */
export const PRESSURE_TO_KPA = { kPa: 1, hPa: 0.1, mmHg: 0.133322387415, inHg: 3.386389 } as const;
export type PressureUnit = keyof typeof PRESSURE_TO_KPA;

export function pressureToKPa(value: number, unit: PressureUnit): number {
  if (!present('pressure', value)) throw new InputError('pressure', 'pressure is required.');
  requireNonNegative('pressure', value);
  return value * PRESSURE_TO_KPA[unit];
}

/**
 * True (station) pressure from a sea-level-corrected pressure (as weather services report) and
 * the site's elevation, by the ICAO standard atmosphere: P = P₀ (1 − 2.25577×10⁻⁵ h)^5.25588,
 * h in m (from memory). Field rule of thumb: about −2.5 mmHg per 100 ft (common practice).
 * Valid 0–5,000 m.
 */
export function stationPressureKPa(seaLevelKPa: number, elevationM: number): number {
  if (!present('seaLevelKPa', seaLevelKPa)) throw new InputError('seaLevelKPa', 'seaLevelKPa is required.');
  if (!present('elevationM', elevationM)) throw new InputError('elevationM', 'elevationM is required.');
  requireRange('elevationM', elevationM, -450, 5000, 'm');
  return seaLevelKPa * Math.pow(1 - 2.25577e-5 * elevationM, 5.25588);
}
