// The one validation rule (src/records/validate.ts) at every entry point. Calendar facts only
// (24 h, 60 min, month lengths, UTC offsets within ±14:00: ISO 8601 and the IANA zone table, from memory).
import { beforeEach, describe, expect, it } from 'vitest';
import { isoTimeProblem, localDateProblem, samplingTimeProblem, validateLabResult, validateSample, fieldLabel } from '../../src/records/validate';
import { emptyForm, formToSample } from '../../src/ui/forms/sample-form';
import { getDb, listDay, listDays, restoreBackup, createBackup, saveSample, StoreError } from '../../src/store';
import { longCsv, wideCsv, parseCsv } from '../../src/exchange/csv';
import { enqueueUpload, listOutbox } from '../../src/exchange/outbox';
import { DEFAULT_SETTINGS } from '../../src/records/defaults';
import { freshDb, sampleAt } from '../store/helpers';

beforeEach(freshDb);

describe('isoTimeProblem: a real instant, not only the right shape', () => {
  it.each([
    ['2026-06-14T25:00:00-06:00', /hour 25/],
    ['2026-06-14T09:61:00-06:00', /minute 61/],
    ['2026-06-14T09:30:60-06:00', /second 60/],
    ['2026-02-30T09:30:00Z', /day 30 does not exist/],
    ['2026-13-01T09:30:00Z', /month 13/],
    ['2026-06-14T09:30:00+15:00', /offset 15:00/],
    ['2026-06-14 09:30', /ISO 8601/],
  ])('%s is refused with the reason', (t, why) => {
    expect(isoTimeProblem(t)).toMatch(why);
  });
  it.each(['2026-06-14T09:30:00-06:00', '2026-06-14T23:59:59.999Z', '2024-02-29T00:00+14:00', '2026-06-14T09:30-09:30'])('%s is accepted', (t) => {
    expect(isoTimeProblem(t)).toBeUndefined();
  });
  it('dates: 29 February only in leap years', () => {
    expect(localDateProblem('2024-02-29')).toBeUndefined();
    expect(localDateProblem('2026-02-29')).toMatch(/day 29/);
  });
});

describe('samplingTimeProblem: a year a sample can have', () => {
  it('a slip of the picker\'s year part (0025 for 2025) is refused, naming the year', () => {
    expect(samplingTimeProblem('0025-12-02T10:30:00-07:00')).toMatch(/year 0025 is before 1900; check the year/);
    expect(samplingTimeProblem('1899-12-31T23:59:00Z')).toMatch(/year 1899/);
  });
  it('real sampling times pass, and impossible instants keep their own reason', () => {
    expect(samplingTimeProblem('1900-01-01T00:00:00Z')).toBeUndefined();
    expect(samplingTimeProblem('2026-12-02T10:30:00-07:00')).toBeUndefined();
    expect(samplingTimeProblem('2026-06-14T25:00:00-06:00')).toMatch(/hour 25/);
  });
  it('the form and the stored schema refuse it on the sampling time', () => {
    const slip = '0025-12-02T10:30:00-07:00';
    const r = formToSample({ ...emptyForm(), siteId: 'site-1', time: slip, temp: [{ v: '9', t: '' }] });
    expect(r.errors.time).toMatch(/year 0025.*Correct the sampling time/);
    const v = validateSample({ ...sampleAt('2026-06-14T09:30:00-06:00'), time: slip, id: 's1', createdAt: '2026-06-14T09:00:00Z', updatedAt: '2026-06-14T09:00:00Z', localDate: '0025-12-02' });
    expect(v.ok).toBe(false);
    if (!v.ok) expect(v.fields.time).toMatch(/year 0025/);
  });
});

