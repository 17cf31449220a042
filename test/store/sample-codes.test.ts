// Readable sample codes: format, uniqueness on the device, kept through edits, given by migration.
// Expected codes follow our own format (records/sample-code.ts); the 35-character limit is the WQX
// Activity Identifier's field length (EPA WQX schema, memory).
// Source of the length limit: WQX Activity ID, 35 characters (npm `wqx` schema; from memory when this was written).
import { beforeEach, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { getDb, getSampleByCode, openBanksideDb, saveSample, saveSite } from '../../src/store';
import { baseSampleCode, cleanSiteCode, freeSampleCode, sampleLabelId, SAMPLE_CODE_MAX } from '../../src/records/sample-code';
import { Sample } from '../../src/records/schema';
import { freshDb, sampleAt } from './helpers';

beforeEach(freshDb);

describe('sample code format', () => {
  it('is site code, the local date and time as written, and a QC letter', () => {
    expect(baseSampleCode('WF-01', '2026-06-14T09:30:00-06:00')).toBe('WF-01-20260614-0930');
    expect(baseSampleCode('WF-01', '2026-06-14T23:50:00+13:00', 'replicate')).toBe('WF-01-20260614-2350-R');
    expect(baseSampleCode('wf 01/ü', '2026-06-14T09:30:00Z', 'blank')).toBe('WF-01-U-20260614-0930-B');
  });

  it('never exceeds 35 characters, even with a 40-character site code and a clash number', () => {
    const long = 'A-VERY-LONG-SITE-CODE-FROM-THE-OFFICE-XX';
    expect(long).toHaveLength(40);
    const base = baseSampleCode(long, '2026-06-14T09:30:00Z', 'replicate');
    expect(base).toBe('A-VERY-LONG-SITE-20260614-0930-R');
    const taken = new Set<string>();
    for (let i = 0; i < 1200; i++) {
      const code = freeSampleCode(base, taken);
      expect(taken.has(code)).toBe(false);
      expect(code.length).toBeLessThanOrEqual(SAMPLE_CODE_MAX);
      taken.add(code);
    }
    expect(taken.has('A-VERY-LONG-SITE-20260614-0930-R-99')).toBe(true);
    // from 100 on, the site part gives way: date, time, QC letter and number stay
    expect(taken.has('A-VERY-LONG-SIT-20260614-0930-R-100')).toBe(true);
    expect(taken.has('A-VERY-LONG-SI-20260614-0930-R-1200')).toBe(true);
    expect(cleanSiteCode('---')).toBe('SITE');
  });
});

describe('sample codes in the store', () => {
  it('gives each saved sample a unique code, keeps it through edits and finds a sample by it', async () => {
    await saveSite({ id: 'site-1', code: 'MC-02', name: 'Mill Creek', type: 'stream' }, 'T. Mills');
    const a = await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills');
    const b = await saveSample(sampleAt('2026-06-14T09:30:40-06:00'), 'T. Mills');
    const r = await saveSample(sampleAt('2026-06-14T09:31:00-06:00', { qc: { type: 'replicate', parentId: a.id } }), 'T. Mills');
    expect([a.sampleCode, b.sampleCode, r.sampleCode]).toEqual(['MC-02-20260614-0930', 'MC-02-20260614-0930-2', 'MC-02-20260614-0931-R']);
    // an edit (time moved, site renamed) keeps the code written on the bottle
    await saveSite({ id: 'site-1', code: 'MC-99', name: 'Mill Creek', type: 'stream' }, 'T. Mills');
    const edited = await saveSample({ ...a, time: '2026-06-14T10:00:00-06:00', sampleCode: undefined }, 'T. Mills');
    expect(edited.sampleCode).toBe('MC-02-20260614-0930');
    expect((await getSampleByCode('MC-02-20260614-0930-2'))?.id).toBe(b.id);
    expect(sampleLabelId(edited)).toBe('MC-02-20260614-0930');
  });

  it('refuses a second sample with a code already taken (a restore or import cannot duplicate it)', async () => {
    await saveSample(sampleAt('2026-06-14T09:30:00-06:00', { sampleCode: 'X-1' }), 'T. Mills');
    await expect(saveSample(sampleAt('2026-06-14T11:30:00-06:00', { sampleCode: 'X-1' }), 'T. Mills')).rejects.toThrow();
  });
});

describe('migration to version 3', () => {
  it('gives every existing sample (even from version 1) a code, in time order', async () => {
    const v1 = JSON.parse(readFileSync(join(__dirname, '../fixtures/store/v1-records.json'), 'utf8'));
    const db1 = await openBanksideDb({ version: 1 });
    const tx = db1.transaction(['sites', 'samples'] as never, 'readwrite');
    for (const s of v1.sites) await tx.objectStore('sites' as never).put(s as never);
    for (const s of v1.samples) await tx.objectStore('samples' as never).put(s as never);
    await tx.done;
    db1.close();
    const db = await getDb();
    const all = await db.getAll('samples');
    for (const s of all) expect(Sample.safeParse(s).success).toBe(true);
    // v1 times were stored as UTC: 1772359200000 ms = 2026-03-01T10:00:00Z
    expect(Object.fromEntries(all.map((s) => [s.id, s.sampleCode]))).toEqual({
      's-v1-1': 'OLD-1-20260301-1000',
      's-v1-2': 'OLD-1-20260301-1200',
      's-v1-3': 'OLD-1-20260302-1000',
    });
  });
});
