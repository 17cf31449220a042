// Repositories: every write validates with zod, appends a revision (who, when, what changed) in
// the same transaction, and announces the change to other tabs. Deletes are soft and undoable.
import type { z } from 'zod';
import type {
  CalibrationEvent,
  Draft,
  FieldDay,
  Instrument,
  LabResult,
  Revision as RevisionT,
  Sample,
  Settings,
  Site,
} from '../records/schema';
import { DEFAULT_SETTINGS } from '../records/defaults';
import { DEFAULT_PROFILE, profileProblems, type MethodProfile } from '../chemistry';

/**
 * The schemas and the shared validation rule (records/validate.ts) load on the first write, not
 * with the first screen (they are most of the bundle).
 */
let schemas: Promise<typeof import('../records/validate')> | null = null;
export function loadSchemas(): Promise<typeof import('../records/validate')> {
  return (schemas ??= import('../records/validate'));
}
import { diff } from '../records/diff';
import { currentTimeZone, isoWithOffset, newId, nextSeq } from '../records/time';
import { baseSampleCode, freeSampleCode } from '../records/sample-code';
import { getDb, notifyChange } from './connection';
import type { BanksideDB, Db } from './db';

export class StoreError extends Error {
  constructor(
    readonly kind: 'quota' | 'invalid' | 'not-found' | 'closed' | 'conflict' | 'other',
    message: string,
    override readonly cause?: unknown,
    /** for 'invalid': field path → message */
    readonly fields?: Record<string, string>,
    /** for 'conflict': the newer stored record the save would have overwritten */
    readonly current?: unknown,
  ) {
    super(message);
    this.name = 'StoreError';
  }
}

/** QuotaExceededError in any of its guises (DOMException name, legacy code 22, Firefox's name). */
export function isQuotaError(e: unknown): boolean {
  if (!e || typeof e !== 'object') return false;
  const err = e as { name?: string; code?: number; inner?: unknown; cause?: unknown };
  return (
    err.name === 'QuotaExceededError' ||
    err.name === 'NS_ERROR_DOM_QUOTA_REACHED' ||
    err.code === 22 ||
    isQuotaError(err.inner) ||
    (err.cause !== e && isQuotaError(err.cause))
  );
}

export function toStoreError(e: unknown): StoreError {
  if (e instanceof StoreError) return e;
  if (isQuotaError(e)) {
    return new StoreError(
      'quota',
      'The phone’s storage for Bankside is full, so this was NOT saved. Your entry is still on screen: export it now, then free space (old photos, other apps) or send older days to the office.',
      e,
    );
  }
  if (e && typeof e === 'object' && (e as { name?: string }).name === 'InvalidStateError') {
    return new StoreError('closed', 'The database was closed (another tab is updating Bankside). Reload this tab.', e);
  }
  return new StoreError('other', `Could not save: ${e instanceof Error ? e.message : String(e)}`, e);
}

function parseOrThrow<T>(V: Awaited<ReturnType<typeof loadSchemas>>, schema: z.ZodType<T>, value: unknown, what: string): T {
  const r = V.validateWith(schema, value, what);
  if (!r.ok) throw new StoreError('invalid', r.message, undefined, r.fields);
  return r.value;
}

type Entity = RevisionT['entity'];
type EntityStore = 'samples' | 'sites' | 'calibrations' | 'instruments' | 'fieldDays';
const STORE_OF: Record<Entity, EntityStore> = {
  sample: 'samples',
  site: 'sites',
  calibration: 'calibrations',
  instrument: 'instruments',
  fieldDay: 'fieldDays',
};

interface WithMeta {
  id: string;
  createdAt: string;
  updatedAt: string;
  deletedAt?: string | undefined;
  revision?: number;
}

function revisionOf(entity: Entity, entityId: string, at: string, by: string, action: RevisionT['action'], changes: RevisionT['changes']): RevisionT {
  return { id: newId('rev'), entity, entityId, at, seq: nextSeq(), by, action, changes };
}

