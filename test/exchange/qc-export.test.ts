// QC verdicts and sample codes in the samples CSV. Values are made up; the limits are the default
// profile's (5 % RPD or 5 µS/cm for SC, blank SC ≤ 5 µS/cm; common practice, our choice).
import { beforeEach, describe, expect, it } from 'vitest';
import { parseCsv, wideCsv } from '../../src/exchange/csv';
import { DEFAULT_SETTINGS } from '../../src/records/defaults';
import { listDay, saveSample, saveSite } from '../../src/store';
import { freshDb, sampleAt } from '../store/helpers';

beforeEach(freshDb);

const sc = (time: string, value: number) => ({ mode: 'sc' as const, unit: 'uS/cm' as const, alpha: 0.0191, values: [{ time, value }] });

describe('QC in the samples CSV', () => {
  it('writes the parent’s code and the verdict of a replicate and a blank', async () => {
    await saveSite({ id: 'site-1', code: 'WF-01', name: 'Upper footbridge', type: 'stream' }, 'crew');
    const t0 = '2026-06-14T09:30:00-06:00';
    const parent = await saveSample(sampleAt(t0, { field: { ...sampleAt(t0).field, conductance: sc(t0, 400) } }), 'crew');
    const t1 = '2026-06-14T09:35:00-06:00';
    await saveSample(sampleAt(t1, { qc: { type: 'replicate', parentId: parent.id }, field: { ...sampleAt(t1).field, conductance: sc(t1, 440) } }), 'crew');
    const t2 = '2026-06-14T09:40:00-06:00';
    await saveSample({ siteId: 'site-1', time: t2, qc: { type: 'blank', parentId: parent.id }, field: { tempC: { values: [{ time: t2, value: 12 }] }, conductance: sc(t2, 1.8), kits: [], ions: {} } }, 'crew');
    const { rows } = parseCsv(wideCsv({ samples: await listDay('2026-06-14'), sites: [], settings: DEFAULT_SETTINGS }));
    const [env, rep, blank] = rows;
    expect([env!.sample_code, rep!.sample_code, blank!.sample_code]).toEqual(['WF-01-20260614-0930', 'WF-01-20260614-0935-R', 'WF-01-20260614-0940-B']);
    expect(env!.qc_verdict).toBe('');
    expect(rep!.qc_parent_code).toBe('WF-01-20260614-0930');
    // SC 440 vs 400: RPD 100·40/420 = 9.5 % > 5 % and 40 > 5 µS/cm
    expect(rep!.qc_verdict).toBe('fail');
    expect(rep!.qc_detail).toContain('FAIL SC 440 vs 400: RPD 9.5 % (difference 40.0 µS/cm), allowed 5 % or 5 µS/cm.');
    expect(blank!.qc_verdict).toBe('pass');
    expect(blank!.qc_detail).toBe('ok SC 1.80 µS/cm in the blank, allowed up to 5 µS/cm.');
    expect(blank!.qc_profile).toBe('bankside-default v1');
  });
});
