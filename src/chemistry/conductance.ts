import { InputError, present, requireNonNegative, requireRange } from './errors';
import { SPECIES, type Ion, type SpeciesInfo } from './species';

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
 * Debye–Hückel–Onsager constants for conductance in water at 25 °C (Robinson & Stokes 1959,
 * Electrolyte Solutions, ch. 7; from memory): relaxation B₁ = 0.2289 (mol/L)^-½, electrophoresis
 * B₂ = 60.32 S cm² mol⁻¹ (mol/L)^-½ for a 1:1 salt (half of it to each ion); distance of closest
 * approach a = 4 Å in the extended denominator 1 + κa = 1 + 0.3287 a √I (our choice: a typical
 * Kielland size, which reproduces the KCl and NaCl standards).
 */
export const ONSAGER_25C = { B1: 0.2289, B2: 60.32, kappaA: 0.3287 * 4 } as const;

/**
 * Calculated specific conductance (µS/cm at 25 °C) of a solution from its charged species
 * (free ions and charged ion pairs, mol/L), by the Debye–Hückel–Onsager equation in its
 * extended form (Robinson & Stokes 1959, eq. for Λ = Λ° − (B₁Λ° + B₂)√c/(1 + κa); constants
 * {@link ONSAGER_25C}) applied ion by ion to a mixture, in the manner of McCleskey et al. (2012,
 * GCA 77:369; method from memory, not their coefficients):
 *   λᵢ = λ°ᵢ − (B₁ |zᵢ| z̄ λ°ᵢ + ½ B₂ |zᵢ|) √I / (1 + κa),   κ = Σ |zᵢ| cᵢ λᵢ,
 * λ per equivalent, z̄ the equivalent-weighted mean charge of the ions of opposite sign, I the
 * ionic strength of the same species. λ° from the species table (CRC / Lange's Handbook).
 * Checks: 0.01 mol/L KCl → 1,413 µS/cm (OIML R 56 / ASTM D1125), NaCl → 1,185 (λ° tables;
 * Robinson & Stokes App. 6.1 Λ = 118.5), USGS INL analyses (test/chemistry/real-data.test.ts).
 * Valid to about I = 0.1 mol/L (SC ≈ 10,000 µS/cm); the λ is never let below 0.
 * Species without λ° (neutral, or ion pairs without published values) are counted in I only;
 * charged pairs (CaHCO₃⁺, NaSO₄⁻ …) take half the λ° of their free ion (our assumption).
 */
export function calculatedConductance(ionsMolL: Partial<Record<Ion, number>>): number {
  let sumZ2 = 0;
  let catEq = 0, catZ2 = 0, anEq = 0, anZ2 = 0;
  const list: Array<{ z: number; cation: boolean; lambda: number; molL: number }> = [];
  for (const [key, molL] of Object.entries(ionsMolL) as Array<[Ion, number | undefined]>) {
    if (molL === undefined) continue;
    requireNonNegative(key, molL);
    const s: SpeciesInfo = SPECIES[key];
    const z = Math.abs(s.charge);
    if (z === 0 || molL === 0) continue;
    const cation = s.charge > 0;
    sumZ2 += z * z * molL;
    if (cation) { catEq += z * molL; catZ2 += z * z * molL; } else { anEq += z * molL; anZ2 += z * z * molL; }
    const own = s.lambda0;
    const lambda = own ?? (s.pairOf ? 0.5 * ((SPECIES[s.pairOf as Ion] as SpeciesInfo).lambda0 ?? 0) : undefined);
    if (lambda !== undefined && lambda > 0) list.push({ z, cation, lambda, molL });
  }
  const sqrtI = Math.sqrt(0.5 * sumZ2);
  const f = sqrtI / (1 + ONSAGER_25C.kappaA * sqrtI);
  const zCat = catEq > 0 ? catZ2 / catEq : 1;
  const zAn = anEq > 0 ? anZ2 / anEq : 1;
  let k = 0;
  for (const { z, cation, lambda, molL } of list) {
    const zBar = cation ? zAn : zCat;
    const lam = Math.max(0, lambda - (ONSAGER_25C.B1 * z * zBar * lambda + 0.5 * ONSAGER_25C.B2 * z) * f);
    k += z * lam * molL * 1000;
  }
  return k;
}