export interface PutOptions {
  action?: RevisionT['action'];
  /**
   * The revision the edit started from. When the stored record has moved on (another tab or a
   * restore saved it meanwhile) the save is refused with StoreError('conflict') carrying the newer
   * record, so the caller can ask the crew: keep mine / keep theirs / keep both. Never overwritten silently.
   */
  expectedRevision?: number;
  /** a draft to delete in the same transaction as the save (a kill just after Save leaves no duplicate) */
  draftId?: string;
  /** a note kept in the revision, e.g. "restored from backup of 2026-06-14" */
  note?: string;
}

/**
 * Create or update an entity, appending a revision with the changed fields. Returns the stored value.
 * The revision and the record (and the draft it came from) are written in one transaction: all or none.
 */
async function putWithRevision<T extends WithMeta>(entity: Entity, input: unknown, by: string, opts: PutOptions = {}, dbArg?: Db): Promise<T> {
  const storeName = STORE_OF[entity];
  const now = isoWithOffset();
  const raw = { ...(input as Record<string, unknown>) };
  if (!raw.id) raw.id = newId(entity);
  if (!raw.createdAt) raw.createdAt = now;
  raw.updatedAt = now;
  const db = dbArg ?? (await getDb());
  const S = await loadSchemas();
  const SCHEMA_OF = { samples: S.Sample, sites: S.Site, calibrations: S.CalibrationEvent, instruments: S.Instrument, fieldDays: S.FieldDay } as const;
  try {
    const stores: Array<EntityStore | 'revisions' | 'drafts'> = [storeName, 'revisions'];
    if (opts.draftId) stores.push('drafts');
    const tx = db.transaction(stores, 'readwrite');
    tx.done.catch(() => undefined); // a failed write aborts the transaction: the error that matters is thrown below
    const store = tx.objectStore(storeName);
    const before = (await store.get(raw.id as string)) as T | undefined;
    if (before && opts.expectedRevision !== undefined && (before.revision ?? 1) !== opts.expectedRevision) {
      throw new StoreError(
        'conflict',
        `This ${entity} was changed elsewhere (another tab or a restore) since you opened it: it is now at revision ${before.revision ?? 1}, you started from ${opts.expectedRevision}. Nothing was overwritten.`,
        undefined,
        undefined,
        before,
      );
    }
    if (before) {
      raw.createdAt = before.createdAt;
      if (entity === 'sample') raw.revision = (before.revision ?? 1) + 1;
    }
    const value = parseOrThrow(S, SCHEMA_OF[storeName] as unknown as z.ZodType<T>, raw, entity);
    const changes = before
      ? diff(before, value).filter((c) => c.path !== 'updatedAt' && c.path !== 'revision')
      : [{ path: '', from: null, to: 'created' }];
    if (opts.note) changes.unshift({ path: '(note)', from: null, to: opts.note });
    await store.put(value as never);
    await tx.objectStore('revisions').put(S.Revision.parse(revisionOf(entity, value.id, now, by, opts.action ?? (before ? 'update' : 'create'), changes)));
    if (opts.draftId) await tx.objectStore('drafts').delete(opts.draftId);
    await tx.done;
    notifyChange({ store: storeName, ids: [value.id] });
    return value;
  } catch (e) {
    throw toStoreError(e);
  }
}

async function setDeleted(entity: Entity, id: string, deleted: boolean, by: string): Promise<void> {
  const db = await getDb();
  const current = (await db.get(STORE_OF[entity], id)) as WithMeta | undefined;
  if (!current) throw new StoreError('not-found', `No ${entity} ${id}.`);
  const next: Record<string, unknown> = { ...current };
  if (deleted) next.deletedAt = isoWithOffset();
  else delete next.deletedAt;
  await putWithRevision(entity, next, by, { action: deleted ? 'delete' : 'restore' }, db);
}

// ---------------- samples ----------------

export type SampleInputRecord = Omit<z.input<typeof import('../records/schema').Sample>, 'id' | 'createdAt' | 'updatedAt' | 'localDate'> & {
  id?: string;
  createdAt?: string;
  localDate?: string;
};

