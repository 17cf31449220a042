/** A number from a file cell: decimal point or comma, or undefined (never a silent 0). */
export function parseDecimalLoose(raw: string): number | undefined {
  const s = raw.trim().replace(/\s/g, '');
  if (!/^[+-]?(\d+([.,]\d*)?|[.,]\d+)([eE][+-]?\d+)?$/.test(s)) return undefined;
  const v = Number(s.replace(',', '.'));
  return Number.isFinite(v) ? v : undefined;
}
