import { InputError, present, requireNonNegative, requireRange } from './errors';
import { kelvin } from './water';

/**
 * Fraction of total ammonia present as un-ionized NH₃, Emerson et al. (1975) J. Fish. Res. Board
 * Can. 32:2379: pKa = 0.09018 + 2729.92/T, f = 1/(10^(pKa − pH) + 1) (formula read; 2729.92 from
 * memory, one copy prints 2727.92). Published for 0–30 °C and pH 6–10; outside, still computed
 * (callers warn: {@link ammoniaInRange}). Fresh water (salinity effect neglected).
 */
export function unionizedAmmoniaFraction(pH: number, tempC: number): number {
  if (!present('pH', pH)) throw new InputError('pH', 'pH is required.');
  requireRange('pH', pH, 0, 14, '');
  if (!present('tempC', tempC)) throw new InputError('tempC', 'tempC is required.');
  requireRange('tempC', tempC, -2, 100, '°C');
  const pKa = 0.09018 + 2729.92 / kelvin(tempC);
  return 1 / (Math.pow(10, pKa - pH) + 1);
}

export function ammoniaInRange(pH: number, tempC: number): boolean {
  return pH >= 6 && pH <= 10 && tempC >= 0 && tempC <= 30;
}

/** Un-ionized ammonia from total ammonia (NH₃ + NH₄⁺) as N, mg/L: returns NH₃ as N and as NH₃. */
export function unionizedAmmonia(totalNH3NMgL: number, pH: number, tempC: number): { fraction: number; nh3NMgL: number; nh3MgL: number } {
  if (!present('totalNH3NMgL', totalNH3NMgL)) throw new InputError('totalNH3NMgL', 'totalNH3NMgL is required.');
  requireNonNegative('totalNH3NMgL', totalNH3NMgL);
  const fraction = unionizedAmmoniaFraction(pH, tempC);
  const nh3NMgL = fraction * totalNH3NMgL;
  return { fraction, nh3NMgL, nh3MgL: (nh3NMgL * 17.031) / 14.007 };
}
