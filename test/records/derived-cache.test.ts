// The derived-result cache: reused while nothing that feeds derivation changed, recomputed exactly
// when the sample is edited, the engine version changes, the settings change or the method profile
// changes. Expected results are deriveSample's own (the cache must return what derivation returns).
// Source of the expected values: deriveSample itself (no published numbers); the engine's values are checked in test/chemistry.
import { describe, expect, it } from 'vitest';
import { demoRecords } from '../../src/demo/scenario';
import { Sample, DEFAULT_SETTINGS } from '../../src/records/schema';
import { deriveSample } from '../../src/records/derive';
import { DerivedCache } from '../../src/records/derived-cache';
import { DEFAULT_PROFILE } from '../../src/chemistry';

const T = '2026-06-14T12:00:00-06:00';
const samples = demoRecords(new Date('2026-06-14T12:00:00')).samples.map((s) =>
  Sample.parse({ ...s, createdAt: T, updatedAt: T, localDate: s.time.slice(0, 10) }),
);
const base = samples[0]!;
const ctx = { settings: DEFAULT_SETTINGS, profile: DEFAULT_PROFILE };

/** An edit as the store makes it: new entries, revision + 1, a new updatedAt. */
function edited(s: Sample, pH: number): Sample {
  return { ...s, revision: s.revision + 1, updatedAt: '2026-06-14T12:05:00-06:00', field: { ...s.field, pH: { values: [{ time: s.time, value: pH }] } } };
}

describe('derived-result cache', () => {
  it('returns what deriveSample returns, and computes each sample once while nothing changes', () => {
    const cache = new DerivedCache();
    const first = samples.map((s) => cache.get(s, ctx));
    const again = samples.map((s) => cache.get(s, ctx));
    expect(cache.computed).toBe(samples.length);
    expect(cache.hits).toBe(samples.length);
    samples.forEach((s, i) => {
      expect(again[i]).toBe(first[i]);
      expect(first[i]).toEqual(deriveSample(s, DEFAULT_SETTINGS, DEFAULT_PROFILE));
    });
    // a fresh copy of the same stored record (as IndexedDB hands back) is still a hit
    expect(cache.get(structuredClone(base), ctx)).toBe(first[0]);
  });

  it('is invalidated by an edit of the sample (new revision)', () => {
    const cache = new DerivedCache();
    const before = cache.get(base, ctx);
    const after = cache.get(edited(base, 6.9), ctx);
    expect(cache.computed).toBe(2);
    expect(after.input.pH).toBe(6.9);
    expect(before.input.pH).not.toBe(6.9);
    expect(after.analysis!.saturationIndex.calcite).toBeLessThan(before.analysis!.saturationIndex.calcite!);
  });

  it('is invalidated by an engine version change', () => {
    const cache = new DerivedCache();
    cache.get(base, { ...ctx, engineVersion: '1.0.0' });
    cache.get(base, { ...ctx, engineVersion: '1.0.0' });
    expect(cache.computed).toBe(1);
    cache.get(base, { ...ctx, engineVersion: '1.1.0' });
    expect(cache.computed).toBe(2);
  });

  it('is invalidated by a profile change: a new version, or edited limits under the same version', () => {
    const cache = new DerivedCache();
    const strictStability = { ...DEFAULT_PROFILE, id: 'project-x', version: 1 };
    cache.get(base, { ...ctx, profile: strictStability });
    cache.get(base, { ...ctx, profile: { ...strictStability } });
    expect(cache.computed).toBe(1);
    const v2 = { ...strictStability, version: 2, ranges: { ...strictStability.ranges, pH: [7.9, 8.0] as [number, number] } };
    const d2 = cache.get(base, { ...ctx, profile: v2 });
    expect(cache.computed).toBe(2);
    expect(d2).toEqual(deriveSample(base, DEFAULT_SETTINGS, v2));
    const sameVersionEdited = { ...v2, ranges: { ...v2.ranges, pH: [5, 9.5] as [number, number] } };
    cache.get(base, { ...ctx, profile: sameVersionEdited });
    expect(cache.computed).toBe(3);
  });

  it('is invalidated by a settings change that feeds the engine (activity model)', () => {
    const cache = new DerivedCache();
    const a = cache.get(base, ctx);
    const b = cache.get(base, { ...ctx, settings: { ...DEFAULT_SETTINGS, activityModel: 'davies' } });
    expect(cache.computed).toBe(2);
    expect(b.analysis!.activityModel).toBe('davies');
    expect(a).not.toBe(b);
  });

  it('keeps at most maxEntries results, dropping the least recently used', () => {
    const cache = new DerivedCache(2);
    const [s0, s1, s2] = samples as [Sample, Sample, Sample];
    cache.get(s0, ctx);
    cache.get(s1, ctx);
    cache.get(s0, ctx); // s0 now most recent
    cache.get(s2, ctx); // evicts s1
    expect(cache.size).toBe(2);
    cache.get(s0, ctx);
    expect(cache.computed).toBe(3);
    cache.get(s1, ctx);
    expect(cache.computed).toBe(4);
  });
});
