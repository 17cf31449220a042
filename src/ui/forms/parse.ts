// Parsing what a gloved thumb typed: decimal comma or point, no silent zeros, errors in words.
import { parseDecimalLoose } from '../../records/numbers';

export interface NumberRule {
  label: string;
  unit?: string;
  required?: boolean;
  min?: number;
  max?: number;
  /** minimum exclusive (e.g. volume > 0) */
  positive?: boolean;
}

export type Parsed = { ok: true; value: number | undefined } | { ok: false; error: string };

/**
 * "7,85" and "7.85" are both 7.85; "" is missing (an error only when required); "1.234,5",
 * "7..8", "0x10", "abc" are refused with a message, never read as 0.
 */
export function parseDecimal(raw: string | undefined | null, rule: NumberRule): Parsed {
  const unit = rule.unit ? ` ${rule.unit}` : '';
  if ((raw ?? '').trim() === '') return rule.required ? { ok: false, error: `Enter ${rule.label}.` } : { ok: true, value: undefined };
  const v = parseDecimalLoose(raw ?? '');
  if (v === undefined) return { ok: false, error: `“${raw}” is not a number. Use digits with one decimal point or comma.` };
  if (rule.positive && v <= 0) return { ok: false, error: `${cap(rule.label)} must be more than 0${unit}.` };
  if (rule.min !== undefined && v < rule.min) return { ok: false, error: `${cap(rule.label)} ${v}${unit} is below ${rule.min}${unit}: check the reading and its unit.` };
  if (rule.max !== undefined && v > rule.max) return { ok: false, error: `${cap(rule.label)} ${v}${unit} is above ${rule.max}${unit}: check the reading and its unit.` };
  return { ok: true, value: v };
}

/** Capitalise a label for the start of a sentence, but leave 'pH' and 'α' as they are. */
function cap(s: string): string {
  return /^[a-z][a-z ]/.test(s) ? s.charAt(0).toUpperCase() + s.slice(1) : s;
}
