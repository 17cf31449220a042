import { InputError, present, requireNonNegative, requireRange } from './errors';

/**
 * Practical Salinity Scale 1978 (PSS-78), UNESCO (1983) Tech. Pap. Mar. Sci. 44 (Fofonoff &
 * Millard; read):
 *   S = Σ aᵢ Rₜ^(i/2) + ΔS,  ΔS = (t − 15)/(1 + k(t − 15)) Σ bᵢ Rₜ^(i/2)
 *   rₜ = c₀ + c₁t + c₂t² + c₃t³ + c₄t⁴
 *   R_p = 1 + p(e₁ + e₂p + e₃p²)/(1 + d₁t + d₂t² + (d₃ + d₄t) R)
 *   Rₜ = R/(R_p rₜ)
 * with t on IPTS-68 (t₆₈ = 1.00024 t₉₀; we take t in ITS-90 as thermometers read today) and p in
 * decibars. R is the conductivity ratio C(S,t,p)/C(35,15,0), C(35,15,0) = 42.914 mS/cm.
 * Valid for 2 ≤ S ≤ 42, −2 to 35 °C; outside, the result is flagged `inRange: false`.
 */
const A = [0.008, -0.1692, 25.3851, 14.0941, -7.0261, 2.7081];
const B = [0.0005, -0.0056, -0.0066, -0.0375, 0.0636, -0.0144];
const K = 0.0162;
const C = [0.6766097, 2.00564e-2, 1.104259e-4, -6.9698e-7, 1.0031e-9];
const D = [3.426e-2, 4.464e-4, 4.215e-1, -3.107e-3];
const E = [2.07e-5, -6.37e-10, 3.989e-15];

/** Conductivity of standard seawater S = 35 at 15 °C and 0 dbar, µS/cm (UNESCO 1983). */
export const C35_15_0_US_PER_CM = 42914;

export function practicalSalinity(conductivityRatio: number, tempC: number, pressureDbar = 0): number {
  if (!present('conductivityRatio', conductivityRatio)) throw new InputError('conductivityRatio', 'conductivityRatio is required.');
  requireNonNegative('conductivityRatio', conductivityRatio);
  requireRange('conductivityRatio', conductivityRatio, 0, 5, '');
  if (!present('tempC', tempC)) throw new InputError('tempC', 'tempC is required.');
  requireRange('tempC', tempC, -2, 40, '°C');
  if (!present('pressureDbar', pressureDbar)) throw new InputError('pressureDbar', 'pressureDbar must be a number.');
  requireRange('pressureDbar', pressureDbar, 0, 11000, 'dbar');
  if (conductivityRatio === 0) return 0;
  const t = 1.00024 * tempC; // ITS-90 → IPTS-68
  const p = pressureDbar;
  const R = conductivityRatio;
  const rt = C[0]! + t * (C[1]! + t * (C[2]! + t * (C[3]! + t * C[4]!)));
  const Rp = 1 + (p * (E[0]! + p * (E[1]! + p * E[2]!))) / (1 + D[0]! * t + D[1]! * t * t + (D[2]! + D[3]! * t) * R);
  const Rt = R / (Rp * rt);
  const sq = Math.sqrt(Rt);
  let sumA = 0, sumB = 0, pow = 1;
  for (let i = 0; i < 6; i++) {
    sumA += A[i]! * pow;
    sumB += B[i]! * pow;
    pow *= sq;
  }
  return sumA + ((t - 15) / (1 + K * (t - 15))) * sumB;
}

/**
 * Salinity of a sample from its conductivity (µS/cm, at its own temperature, not compensated)
 * and temperature, at the surface. For brackish and coastal sites.
 */
export function salinityFromConductivity(conductivityUsPerCm: number, tempC: number): { salinity: number; inRange: boolean } {
  if (!present('conductivityUsPerCm', conductivityUsPerCm)) throw new InputError('conductivityUsPerCm', 'conductivityUsPerCm is required.');
  requireNonNegative('conductivityUsPerCm', conductivityUsPerCm);
  const salinity = practicalSalinity(conductivityUsPerCm / C35_15_0_US_PER_CM, tempC, 0);
  return { salinity, inRange: salinity >= 2 && salinity <= 42 && tempC >= -2 && tempC <= 35 };
}

/** Salinity from specific conductance at 25 °C (the conductivity a meter reports when compensated to 25 °C). */
export function salinityFromSpecificConductance(scUsPerCm: number): { salinity: number; inRange: boolean } {
  return salinityFromConductivity(scUsPerCm, 25);
}
