/**
 * Aqueous species known to the engine: charge, molar mass and the ion-size
 * parameters each activity model needs.
 *
 * - Molar masses: IUPAC standard atomic weights (2021), g/mol.
 * - Kielland å (Å): Kielland (1937) JACS 59:1675, table of ion-size parameters. Kielland puts
 *   Na⁺ and HCO₃⁻ in the 4.0–4.5 Å group: we take 4.0 for Na⁺ and 4.5 for HCO₃⁻ as in the
 *   common textbook tables (from memory). Ion pairs have no Kielland value: å = 4.0 Å is assumed
 *   for them (`sizeAssumed`), which matters little since pairs are minor species.
 * - Truesdell–Jones a (Å) and b (kg/mol): Truesdell & Jones (1974) J. Res. USGS 2:233 (from memory);
 *   H⁺ and OH⁻ from the Parkhurst (1990) ACS Symp. Ser. 416 ch. 3 refit (from memory). A species
 *   without published values has no `tj`: the Truesdell–Jones model then uses its Kielland size
 *   with b = 0, which is the extended Debye–Hückel equation.
 * - λ° (S cm² per equivalent at 25 °C, infinite dilution): CRC Handbook / Lange's Handbook as
 *   quoted for Standard Methods 2510 (partly from memory), used for calculated conductance.
 */
export interface SpeciesInfo {
  charge: number;
  /** g/mol */
  molarMass: number;
  /** Kielland ion size, Å */
  kiellandA: number;
  sizeAssumed?: boolean;
  /** Truesdell–Jones parameters: a in Å, b in kg/mol */
  tj?: { a: number; b: number };
  /** Equivalent conductance at infinite dilution, 25 °C, S cm²/equiv */
  lambda0?: number;
  /** for a charged ion pair: the free ion whose λ° it takes half of in calculated conductance (our assumption) */
  pairOf?: string;
}

export const SPECIES = {
  H: { charge: 1, molarMass: 1.008, kiellandA: 9, tj: { a: 4.78, b: 0.24 }, lambda0: 349.65 },
  OH: { charge: -1, molarMass: 17.007, kiellandA: 3.5, tj: { a: 10.65, b: 0.21 }, lambda0: 198 },
  Ca: { charge: 2, molarMass: 40.078, kiellandA: 6, tj: { a: 5.0, b: 0.165 }, lambda0: 59.47 },
  Mg: { charge: 2, molarMass: 24.305, kiellandA: 8, tj: { a: 5.5, b: 0.2 }, lambda0: 53.0 },
  Na: { charge: 1, molarMass: 22.99, kiellandA: 4.0, tj: { a: 4.0, b: 0.075 }, lambda0: 50.1 },
  K: { charge: 1, molarMass: 39.098, kiellandA: 3, tj: { a: 3.5, b: 0.015 }, lambda0: 73.48 },
  NH4: { charge: 1, molarMass: 18.038, kiellandA: 2.5, lambda0: 73.5 },
  Cl: { charge: -1, molarMass: 35.453, kiellandA: 3, tj: { a: 3.5, b: 0.015 }, lambda0: 76.3 },
  SO4: { charge: -2, molarMass: 96.06, kiellandA: 4, tj: { a: 5.0, b: -0.04 }, lambda0: 80.0 },
  HCO3: { charge: -1, molarMass: 61.017, kiellandA: 4.5, tj: { a: 5.4, b: 0 }, lambda0: 44.5 },
  CO3: { charge: -2, molarMass: 60.009, kiellandA: 4.5, tj: { a: 5.4, b: 0 }, lambda0: 69.3 },
  NO3: { charge: -1, molarMass: 62.004, kiellandA: 3, lambda0: 71.4 },
  F: { charge: -1, molarMass: 18.998, kiellandA: 3.5, lambda0: 55.4 },
  HSO4: { charge: -1, molarMass: 97.07, kiellandA: 4, lambda0: 50 },
  H3SiO4: { charge: -1, molarMass: 95.11, kiellandA: 4, sizeAssumed: true, pairOf: 'HCO3' },
  CaHCO3: { charge: 1, molarMass: 101.095, kiellandA: 4, sizeAssumed: true, pairOf: 'Ca' },
  MgHCO3: { charge: 1, molarMass: 85.322, kiellandA: 4, sizeAssumed: true, pairOf: 'Mg' },
  NaCO3: { charge: -1, molarMass: 82.999, kiellandA: 4, sizeAssumed: true, pairOf: 'CO3' },
  NaSO4: { charge: -1, molarMass: 119.05, kiellandA: 4, sizeAssumed: true, pairOf: 'SO4' },
  KSO4: { charge: -1, molarMass: 135.158, kiellandA: 4, sizeAssumed: true, pairOf: 'SO4' },
  CaOH: { charge: 1, molarMass: 57.085, kiellandA: 4, sizeAssumed: true, pairOf: 'Ca' },
  MgOH: { charge: 1, molarMass: 41.312, kiellandA: 4, sizeAssumed: true, pairOf: 'Mg' },
} as const satisfies Record<string, SpeciesInfo>;

export type Ion = keyof typeof SPECIES;

/** g/mol of the neutral or reporting forms used for unit conversion. */
export const MOLAR_MASS = {
  CaCO3: 100.086,
  N: 14.007,
  SiO2: 60.084,
  Si: 28.085,
} as const;

/** mg of CaCO₃ per milliequivalent (100.086 / 2). */
export const MG_CACO3_PER_MEQ = 50.043;

export function isIon(key: string): key is Ion {
  return Object.prototype.hasOwnProperty.call(SPECIES, key);
}
