import { InputError, present, requireNonNegative, requireRange } from './errors';
import { SPECIES, type Ion } from './species';

/**
 * Specific conductance at 25 °C from conductivity measured at the water's temperature, linear
 * compensation: SC₂₅ = EC_t / (1 + α (t − 25)).
 * Source: Standard Methods 2510 B; α = 0.0191 /°C for KCl solutions (from memory); natural waters
 * 0.0175–0.0198, mean 0.0187 (Hayashi 2004, Environ. Monit. Assess. 96:119, read).
 * Units: ecUsPerCm µS/cm at tempC; returns µS/cm at 25 °C. Valid 0–35 °C for natural waters.
 */
export function specificConductance(ecUsPerCm: number, tempC: number, alpha = 0.0191): number {
  if (!present('ecUsPerCm', ecUsPerCm)) throw new InputError('ecUsPerCm', 'ecUsPerCm is required.');
  requireNonNegative('ecUsPerCm', ecUsPerCm);
  if (!present('tempC', tempC)) throw new InputError('tempC', 'tempC is required.');
  requireRange('tempC', tempC, -2, 100, '°C');
  if (!present('alpha', alpha)) throw new InputError('alpha', 'alpha is required.');
  requireRange('alpha', alpha, 0, 0.05, '/°C');
  return ecUsPerCm / (1 + alpha * (tempC - 25));
}

/**
 * Conductivity at tempC from specific conductance (the inverse of {@link specificConductance}).
 */
export function conductivityAtTemperature(scUsPerCm: number, tempC: number, alpha = 0.0191): number {
  requireNonNegative('scUsPerCm', scUsPerCm);
  requireRange('tempC', tempC, -2, 100, '°C');
  return scUsPerCm * (1 + alpha * (tempC - 25));
}

/**
 * Calculated specific conductance (µS/cm at 25 °C) from an analysis, Standard Methods 2510
 * (calculation of conductivity, method from memory):
 *   κ° = Σ |zᵢ| λ°ᵢ mᵢ  (mᵢ in mmol/L, λ° per equivalent),
 *   κ = κ° y², log y = −0.5 (√I/(1 + √I) − 0.3 I)  (Davies-type activity correction, I in mol/L).
 * λ° from the species table (CRC / Lange's Handbook). Reliable within a few percent below
 * about 2,000 µS/cm; SM 1030 E accepts calculated/measured 0.9–1.1.
 */
export function calculatedConductance(ionsMolL: Partial<Record<Ion, number>>): number {
  let k0 = 0;
  let sumZ2 = 0;
  for (const [key, molL] of Object.entries(ionsMolL) as Array<[Ion, number | undefined]>) {
    if (molL === undefined) continue;
    requireNonNegative(key, molL);
    const s = SPECIES[key];
    const lambda = 'lambda0' in s ? s.lambda0 : undefined;
    if (lambda === undefined) continue;
    const z = Math.abs(s.charge);
    k0 += z * lambda * molL * 1000;
    sumZ2 += z * z * molL;
  }
  const I = 0.5 * sumZ2;
  const sqrtI = Math.sqrt(I);
  const logY = -0.5 * (sqrtI / (1 + sqrtI) - 0.3 * I);
  return k0 * Math.pow(10, 2 * logY);
}
