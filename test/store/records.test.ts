import { beforeEach, describe, expect, it } from 'vitest';
import {
  deleteSample,
  getDb,
  getDraft,
  getSample,
  history,
  listDay,
  listDays,
  listSites,
  onChange,
  putDraft,
  removeDemo,
  restoreSample,
  saveSample,
  saveSite,
  StoreError,
  getSettings,
  saveSettings,
} from '../../src/store';
import { Sample } from '../../src/records/schema';
import { freshDb, sampleAt } from './helpers';

beforeEach(freshDb);

describe('samples: save, list by day, revisions', () => {
  it('saves a sample with raw entries and lists it under its local date', async () => {
    const s = await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills');
    expect(s.id).toMatch(/^sample-/);
    expect(s.localDate).toBe('2026-06-14');
    expect(s.revision).toBe(1);
    expect(Sample.parse(await getSample(s.id))).toEqual(s);
    // the raw EC, its temperature and alpha are kept, not only SC at 25 °C
    expect(s.field.conductance).toMatchObject({ mode: 'ec', tempC: 9.4, alpha: 0.0191, values: [{ value: 301 }] });
    await saveSample(sampleAt('2026-06-14T07:10:00-06:00'), 'T. Mills');
    await saveSample(sampleAt('2026-06-15T08:00:00-06:00'), 'T. Mills');
    const day = await listDay('2026-06-14');
    expect(day.map((x) => x.time)).toEqual(['2026-06-14T07:10:00-06:00', '2026-06-14T09:30:00-06:00']);
    expect(await listDays()).toEqual([{ date: '2026-06-15', count: 1 }, { date: '2026-06-14', count: 2 }]);
  });

  it('stores the IANA time zone with each new sample and keeps it through an edit made elsewhere', async () => {
    const zone = Intl.DateTimeFormat().resolvedOptions().timeZone;
    const s = await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills');
    expect(s.timeZone).toBe(zone);
    const stored = { ...s, timeZone: 'America/Denver' };
    await saveSample(stored, 'T. Mills');
    const { timeZone: _dropped, ...edited } = { ...stored, remarks: 'edited on a laptop in another zone' };
    expect((await saveSample(edited, 'J. Reyes')).timeZone).toBe('America/Denver');
  });

  it('an edit appends a revision with who, when and exactly what changed', async () => {
    const s = await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills');
    const edited = structuredClone(s);
    edited.field.pH!.values[0]!.value = 7.95;
    edited.remarks = 'pH re-read after buffer check';
    const after = await saveSample(edited, 'J. Reyes');
    expect(after.revision).toBe(2);
    expect(after.createdAt).toBe(s.createdAt);
    const h = await history(s.id);
    expect(h.map((r) => [r.action, r.by])).toEqual([['create', 'T. Mills'], ['update', 'J. Reyes']]);
    expect(h[1]!.changes).toEqual(
      expect.arrayContaining([
        { path: 'field.pH.values.0.value', from: 7.81, to: 7.95 },
        { path: 'remarks', from: '', to: 'pH re-read after buffer check' },
      ]),
    );
    expect(h[1]!.changes).toHaveLength(2);
  });

  it('delete is soft and undoable, and both are in the history', async () => {
    const s = await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills');
    await deleteSample(s.id, 'T. Mills');
    expect(await listDay('2026-06-14')).toHaveLength(0);
    expect((await getSample(s.id))!.deletedAt).toBeDefined();
    await restoreSample(s.id, 'T. Mills');
    expect(await listDay('2026-06-14')).toHaveLength(1);
    expect((await history(s.id)).map((r) => r.action)).toEqual(['create', 'delete', 'restore']);
  });

  it('refuses an invalid sample, names the field, and stores nothing', async () => {
    const bad = sampleAt('2026-06-14 09:30');
    try {
      await saveSample(bad, 'T. Mills');
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(StoreError);
      expect((e as StoreError).kind).toBe('invalid');
      expect(Object.keys((e as StoreError).fields!)).toContain('time');
    }
    const db = await getDb();
    expect(await db.count('samples')).toBe(0);
    expect(await db.count('revisions')).toBe(0);
  });
});