export async function saveSample(sample: SampleInputRecord, by: string, opts: PutOptions = {}): Promise<Sample> {
  const withDate = { ...sample, localDate: sample.localDate ?? (typeof sample.time === 'string' ? sample.time.slice(0, 10) : undefined) };
  // the IANA zone the sample was recorded in: given to a new sample from this device, kept through edits
  if (withDate.timeZone === undefined) {
    const existing = sample.id ? await getSample(sample.id) : undefined;
    const zone = existing ? existing.timeZone : currentTimeZone();
    if (zone) withDate.timeZone = zone;
  }
  for (let attempt = 0; ; attempt++) {
    try {
      return await putWithRevision<Sample>('sample', { ...withDate, sampleCode: await codeFor(withDate) }, by, opts);
    } catch (e) {
      // another tab took the same code between our look-up and our write: look again, once
      const constraint = e instanceof StoreError && (e.cause as { name?: string } | undefined)?.name === 'ConstraintError';
      if (!constraint || attempt > 0 || sample.sampleCode) throw e;
    }
  }
}

/**
 * The sample's readable code: the one given (an import or restore), else the one it already has
 * (a code written on a bottle never changes through edits), else a new one free on this device.
 */
async function codeFor(sample: SampleInputRecord): Promise<string | undefined> {
  if (sample.sampleCode) return sample.sampleCode;
  const db = await getDb();
  if (sample.id) {
    const before = await db.get('samples', sample.id);
    if (before?.sampleCode) return before.sampleCode;
  }
  if (typeof sample.time !== 'string' || !sample.siteId) return undefined;
  const site = await db.get('sites', sample.siteId);
  const base = baseSampleCode(site?.code ?? 'SITE', sample.time, sample.qc?.type ?? 'environmental');
  // codes that start with the base (deleted samples keep theirs: a bottle may carry it)
  const clashes = await db.getAllFromIndex('samples', 'sampleCode', IDBKeyRange.bound(base, `${base}\uffff`));
  const taken = new Set(clashes.map((c) => c.sampleCode!));
  return freeSampleCode(base, taken);
}

/**
 * Add lab results to several samples in ONE transaction: every sample gets its results and an
 * 'import' revision, or (any sample missing, deleted or invalid, or the disk full) none does.
 */
export async function addLabResults(additions: ReadonlyArray<{ sampleId: string; lab: LabResult[] }>, by: string): Promise<Sample[]> {
  const db = await getDb();
  const S = await loadSchemas();
  const now = isoWithOffset();
  const tx = db.transaction(['samples', 'revisions'], 'readwrite');
  tx.done.catch(() => undefined); // the error that matters is thrown below
  try {
    const stored: Sample[] = [];
    for (const { sampleId, lab } of additions) {
      const before = await tx.objectStore('samples').get(sampleId);
      if (!before) throw new StoreError('not-found', `Sample ${sampleId} is not on this phone: nothing was stored.`);
      if (before.deletedAt) throw new StoreError('invalid', `Sample ${before.sampleCode ?? sampleId} was deleted: restore it before adding lab values. Nothing was stored.`);
      const value = parseOrThrow(S, S.Sample, { ...before, lab: [...before.lab, ...lab], updatedAt: now, revision: (before.revision ?? 1) + 1 }, 'sample');
      await tx.objectStore('samples').put(value);
      const changes = diff(before, value).filter((c) => c.path !== 'updatedAt' && c.path !== 'revision');
      await tx.objectStore('revisions').put(S.Revision.parse(revisionOf('sample', sampleId, now, by, 'import', changes)));
      stored.push(value);
    }
    await tx.done;
    notifyChange({ store: 'samples', ids: stored.map((x) => x.id) });
    return stored;
  } catch (e) {
    try {
      tx.abort();
    } catch {
      // already aborted (a failed write) or finished
    }
    throw toStoreError(e);
  }
}

/** A sample by its readable code (as written on a bottle or scanned from a label). */
export async function getSampleByCode(code: string): Promise<Sample | undefined> {
  return (await getDb()).getFromIndex('samples', 'sampleCode', code);
}

export async function getSample(id: string): Promise<Sample | undefined> {
  return (await getDb()).get('samples', id);
}

/** One day's samples (not deleted), by time. */
export async function listDay(localDate: string, opts: { includeDeleted?: boolean } = {}): Promise<Sample[]> {
  const all = await (await getDb()).getAllFromIndex('samples', 'localDate', localDate);
  return all.filter((s) => opts.includeDeleted || !s.deletedAt).sort((a, b) => Date.parse(a.time) - Date.parse(b.time));
}

