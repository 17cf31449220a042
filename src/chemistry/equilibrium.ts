import { InputError, present, requireRange } from './errors';
import { kelvin } from './water';

/**
 * Equilibrium constants, written in the dissociation / dissolution direction for the
 * reactions the contract names, and in the formation direction for ion pairs.
 *
 * Two published forms:
 * - analytical (Plummer & Busenberg 1982, GCA 46:1011, read):
 *     log K = a + b·T + c/T + d·log10 T + e/T², T in K, valid 0–90 °C.
 * - van 't Hoff from log K at 25 °C and ΔH°r (kcal/mol), Nordstrom et al. (1990) ACS Symp.
 *   Ser. 416:398 (values from memory):
 *     log K(T) = log K₂₉₈ − ΔH°/(R ln 10) · (1/T − 1/298.15), R = 1.98720×10⁻³ kcal/(mol·K);
 *   held valid 0–50 °C (common practice for a constant-enthalpy extrapolation).
 * - water: Standard Methods 2330 fit pKw = 4471/T + 0.01706·T − 6.0875 (from memory), 0–100 °C.
 */
type Analytical = { kind: 'analytical'; a: number; b: number; c: number; d: number; e: number };
type VantHoff = { kind: 'vant-hoff'; logK25: number; dHkcal: number };
type Water = { kind: 'water' };

export interface ReactionInfo {
  equation: string;
  form: Analytical | VantHoff | Water;
  source: string;
  /** °C range where the temperature function is published or commonly held valid */
  validC: [number, number];
}

const PB82 = 'Plummer & Busenberg (1982) GCA 46:1011';
const N90 = 'Nordstrom et al. (1990) ACS Symp. Ser. 416:398 (from memory)';

export const REACTIONS = {
  water: { equation: 'H2O = H+ + OH-', form: { kind: 'water' }, source: 'Standard Methods 2330 (fit, from memory)', validC: [0, 100] },
  co2Henry: {
    equation: 'CO2(g) = CO2(aq)',
    form: { kind: 'analytical', a: 108.3865, b: 0.01985076, c: -6919.53, d: -40.45154, e: 669365.0 },
    source: PB82,
    validC: [0, 90],
  },
  carbonic1: {
    equation: 'H2CO3* = H+ + HCO3-',
    form: { kind: 'analytical', a: -356.3094, b: -0.06091964, c: 21834.37, d: 126.8339, e: -1684915 },
    source: PB82,
    validC: [0, 90],
  },
  carbonic2: {
    equation: 'HCO3- = H+ + CO3-2',
    form: { kind: 'analytical', a: -107.8871, b: -0.03252849, c: 5151.79, d: 38.92561, e: -563713.9 },
    source: PB82,
    validC: [0, 90],
  },
  calcite: {
    equation: 'CaCO3(calcite) = Ca+2 + CO3-2',
    form: { kind: 'analytical', a: -171.9065, b: -0.077993, c: 2839.319, d: 71.595, e: 0 },
    source: PB82,
    validC: [0, 90],
  },
  aragonite: {
    equation: 'CaCO3(aragonite) = Ca+2 + CO3-2',
    form: { kind: 'analytical', a: -171.9773, b: -0.077993, c: 2903.293, d: 71.595, e: 0 },
    source: PB82,
    validC: [0, 90],
  },
  CaHCO3: {
    equation: 'Ca+2 + HCO3- = CaHCO3+',
    form: { kind: 'analytical', a: 1209.12, b: 0.31294, c: -34765.05, d: -478.782, e: 0 },
    source: PB82,
    validC: [0, 90],
  },
  CaCO3aq: {
    equation: 'Ca+2 + CO3-2 = CaCO3°',
    form: { kind: 'analytical', a: -1228.732, b: -0.299444, c: 35512.75, d: 485.818, e: 0 },
    source: PB82,
    validC: [0, 90],
  },
  dolomite: { equation: 'CaMg(CO3)2 = Ca+2 + Mg+2 + 2CO3-2', form: { kind: 'vant-hoff', logK25: -17.09, dHkcal: -9.436 }, source: N90, validC: [0, 50] },
  gypsum: { equation: 'CaSO4·2H2O = Ca+2 + SO4-2 + 2H2O', form: { kind: 'vant-hoff', logK25: -4.58, dHkcal: -0.109 }, source: N90, validC: [0, 50] },
  MgHCO3: { equation: 'Mg+2 + HCO3- = MgHCO3+', form: { kind: 'vant-hoff', logK25: 1.07, dHkcal: 0.79 }, source: N90, validC: [0, 50] },
  MgCO3aq: { equation: 'Mg+2 + CO3-2 = MgCO3°', form: { kind: 'vant-hoff', logK25: 2.98, dHkcal: 2.713 }, source: N90, validC: [0, 50] },
  CaSO4aq: { equation: 'Ca+2 + SO4-2 = CaSO4°', form: { kind: 'vant-hoff', logK25: 2.3, dHkcal: 1.65 }, source: N90, validC: [0, 50] },
  MgSO4aq: { equation: 'Mg+2 + SO4-2 = MgSO4°', form: { kind: 'vant-hoff', logK25: 2.37, dHkcal: 4.55 }, source: N90, validC: [0, 50] },
  NaSO4: { equation: 'Na+ + SO4-2 = NaSO4-', form: { kind: 'vant-hoff', logK25: 0.7, dHkcal: 1.12 }, source: N90, validC: [0, 50] },
  KSO4: { equation: 'K+ + SO4-2 = KSO4-', form: { kind: 'vant-hoff', logK25: 0.85, dHkcal: 2.25 }, source: N90, validC: [0, 50] },
  NaCO3: { equation: 'Na+ + CO3-2 = NaCO3-', form: { kind: 'vant-hoff', logK25: 1.27, dHkcal: 8.91 }, source: N90, validC: [0, 50] },
  NaHCO3aq: { equation: 'Na+ + HCO3- = NaHCO3°', form: { kind: 'vant-hoff', logK25: -0.25, dHkcal: 0 }, source: N90 + '; ΔH not given, taken as 0', validC: [0, 50] },
  CaOH: { equation: 'Ca+2 + H2O = CaOH+ + H+', form: { kind: 'vant-hoff', logK25: -12.78, dHkcal: 14.535 }, source: N90, validC: [0, 50] },
  MgOH: { equation: 'Mg+2 + H2O = MgOH+ + H+', form: { kind: 'vant-hoff', logK25: -11.44, dHkcal: 15.952 }, source: N90, validC: [0, 50] },
  HSO4: { equation: 'SO4-2 + H+ = HSO4-', form: { kind: 'vant-hoff', logK25: 1.988, dHkcal: 3.85 }, source: N90, validC: [0, 50] },
  H4SiO4: { equation: 'H4SiO4 = H3SiO4- + H+', form: { kind: 'vant-hoff', logK25: -9.83, dHkcal: 6.12 }, source: N90, validC: [0, 50] },
} as const satisfies Record<string, ReactionInfo>;

