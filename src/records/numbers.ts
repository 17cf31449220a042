/** Digits with at most one decimal point or comma, an optional sign and exponent. */
export const DECIMAL = /^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/;

/**
 * A number from typed or file text: decimal point or comma, spaces ignored, a typographic minus
 * accepted; undefined for anything else (never a silent 0). The form parser and the importers share it.
 */
export function parseDecimalLoose(raw: string): number | undefined {
  const s = raw.trim().replace(/\s+/g, '').replace(/^\u2212/, '-');
  if (!DECIMAL.test(s)) return undefined;
  const v = Number(s.replace(',', '.'));
  return Number.isFinite(v) ? v : undefined;
}