export async function listSamplesBetween(fromDate: string, toDate: string): Promise<Sample[]> {
  const all = await (await getDb()).getAllFromIndex('samples', 'localDate', IDBKeyRange.bound(fromDate, toDate));
  return all.filter((s) => !s.deletedAt).sort((a, b) => Date.parse(a.time) - Date.parse(b.time));
}

export async function listSamplesForSite(siteId: string): Promise<Sample[]> {
  const all = await (await getDb()).getAllFromIndex('samples', 'siteId', siteId);
  return all.filter((s) => !s.deletedAt).sort((a, b) => Date.parse(a.time) - Date.parse(b.time));
}

/** Days that have samples, newest first, with counts. */
export async function listDays(): Promise<Array<{ date: string; count: number }>> {
  const db = await getDb();
  const counts = new Map<string, number>();
  let cursor = await db.transaction('samples').store.index('localDate').openCursor();
  while (cursor) {
    if (!cursor.value.deletedAt) counts.set(cursor.key as string, (counts.get(cursor.key as string) ?? 0) + 1);
    cursor = await cursor.continue();
  }
  return [...counts.entries()].map(([date, count]) => ({ date, count })).sort((a, b) => (a.date < b.date ? 1 : -1));
}

export const deleteSample = (id: string, by: string) => setDeleted('sample', id, true, by);
export const restoreSample = (id: string, by: string) => setDeleted('sample', id, false, by);

export async function history(entityId: string): Promise<RevisionT[]> {
  const revs = await (await getDb()).getAllFromIndex('revisions', 'entityId', entityId);
  return revs.sort((a, b) => a.seq - b.seq);
}

// ---------------- sites, instruments, calibrations, field days ----------------

export type SiteInput = Omit<z.input<typeof import('../records/schema').Site>, 'id' | 'createdAt' | 'updatedAt'> & { id?: string };
export const saveSite = (site: SiteInput, by: string) => putWithRevision<Site>('site', site, by);
export async function listSites(): Promise<Site[]> {
  const all = await (await getDb()).getAll('sites');
  return all.filter((s) => !s.deletedAt).sort((a, b) => a.code.localeCompare(b.code));
}
export const getSite = async (id: string) => (await getDb()).get('sites', id);
export const deleteSite = (id: string, by: string) => setDeleted('site', id, true, by);

export type InstrumentInput = Omit<z.input<typeof import('../records/schema').Instrument>, 'id' | 'createdAt' | 'updatedAt'> & { id?: string };
export const saveInstrument = (i: InstrumentInput, by: string) => putWithRevision<Instrument>('instrument', i, by);
export async function listInstruments(): Promise<Instrument[]> {
  return (await (await getDb()).getAll('instruments')).filter((i) => !i.deletedAt).sort((a, b) => a.name.localeCompare(b.name));
}

export type CalibrationInput = Omit<z.input<typeof import('../records/schema').CalibrationEvent>, 'id' | 'createdAt' | 'updatedAt' | 'localDate'> & { id?: string; localDate?: string };
export const saveCalibration = (c: CalibrationInput, by: string) =>
  putWithRevision<CalibrationEvent>('calibration', { ...c, localDate: c.localDate ?? c.time.slice(0, 10) }, by);
export async function listCalibrationsForDay(localDate: string): Promise<CalibrationEvent[]> {
  const all = await (await getDb()).getAllFromIndex('calibrations', 'localDate', localDate);
  return all.filter((c) => !c.deletedAt).sort((a, b) => Date.parse(a.time) - Date.parse(b.time));
}
export async function listCalibrations(): Promise<CalibrationEvent[]> {
  return (await (await getDb()).getAll('calibrations')).filter((c) => !c.deletedAt).sort((a, b) => Date.parse(a.time) - Date.parse(b.time));
}

