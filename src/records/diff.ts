/** Field-level differences between two JSON-like values, as paths ("field.pH.values.0.value"). */
export interface Change {
  path: string;
  from: unknown;
  to: unknown;
}

const isObj = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

export function diff(from: unknown, to: unknown, path = '', out: Change[] = []): Change[] {
  if (Object.is(from, to)) return out;
  if (Array.isArray(from) && Array.isArray(to)) {
    const n = Math.max(from.length, to.length);
    for (let i = 0; i < n; i++) diff(from[i], to[i], path ? `${path}.${i}` : String(i), out);
    return out;
  }
  if (isObj(from) && isObj(to)) {
    const keys = new Set([...Object.keys(from), ...Object.keys(to)]);
    for (const k of keys) diff(from[k], to[k], path ? `${path}.${k}` : k, out);
    return out;
  }
  out.push({ path, from, to });
  return out;
}
