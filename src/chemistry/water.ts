import { InputError, present, requireRange } from './errors';

/** Celsius to kelvin. */
export function kelvin(tempC: number): number {
  return tempC + 273.15;
}

function checkTemp(tempC: number, min = -2, max = 100): void {
  if (!present('tempC', tempC)) throw new InputError('tempC', 'tempC is required.');
  requireRange('tempC', tempC, min, max, '°C');
}

/**
 * Relative permittivity (dielectric constant) of liquid water.
 * ε(t) = 87.740 − 0.40008 t + 9.398×10⁻⁴ t² − 1.410×10⁻⁶ t³, t in °C.
 * Source: Malmberg & Maryott (1956) J. Res. NBS 56:1 (coefficients from memory; ε(25) = 78.30).
 * Valid 0–100 °C.
 */
export function dielectricConstant(tempC: number): number {
  checkTemp(tempC);
  const t = tempC;
  return 87.74 - 0.40008 * t + 9.398e-4 * t * t - 1.41e-6 * t * t * t;
}

/**
 * Density of air-free water at 1 atm, g/cm³.
 * Kell (1975) J. Chem. Eng. Data 20:97, the rational-function fit (coefficients from memory;
 * ρ(4 °C) = 0.99997, ρ(25 °C) = 0.99705). Valid 0–150 °C; used here 0–100 °C.
 */
export function waterDensity(tempC: number): number {
  checkTemp(tempC);
  const t = tempC;
  const num =
    999.83952 + 16.945176 * t - 7.9870401e-3 * t ** 2 - 46.170461e-6 * t ** 3 + 105.56302e-9 * t ** 4 - 280.54253e-12 * t ** 5;
  return num / (1 + 16.87985e-3 * t) / 1000;
}

/**
 * Debye–Hückel A, (L/mol)^½ on the log10 scale: A = 1.82483×10⁶ ρ^½ (εT)^−3/2.
 * Sources: the expression as in Truesdell & Jones (1974) and Helgeson & Kirkham (1974) (constant
 * from memory); ε from Malmberg & Maryott (1956); ρ from Kell (1975). About 0.511 at 25 °C;
 * published tables give 0.5085–0.5115 depending on the ε used (Freeze & Cherry 1979 App. IV: 0.5085).
 * Valid 0–100 °C.
 */
export function debyeHuckelA(tempC: number): number {
  const eT = dielectricConstant(tempC) * kelvin(tempC);
  return (1.82483e6 * Math.sqrt(waterDensity(tempC))) / Math.pow(eT, 1.5);
}

/**
 * Debye–Hückel B, 1/Å (L/mol)^½: B = 50.2916 ρ^½ (εT)^−1/2. Same sources as {@link debyeHuckelA}.
 * About 0.3287 at 25 °C (Freeze & Cherry 1979 App. IV tabulate 0.3281). Valid 0–100 °C.
 */
export function debyeHuckelB(tempC: number): number {
  const eT = dielectricConstant(tempC) * kelvin(tempC);
  return (50.2916 * Math.sqrt(waterDensity(tempC))) / Math.sqrt(eT);
}
