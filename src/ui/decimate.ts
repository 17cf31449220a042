// Chart decimation before derivation: a site with 20,000 samples is drawn from at most about two
// points per pixel column. Samples (sorted by time) are put into equal time buckets and the first and
// last of each bucket are kept, so every stretch of time that has samples keeps a point, gaps stay
// gaps and the first and last samples are always drawn. Only the kept samples are derived.

/** Keep at most 2 × `buckets` items of a time-sorted list; shorter lists come back whole. */
export function decimateByTime<T>(sorted: T[], timeOf: (item: T) => number, buckets: number): T[] {
  if (sorted.length <= 2 * buckets) return sorted;
  const t0 = timeOf(sorted[0]!);
  const span = timeOf(sorted[sorted.length - 1]!) - t0;
  if (!(span > 0)) return [sorted[0]!, sorted[sorted.length - 1]!];
  const out: T[] = [];
  let bucket = -1;
  let last: T | undefined;
  for (const item of sorted) {
    const b = Math.min(buckets - 1, Math.floor(((timeOf(item) - t0) / span) * buckets));
    if (b !== bucket) {
      if (last !== undefined && out[out.length - 1] !== last) out.push(last);
      out.push(item);
      bucket = b;
    }
    last = item;
  }
  if (last !== undefined && out[out.length - 1] !== last) out.push(last);
  return out;
}