describe('the same rule at every entry point', () => {
  const bad = '2026-06-14T25:61:00-06:00';
  it('validateSample names the field', () => {
    const r = validateSample({ ...sampleAt(bad), id: 's1', createdAt: bad, updatedAt: '2026-06-14T09:00:00Z', localDate: '2026-06-14' });
    expect(r.ok).toBe(false);
    if (!r.ok) {
      expect(r.fields.time).toMatch(/hour 25/);
      expect(r.message).toMatch(/time \(sampling time\): Impossible time: hour 25/);
      expect(r.fields['field.tempC.values.0.time']).toMatch(/hour 25/);
    }
  });
  it('lab results (the importers call validateLabResult): impossible time and over-long text refused', () => {
    const r = validateLabResult({ parameter: 'Mg', value: 3, unit: 'mg/L', importedAt: bad, method: 'x'.repeat(201) });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(Object.keys(r.fields).sort()).toEqual(['importedAt', 'method']);
    expect(fieldLabel('lab.0.importedAt')).toBe('lab.0.importedAt (lab result import time)');
  });
  it('the form refuses an impossible time next to the field, so Save is blocked', () => {
    const r = formToSample({ ...emptyForm(), siteId: 'site-1', time: bad, temp: [{ v: '9', t: '' }] });
    expect(r.errors.time).toMatch(/hour 25 does not exist.*Correct the sampling time/);
  });
  it('the store refuses it before anything is stored, naming the field', async () => {
    const e = await saveSample(sampleAt(bad), 'T. Mills').catch((x: unknown) => x);
    expect(e).toBeInstanceOf(StoreError);
    expect((e as StoreError).kind).toBe('invalid');
    expect((e as StoreError).fields?.time).toMatch(/hour 25/);
    expect(await (await getDb()).count('samples')).toBe(0);
    expect(await (await getDb()).count('revisions')).toBe(0);
  });
  it('restore refuses a backup holding an impossible time, and stores nothing', async () => {
    await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills');
    const b = await createBackup();
    const text = JSON.stringify(b).replace(/2026-06-14T09:30:00-06:00/g, bad);
    await freshDb();
    const e = await restoreBackup(text).catch((x: unknown) => x);
    expect(String((e as Error).message)).toMatch(/damaged/);
    expect(((e as { problems: string[] }).problems).join(' ')).toMatch(/samples\[0\]: time \(sampling time\): Impossible time: hour 25/);
    expect(await (await getDb()).count('samples')).toBe(0);
  });
});

describe('a bad time stored before this rule never hides a day or breaks an export', () => {
  it('lists, exports (samples and values CSV) and queues for upload', async () => {
    const good = await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills');
    const raw = JSON.parse(JSON.stringify(good).replaceAll('09:30:00', '25:61:00'));
    raw.id = 'legacy-bad';
    raw.sampleCode = 'LEGACY-20260614-2561';
    await (await getDb()).put('samples', raw); // as an older version could have stored it
    expect((await listDay('2026-06-14')).map((s) => s.id).sort()).toEqual([good.id, 'legacy-bad'].sort());
    expect(await listDays()).toEqual([{ date: '2026-06-14', count: 2 }]);
    const samples = await listDay('2026-06-14');
    const wide = parseCsv(wideCsv({ samples, sites: [], settings: DEFAULT_SETTINGS }));
    const row = wide.rows.find((r) => r.sample_id === 'legacy-bad')!;
    expect(row.time_local).toBe('2026-06-14T25:61:00-06:00');
    expect(row.time_utc).toBe('');
    expect(row.input_error).toMatch(/time/);
    expect(wide.rows.find((r) => r.sample_id === good.id)!.time_utc).toBe('2026-06-14T15:30:00.000Z');
    expect(longCsv({ samples, sites: [], settings: DEFAULT_SETTINGS })).toMatch(/legacy-bad/);
    await enqueueUpload({ fileName: 'd.csv', contentType: 'text/csv', body: wideCsv({ samples, sites: [], settings: DEFAULT_SETTINGS }), sampleIds: samples.map((s) => s.id) });
    expect(await listOutbox()).toHaveLength(1);
  });
});
