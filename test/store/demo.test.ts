// Expected values describe the invented demo scenario (source: src/demo/scenario.ts), not real data.
import { beforeEach, describe, expect, it } from 'vitest';
import { loadDemo } from '../../src/demo/load';
import { listDay, listSites, listCalibrationsForDay, removeDemo } from '../../src/store';
import { deriveSample } from '../../src/records/derive';
import { DEFAULT_SETTINGS } from '../../src/records/schema';
import { todayLocal } from '../../src/records/time';
import { freshDb } from './helpers';

beforeEach(freshDb);

describe('the invented demo scenario (Wrenfold Creek)', () => {
  it('loads valid records dated today and the two days before, and tells a coherent story', async () => {
    const n = await loadDemo();
    expect(n).toEqual({ sites: 3, samples: 9, checks: 9 });
    expect((await listSites()).map((s) => s.code)).toEqual(['WF-01', 'WF-02', 'WF-03']);
    const today = await listDay(todayLocal());
    expect(today).toHaveLength(3);
    expect(await listCalibrationsForDay(todayLocal())).toHaveLength(3);
    const byCode = Object.fromEntries((await listSites()).map((s) => [s.id, s.code]));
    const derived = today.map((s) => ({ code: byCode[s.siteId], d: deriveSample(s, DEFAULT_SETTINGS) }));
    for (const { d } of derived) {
      expect(d.error).toBeUndefined();
      expect(d.analysis!.calciteState).not.toBe('unknown');
      expect(d.stability.pH!.stable).toBe(true);
    }
    // the spring is CO2-rich and the water downstream gains SI as it degasses
    const spring = derived.find((x) => x.code === 'WF-02')!.d.analysis!;
    const weir = derived.find((x) => x.code === 'WF-03')!.d.analysis!;
    expect(spring.logPco2!).toBeGreaterThan(-2);
    expect(spring.warnings.map((w) => w.code)).toContain('si-will-rise-downstream');
    expect(weir.saturationIndex.calcite!).toBeGreaterThan(spring.saturationIndex.calcite!);
    expect(weir.calciteState).toBe('supersaturated');
  });
  it('the titrated spring sample has a Gran endpoint', async () => {
    await loadDemo();
    const days = [0, 1, 2].map((k) => {
      const d = new Date();
      d.setDate(d.getDate() - k);
      return todayLocal(d);
    });
    const all = (await Promise.all(days.map((d) => listDay(d)))).flat();
    const titrated = all.filter((s) => s.field.alkalinity?.kind === 'titration');
    expect(titrated.length).toBeGreaterThanOrEqual(1);
    const d = deriveSample(titrated[0]!, DEFAULT_SETTINGS);
    expect(d.titration!.method).toBe('gran');
    expect(d.titration!.alkalinityMgLCaCO3!).toBeGreaterThan(200);
  });
  it('is removable in one step', async () => {
    await loadDemo();
    await removeDemo();
    expect(await listSites()).toHaveLength(0);
    expect(await listDay(todayLocal())).toHaveLength(0);
  });
});