export type Reaction = keyof typeof REACTIONS;

const LN10_R = Math.LN10 * 1.9872e-3; // kcal/(mol·K) × ln 10

function evaluate(info: ReactionInfo, T: number): number {
  const f = info.form;
  switch (f.kind) {
    case 'analytical':
      return f.a + f.b * T + f.c / T + f.d * Math.log10(T) + f.e / (T * T);
    case 'vant-hoff':
      return f.logK25 - (f.dHkcal / LN10_R) * (1 / T - 1 / 298.15);
    case 'water':
      return -(4471 / T + 0.01706 * T - 6.0875);
  }
}

/**
 * log10 K of a reaction at tempC (−2 to 100 °C accepted; outside a reaction's `validC` the
 * value is an extrapolation and {@link isExtrapolated} says so).
 * Examples at 25 °C: calcite −8.48, carbonic1 −6.352, carbonic2 −10.329, co2Henry −1.468, water −13.995.
 */
export function logK(reaction: Reaction, tempC: number): number {
  const info: ReactionInfo | undefined = REACTIONS[reaction];
  if (!info) throw new InputError('reaction', `Unknown reaction '${String(reaction)}'. Known: ${Object.keys(REACTIONS).join(', ')}.`);
  if (!present('tempC', tempC)) throw new InputError('tempC', 'tempC is required.');
  requireRange('tempC', tempC, -2, 100, '°C');
  return evaluate(info, kelvin(tempC));
}

export function isExtrapolated(reaction: Reaction, tempC: number): boolean {
  const [lo, hi] = REACTIONS[reaction].validC;
  return tempC < lo || tempC > hi;
}

/** All log K values the speciation needs at one temperature, computed once. */
export type LogKTable = Record<Reaction, number>;

const tableCache = new Map<number, LogKTable>();

/** The table is cached for the last few temperatures used (a day's samples share a handful). */
export function logKTable(tempC: number): LogKTable {
  const hit = tableCache.get(tempC);
  if (hit) return hit;
  const T = kelvin(tempC);
  const out = {} as LogKTable;
  for (const key of Object.keys(REACTIONS) as Reaction[]) out[key] = evaluate(REACTIONS[key], T);
  Object.freeze(out);
  if (tableCache.size >= 64) tableCache.delete(tableCache.keys().next().value as number);
  tableCache.set(tempC, out);
  return out;
}