export type FieldDayInput = Omit<z.input<typeof import('../records/schema').FieldDay>, 'id' | 'createdAt' | 'updatedAt'> & { id?: string };
export const saveFieldDay = (d: FieldDayInput, by: string) => putWithRevision<FieldDay>('fieldDay', d, by);
/** The field-day record of a date (its meters, its chain of custody), if one was made. */
export async function getFieldDay(date: string): Promise<FieldDay | undefined> {
  const all = await (await getDb()).getAllFromIndex('fieldDays', 'date', date);
  return all.filter((d) => !d.deletedAt).sort((a, b) => a.createdAt.localeCompare(b.createdAt))[0];
}
/** Change the date's field-day record (made on first use), keeping whatever else it holds. */
export async function updateFieldDay(date: string, patch: Partial<FieldDayInput>, by: string): Promise<FieldDay> {
  const current = await getFieldDay(date);
  return saveFieldDay({ ...(current ?? { date }), ...patch, date }, by);
}

// ---------------- settings ----------------

export async function getSettings(): Promise<Settings> {
  const s = await (await getDb()).get('settings', 'settings');
  return s ? { ...DEFAULT_SETTINGS, ...s, units: { ...DEFAULT_SETTINGS.units, ...s.units }, office: { ...DEFAULT_SETTINGS.office, ...s.office } } : DEFAULT_SETTINGS;
}

export async function saveSettings(next: z.input<typeof import('../records/schema').Settings>): Promise<Settings> {
  const V = await loadSchemas();
  const value = parseOrThrow(V, V.Settings, next, 'settings');
  try {
    await (await getDb()).put('settings', value);
  } catch (e) {
    throw toStoreError(e);
  }
  notifyChange({ store: 'settings', ids: ['settings'] });
  return value;
}

// ---------------- drafts ----------------

export async function putDraft(draft: Omit<z.input<typeof import('../records/schema').Draft>, 'updatedAt'>): Promise<void> {
  const V = await loadSchemas();
  const value = parseOrThrow(V, V.Draft, { ...draft, updatedAt: isoWithOffset() }, 'draft');
  try {
    await (await getDb()).put('drafts', value);
  } catch (e) {
    throw toStoreError(e);
  }
}
export const getDraft = async (id: string) => (await getDb()).get('drafts', id);

/**
 * A draft left by a tab that is gone: one under `prefix` (e.g. "draft:sample:new") whose tab
 * suffix is not among `liveTabs`, the newest first. It is moved to `ownId` in one transaction, so
 * two tabs never adopt the same one and nothing typed is lost.
 */
export async function adoptOrphanDraft(prefix: string, ownId: string, liveTabs: Set<string>): Promise<Draft | undefined> {
  const db = await getDb();
  const tx = db.transaction('drafts', 'readwrite');
  const range = IDBKeyRange.bound(prefix, `${prefix}:\uffff`);
  const candidates = (await tx.store.getAll(range)).filter((d) => {
    if (d.id === ownId) return false;
    if (d.id === prefix) return true; // a draft from before drafts were kept per tab
    const tab = d.id.slice(prefix.length + 1).split(':')[0] ?? '';
    return !liveTabs.has(tab);
  });
  candidates.sort((a, b) => (a.updatedAt < b.updatedAt ? 1 : -1));
  const pick = candidates[0];
  if (pick) {
    await tx.store.put({ ...pick, id: ownId });
    await tx.store.delete(pick.id);
  }
  await tx.done;
  return pick ? { ...pick, id: ownId } : undefined;
}
export const deleteDraft = async (id: string) => (await getDb()).delete('drafts', id);
export const listDrafts = async () => (await getDb()).getAll('drafts');

/** Stores that belong in a backup (everything the crew entered and its history). */
export const BACKUP_STORES = ['sites', 'samples', 'fieldDays', 'instruments', 'calibrations', 'revisions', 'drafts', 'settings', 'profiles', 'exportLog', 'outbox'] as const satisfies ReadonlyArray<keyof BanksideDB>;

