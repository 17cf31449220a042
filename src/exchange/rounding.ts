// Numbers as measured: every exported value is rounded to the resolution its method supports,
// by one rule per parameter (DEVELOPERS.md, "Numbers in exported files"). Pure: the CSV, WQX and
// GeoJSON writers, the office command and a Web Worker can all call it.

/** A rounding rule: a fixed number of decimals, or significant figures never finer than `maxDecimals`. */
export type RoundRule =
  | { kind: 'decimals'; decimals: number }
  | { kind: 'sig'; figures: number; /** never coarser than whole units (keeps 1413 µS/cm) */ wholeUnits?: boolean };

const dec = (decimals: number): RoundRule => ({ kind: 'decimals', decimals });
const sig = (figures: number, wholeUnits = false): RoundRule => ({ kind: 'sig', figures, wholeUnits });

/**
 * The per-parameter rules. Field meters: temperature 0.1 °C, pH 0.01, SC 3 significant figures but
 * never coarser than 1 µS/cm, DO 0.01 mg/L and 0.1 % saturation (USGS NFM A6 reporting, from memory;
 * DO to 0.01 as the meters display). Concentrations: 3 significant figures, never coarser than
 * 1 mg/L (common practice in lab reports). Computed indices: 0.01 (SI, LSI, RSI, log pCO₂, pHs),
 * ionic strength and small derived concentrations 3 significant figures.
 */
export const ROUNDING = {
  temperature: dec(1),
  pH: dec(2),
  conductance: sig(3, true),
  alpha: sig(3),
  doMgL: dec(2),
  doPercent: dec(1),
  concentration: sig(3, true),
  /** values below 1 mg/L that matter at their own scale (un-ionized ammonia, DIC in mmol/L) */
  smallConcentration: sig(3),
  ionicStrength: sig(3),
  index: dec(2),
  uncertainty: dec(2),
  percent: dec(1),
  pressure: sig(4, true),
  latLon: dec(6),
  metres: dec(1),
  mV: dec(1),
  titrant: dec(2),
  ratio: dec(3),
} as const satisfies Record<string, RoundRule>;

export type RoundKey = keyof typeof ROUNDING;

/** Decimals a rule keeps for this value (negative: rounds to tens, hundreds…). */
export function decimalsFor(rule: RoundRule, value: number): number {
  if (rule.kind === 'decimals') return rule.decimals;
  if (value === 0) return 0;
  const magnitude = Math.floor(Math.log10(Math.abs(value))) + 1; // digits before the point
  const d = rule.figures - magnitude;
  return rule.wholeUnits ? Math.max(d, 0) : d;
}

/**
 * Round `value` by `rule`; the result prints (String) with no float noise: k / 10^d is the double
 * nearest the decimal, and JavaScript prints the shortest string that reads back to it.
 */
export function roundTo(rule: RoundRule, value: number): number {
  if (!Number.isFinite(value)) return value;
  const d = decimalsFor(rule, value);
  if (d > 15) return Number(value.toPrecision((rule as { figures: number }).figures)); // tiny values: 10^d would overflow
  const r = d >= 0 ? Math.round(value * 10 ** d) / 10 ** d : Math.round(value / 10 ** -d) * 10 ** -d;
  // a value rounding up a magnitude (9.996 → 10.0) keeps the rule at its new magnitude
  const d2 = decimalsFor(rule, r);
  const out = d2 < d ? (d2 >= 0 ? Math.round(r * 10 ** d2) / 10 ** d2 : Math.round(r / 10 ** -d2) * 10 ** -d2) : r;
  return Object.is(out, -0) ? 0 : out;
}

/** Round by a named rule; undefined and null pass through. */
export function rounded(key: RoundKey, value: number | undefined | null): number | undefined {
  if (value === undefined || value === null || !Number.isFinite(value)) return undefined;
  return roundTo(ROUNDING[key], value);
}
