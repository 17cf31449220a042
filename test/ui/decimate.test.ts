// Chart decimation: bounded point count, first and last kept, every populated time bucket kept.
// Expected values follow from the bucket rule itself (common practice for min/max-style decimation).
import { describe, expect, it } from 'vitest';
import { decimateByTime } from '../../src/ui/decimate';

describe('decimateByTime', () => {
  const t = (x: number) => x;
  it('returns short lists whole', () => {
    const xs = [1, 2, 3, 4];
    expect(decimateByTime(xs, t, 2)).toBe(xs);
  });
  it('keeps at most two points per bucket, the first and the last sample, in time order', () => {
    const xs = Array.from({ length: 20_000 }, (_, i) => i);
    const kept = decimateByTime(xs, t, 350);
    expect(kept.length).toBeLessThanOrEqual(700);
    expect(kept.length).toBeGreaterThan(600);
    expect(kept[0]).toBe(0);
    expect(kept.at(-1)).toBe(19_999);
    expect([...kept].sort((a, b) => a - b)).toEqual(kept);
  });
  it('keeps an isolated sample in a long gap (a bucket with one sample)', () => {
    const xs = [...Array.from({ length: 1000 }, (_, i) => i), 5000, ...Array.from({ length: 1000 }, (_, i) => 9000 + i)];
    expect(decimateByTime(xs, t, 100)).toContain(5000);
  });
});
