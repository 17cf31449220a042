/**
 * The engine's bad-input rule, decided once:
 * - A value that is physically impossible (pH 15, a negative concentration, water at 150 °C,
 *   NaN or Infinity passed as a number) throws an {@link InputError} naming the field.
 * - A value that is possible but odd (pH 11.5 in a stream, SC of 5 µS/cm) gives a
 *   {@link ChemWarning} and the computation goes on.
 * - A missing value (undefined or null) is simply absent: results that need it are
 *   `undefined`, never NaN, and a warning says what could not be computed where that matters.
 */
export class InputError extends Error {
  /** The input field at fault, e.g. 'pH' or 'caMgL'. */
  readonly field: string;
  constructor(field: string, message: string) {
    super(message);
    this.name = 'InputError';
    this.field = field;
  }
}

export type WarningCode =
  | 'activity-model-out-of-range'
  | 'ionic-strength-estimated'
  | 'ionic-strength-partial'
  | 'ionic-strength-unknown'
  | 'speciation-not-converged'
  | 'sc-ion-mismatch'
  | 'possible-unit-slip'
  | 'charge-balance'
  | 'ph-unusual'
  | 'temperature-unusual'
  | 'sc-unusual'
  | 'alkalinity-noncarbonate'
  | 'pco2-below-atmosphere'
  | 'pco2-high'
  | 'si-will-rise-downstream'
  | 'si-extreme'
  | 'calcite-needs-inputs'
  | 'constants-extrapolated'
  | 'concentration-high'
  | 'unit-slip-calcium'
  | 'unit-slip-alkalinity'
  | 'alkalinity-inconsistent-with-ph'
  | 'sc-beyond-salinity-scale'
  | 'seawater-ions-implied'
  | 'langelier-formula'
  | 'langelier-needs-inputs'
  | 'gypsum-without-ph'
  | 'oxygen-out-of-range'
  | 'oxygen-pressure-assumed'
  | (string & {});

/**
 * 'action': something to check or redo before leaving the site. 'notice': a standing fact about
 * the result (an estimate used, a trend to expect) that needs no action. Absent means 'action'.
 */
export type WarningKind = 'action' | 'notice';

export interface ChemWarning {
  code: WarningCode;
  /** What happened and what the crew can do about it, in plain words. */
  message: string;
  /** The input field concerned, where there is one. */
  field?: string;
  /** whether it asks for an action or only informs; absent = 'action' */
  kind?: WarningKind;
}

/** True for a standing notice (information only), false for a warning that needs an action. */
export function isNotice(w: ChemWarning): boolean {
  return w.kind === 'notice';
}

/** A number that is present: not undefined or null. NaN or ±Infinity is refused with InputError. */
export function present(field: string, value: number | null | undefined): value is number {
  if (value === undefined || value === null) return false;
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new InputError(field, `${field} must be a finite number (got ${String(value)}).`);
  }
  return true;
}

/** Throw InputError when a present value lies outside [min, max]. */
export function requireRange(field: string, value: number, min: number, max: number, unit: string): void {
  if (value < min || value > max) {
    throw new InputError(
      field,
      `${field} = ${value}${unit ? ' ' + unit : ''} is outside the physically possible range ${min} to ${max}${unit ? ' ' + unit : ''}.`,
    );
  }
}

/** Throw InputError when a concentration is negative. */
export function requireNonNegative(field: string, value: number): void {
  if (value < 0) throw new InputError(field, `${field} cannot be negative (got ${value}).`);
}