describe('drafts, settings, sites, change notices', () => {
  it('keeps a draft as typed (raw strings) until removed', async () => {
    await putDraft({ id: 'draft:new-sample', kind: 'sample', form: { pH: '7,8', tempC: '9.4', remarks: 'wading, knee deep' } });
    const d = await getDraft('draft:new-sample');
    expect(d!.form).toEqual({ pH: '7,8', tempC: '9.4', remarks: 'wading, knee deep' });
  });
  it('the schema-free defaults equal the schema’s own defaults', async () => {
    const { Settings, DEFAULT_SETTINGS } = await import('../../src/records/schema');
    expect(DEFAULT_SETTINGS).toEqual(Settings.parse({ id: 'settings' }));
  });
  it('settings default until saved, then persist', async () => {
    expect((await getSettings()).conductanceFactor).toBe(1.5e-5);
    await saveSettings({ id: 'settings', operator: 'T. Mills', activityModel: 'davies' });
    expect((await getSettings()).activityModel).toBe('davies');
    await expect(saveSettings({ id: 'settings', conductanceFactor: 1 })).rejects.toThrow(/conductanceFactor/);
  });
  it('announces changes to this tab and to other tabs (BroadcastChannel)', async () => {
    const seen: string[] = [];
    const off = onChange((n) => seen.push(n.store));
    const other = new BroadcastChannel('bankside-changes');
    const fromOtherTab = new Promise<{ store: string }>((resolve) => (other.onmessage = (ev) => resolve(ev.data)));
    await saveSite({ code: 'WF-01', name: 'Footbridge', type: 'stream' }, 'T. Mills');
    expect(seen).toContain('sites');
    expect((await fromOtherTab).store).toBe('sites');
    other.close();
    off();
    expect((await listSites()).map((s) => s.code)).toEqual(['WF-01']);
  });
  it('removes the demo scenario and its history, leaving real records alone', async () => {
    await saveSite({ code: 'DEMO-1', name: 'Demo', type: 'stream', demo: true }, 'demo');
    await saveSite({ code: 'REAL-1', name: 'Real', type: 'spring' }, 'T. Mills');
    await saveSample({ ...sampleAt('2026-06-14T09:30:00-06:00'), demo: true }, 'demo');
    expect(await removeDemo()).toBe(2);
    expect((await listSites()).map((s) => s.code)).toEqual(['REAL-1']);
    expect(await listDay('2026-06-14')).toHaveLength(0);
  });
});

describe('method profiles in the store', () => {
  it('keeps every version, lists the newest, and refuses a broken profile', async () => {
    const { saveProfile, listProfiles, getActiveProfile } = await import('../../src/store');
    const { DEFAULT_PROFILE } = await import('../../src/chemistry');
    const v1 = { ...structuredClone(DEFAULT_PROFILE), id: 'project-x', version: 1, name: 'Project X' };
    await saveProfile(v1);
    const v2 = structuredClone(v1);
    v2.version = 2;
    v2.phCalibration.slopeMinPercent = 92;
    await saveProfile(v2);
    expect((await listProfiles()).map((p) => `${p.id}@${p.version}`)).toEqual(['bankside-default@1', 'project-x@2']);
    expect((await getActiveProfile('project-x')).phCalibration.slopeMinPercent).toBe(92);
    expect((await getActiveProfile('gone')).id).toBe('bankside-default');
    expect(await (await getDb()).count('profiles')).toBe(2);
    await expect(saveProfile({ ...v2, version: 3, stabilization: { ...v2.stabilization, readings: 1 } })).rejects.toThrow(/at least 3 readings/);
  });
});