/** Remove every record of the invented demo scenario. */
export async function removeDemo(): Promise<number> {
  const db = await getDb();
  let removed = 0;
  const tx = db.transaction(['sites', 'samples', 'calibrations', 'instruments', 'fieldDays', 'revisions'], 'readwrite');
  const demoIds = new Set<string>();
  for (const name of ['sites', 'samples', 'calibrations', 'instruments', 'fieldDays'] as const) {
    let cursor = await tx.objectStore(name).openCursor();
    while (cursor) {
      if ((cursor.value as { demo?: boolean }).demo) {
        demoIds.add(cursor.value.id);
        await cursor.delete();
        removed++;
      }
      cursor = await cursor.continue();
    }
  }
  let rc = await tx.objectStore('revisions').openCursor();
  while (rc) {
    if (demoIds.has(rc.value.entityId)) await rc.delete();
    rc = await rc.continue();
  }
  await tx.done;
  notifyChange({ store: 'samples', ids: [...demoIds] });
  return removed;
}

// ---------------- method profiles ----------------

/**
 * Store a profile version (id + version is the key: earlier versions stay for the records that used
 * them). A stored version is immutable: saving different thresholds under an existing id and version
 * is refused (save them as the next version); the built-in default cannot be overwritten either.
 */
export async function saveProfile(profile: MethodProfile): Promise<MethodProfile> {
  const problems = profileProblems(profile);
  if (problems.length > 0) throw new StoreError('invalid', `The profile has problems: ${problems.join(' ')}`);
  const db = await getDb();
  const existing = profile.id === DEFAULT_PROFILE.id && profile.version === DEFAULT_PROFILE.version ? DEFAULT_PROFILE : await db.get('profiles', [profile.id, profile.version]);
  if (existing && diff(existing, profile).length > 0) {
    throw new StoreError('invalid', `Profile ${profile.id} version ${profile.version} is already stored and records may have been judged under it: save the changes as version ${profile.version + 1}.`);
  }
  try {
    await db.put('profiles', structuredClone(profile));
  } catch (e) {
    throw toStoreError(e);
  }
  notifyChange({ store: 'profiles', ids: [profile.id] });
  return profile;
}

/** The newest version of every stored profile, plus the built-in default. */
export async function listProfiles(): Promise<MethodProfile[]> {
  const all = await (await getDb()).getAll('profiles');
  const newest = new Map<string, MethodProfile>();
  for (const p of all) if ((newest.get(p.id)?.version ?? 0) < p.version) newest.set(p.id, p);
  return [DEFAULT_PROFILE, ...[...newest.values()].filter((p) => p.id !== DEFAULT_PROFILE.id)];
}

/** The active profile by id (its newest version); the default when unknown. */
export async function getActiveProfile(id: string): Promise<MethodProfile> {
  return (await listProfiles()).find((p) => p.id === id) ?? DEFAULT_PROFILE;
}

/** One exact profile version (the default's built-in version included), or undefined when not stored. */
export async function getProfileVersion(id: string, version: number): Promise<MethodProfile | undefined> {
  if (id === DEFAULT_PROFILE.id && version === DEFAULT_PROFILE.version) return DEFAULT_PROFILE;
  return (await getDb()).get('profiles', [id, version]);
}

/**
 * Every stored profile version, as a lookup: the version a record was judged under. Verdicts belong
 * to that version; a newer profile judges a record only after an explicit re-judge (see rejudgeSample).
 */
export async function profileLookup(): Promise<(ref: { profileId: string; profileVersion: number }) => MethodProfile | undefined> {
  const all = await (await getDb()).getAll('profiles');
  const byKey = new Map(all.map((p) => [`${p.id}@${p.version}`, p]));
  byKey.set(`${DEFAULT_PROFILE.id}@${DEFAULT_PROFILE.version}`, DEFAULT_PROFILE);
  return (ref) => byKey.get(`${ref.profileId}@${ref.profileVersion}`);
}

/** Judge a sample under another profile version, explicitly, with a revision saying so. */
export async function rejudgeSample(id: string, profile: MethodProfile, by: string): Promise<Sample> {
  const db = await getDb();
  const current = await db.get('samples', id);
  if (!current) throw new StoreError('not-found', `No sample ${id}.`);
  if (!(await getProfileVersion(profile.id, profile.version))) await saveProfile(profile);
  return putWithRevision<Sample>(
    'sample',
    { ...current, profileId: profile.id, profileVersion: profile.version },
    by,
    { expectedRevision: current.revision, note: `re-judged under ${profile.name} v${profile.version} (was ${current.profileId} v${current.profileVersion})` },
    db,
  );
}
