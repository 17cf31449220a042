// Two tabs, revisions and drafts: a save over a newer revision is refused with the newer record
// (never a silent overwrite); Save removes its draft in the same transaction; per-tab drafts.
import { beforeEach, describe, expect, it } from 'vitest';
import { adoptOrphanDraft, getDb, getDraft, getSample, history, putDraft, saveSample, StoreError, saveProfile, getProfileVersion, rejudgeSample, profileLookup } from '../../src/store';
import { DEFAULT_PROFILE, type MethodProfile } from '../../src/chemistry';
import { freshDb, sampleAt } from './helpers';

beforeEach(freshDb);

describe('saves carry the revision they started from', () => {
  it('a save over a newer revision is refused with the newer record; keep mine then goes through', async () => {
    const s = await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills');
    expect(s.revision).toBe(1);
    // tab B saves first
    const b = await saveSample({ ...s, remarks: 'from tab B' }, 'J. Reyes', { expectedRevision: 1 });
    expect(b.revision).toBe(2);
    // tab A, which started from revision 1, is refused
    const e = await saveSample({ ...s, remarks: 'from tab A' }, 'T. Mills', { expectedRevision: 1 }).catch((x: unknown) => x);
    expect(e).toBeInstanceOf(StoreError);
    expect((e as StoreError).kind).toBe('conflict');
    expect(((e as StoreError).current as { remarks: string }).remarks).toBe('from tab B');
    expect((await getSample(s.id))!.remarks).toBe('from tab B');
    // the crew chose "keep mine" having seen revision 2
    const a = await saveSample({ ...s, remarks: 'from tab A' }, 'T. Mills', { expectedRevision: 2 });
    expect(a.revision).toBe(3);
    const h = await history(s.id);
    expect(h.map((r) => r.action)).toEqual(['create', 'update', 'update']);
    expect(h[2]!.changes).toContainEqual({ path: 'remarks', from: 'from tab B', to: 'from tab A' });
  });

  it('Save and the removal of its draft are one transaction: both or neither', async () => {
    await putDraft({ id: 'draft:sample:new:tab-a', kind: 'sample', form: { siteId: 'site-1' } });
    const s = await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills', { draftId: 'draft:sample:new:tab-a' });
    expect(await getDraft('draft:sample:new:tab-a')).toBeUndefined();
    expect(await getSample(s.id)).toBeDefined();
    // a refused save leaves the draft where it was
    await putDraft({ id: 'draft:sample:x:tab-a', kind: 'sample', form: { siteId: 'site-1' } });
    await saveSample({ ...s, remarks: 'late' }, 'T. Mills', { expectedRevision: 7, draftId: 'draft:sample:x:tab-a' }).catch(() => undefined);
    expect(await getDraft('draft:sample:x:tab-a')).toBeDefined();
  });
});

describe('drafts are kept per tab', () => {
  it('two tabs keep separate new-sample drafts; a dead tab’s draft is adopted once, a live tab’s never', async () => {
    await putDraft({ id: 'draft:sample:new:tab-a', kind: 'sample', form: { pH: '7.1' } });
    await putDraft({ id: 'draft:sample:new:tab-b', kind: 'sample', form: { pH: '8.2' } });
    expect((await getDraft('draft:sample:new:tab-a'))!.form).toEqual({ pH: '7.1' });
    expect((await getDraft('draft:sample:new:tab-b'))!.form).toEqual({ pH: '8.2' });
    // tab C opens while A and B live: nothing to adopt
    expect(await adoptOrphanDraft('draft:sample:new', 'draft:sample:new:tab-c', new Set(['tab-a', 'tab-b', 'tab-c']))).toBeUndefined();
    // B was killed: C takes over B's draft (moved, not copied)
    const got = await adoptOrphanDraft('draft:sample:new', 'draft:sample:new:tab-c', new Set(['tab-a', 'tab-c']));
    expect(got!.form).toEqual({ pH: '8.2' });
    expect(await getDraft('draft:sample:new:tab-b')).toBeUndefined();
    expect((await getDraft('draft:sample:new:tab-c'))!.form).toEqual({ pH: '8.2' });
    expect((await getDraft('draft:sample:new:tab-a'))!.form).toEqual({ pH: '7.1' });
  });
  it('a draft from before per-tab keys is adopted too', async () => {
    await putDraft({ id: 'draft:sample:new', kind: 'sample', form: { pH: '6.9' } });
    expect((await adoptOrphanDraft('draft:sample:new', 'draft:sample:new:tab-z', new Set(['tab-z'])))!.form).toEqual({ pH: '6.9' });
    expect(await (await getDb()).count('drafts')).toBe(1);
  });
});

describe('verdicts belong to the profile version they were judged under', () => {
  const edited = (v: number): MethodProfile => ({ ...structuredClone(DEFAULT_PROFILE), id: 'project-x', name: 'Project X', version: v });
  it('a stored version is immutable; the next version is a new record; the default cannot be overwritten', async () => {
    await saveProfile(edited(1));
    const changed = edited(1);
    changed.phCalibration.slopeMinPercent = 90;
    await expect(saveProfile(changed)).rejects.toThrow(/already stored.*version 2/);
    await saveProfile(edited(1)); // the same content again is harmless
    changed.version = 2;
    await saveProfile(changed);
    expect((await getProfileVersion('project-x', 1))!.phCalibration.slopeMinPercent).toBe(DEFAULT_PROFILE.phCalibration.slopeMinPercent);
    expect((await getProfileVersion('project-x', 2))!.phCalibration.slopeMinPercent).toBe(90);
    const tweakedDefault = structuredClone(DEFAULT_PROFILE);
    tweakedDefault.calibrationWindowHours = 1;
    await expect(saveProfile(tweakedDefault)).rejects.toThrow(/already stored/);
  });
  it('a sample keeps its version until it is re-judged explicitly, with a revision', async () => {
    await saveProfile(edited(1));
    const s = await saveSample({ ...sampleAt('2026-06-14T09:30:00-06:00'), profileId: 'project-x', profileVersion: 1 }, 'T. Mills');
    const v2 = edited(2);
    v2.stabilization.readings = 3;
    await saveProfile(v2);
    const lookup = await profileLookup();
    expect(lookup(s)!.version).toBe(1);
    const r = await rejudgeSample(s.id, v2, 'T. Mills');
    expect([r.profileId, r.profileVersion, r.revision]).toEqual(['project-x', 2, 2]);
    const last = (await history(s.id)).at(-1)!;
    expect(last.changes[0]).toEqual({ path: '(note)', from: null, to: 're-judged under Project X v2 (was project-x v1)' });
    expect(last.changes).toContainEqual({ path: 'profileVersion', from: 1, to: 2 });
  });
});
