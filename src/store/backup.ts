// Full backup to one JSON file and restore from it: validated, merged by ID, all or nothing.
import { z } from 'zod';
import { ENGINE_VERSION, profileProblems, type MethodProfile } from '../chemistry';
import {
  CalibrationEvent,
  Draft,
  ExportLogEntry,
  FieldDay,
  Instrument,
  OutboxItem,
  Revision,
  Sample,
  Settings,
  Site,
} from '../records/schema';
import { isoWithOffset } from '../records/time';
import { fieldLabel, fieldProblems } from '../records/validate';
import { getDb, notifyChange } from './connection';
import { DB_VERSION } from './db';
import { BACKUP_STORES, toStoreError } from './records';

export const BACKUP_FORMAT = 'bankside-backup';
export const BACKUP_FORMAT_VERSION = 1;

const ProfileShape = z.custom<MethodProfile>(
  (v) => typeof v === 'object' && v !== null && profileProblems(v as MethodProfile).length === 0,
  { error: 'not a valid method profile' },
);

const STORE_SCHEMAS = {
  sites: Site,
  samples: Sample,
  fieldDays: FieldDay,
  instruments: Instrument,
  calibrations: CalibrationEvent,
  revisions: Revision,
  drafts: Draft,
  settings: Settings,
  profiles: ProfileShape,
  exportLog: ExportLogEntry,
  outbox: OutboxItem,
} as const;

const Envelope = z.object({
  format: z.literal(BACKUP_FORMAT),
  formatVersion: z.number().int().min(1).max(BACKUP_FORMAT_VERSION),
  dbVersion: z.number().int().min(1),
  exportedAt: z.string(),
  engineVersion: z.string(),
  stores: z.record(z.string(), z.array(z.unknown())),
});

export class BackupError extends Error {
  constructor(message: string, readonly problems: string[] = []) {
    super(message);
    this.name = 'BackupError';
  }
}

export interface BackupFile {
  format: typeof BACKUP_FORMAT;
  formatVersion: number;
  dbVersion: number;
  exportedAt: string;
  engineVersion: string;
  counts: Record<string, number>;
  stores: Record<string, unknown[]>;
}

/** Everything the crew entered, with its history, as one JSON-serialisable object. */
export async function createBackup(): Promise<BackupFile> {
  const db = await getDb();
  const tx = db.transaction([...BACKUP_STORES], 'readonly');
  const stores: Record<string, unknown[]> = {};
  for (const name of BACKUP_STORES) stores[name] = await tx.objectStore(name).getAll();
  await tx.done;
  const counts = Object.fromEntries(Object.entries(stores).map(([k, v]) => [k, v.length]));
  return { format: BACKUP_FORMAT, formatVersion: BACKUP_FORMAT_VERSION, dbVersion: DB_VERSION, exportedAt: isoWithOffset(), engineVersion: ENGINE_VERSION, counts, stores };
}

export interface RestoreReport {
  added: number;
  updated: number;
  unchanged: number;
  perStore: Record<string, { added: number; updated: number; unchanged: number }>;
}

const keyOf = (store: string, v: Record<string, unknown>): IDBValidKey =>
  store === 'profiles' ? [v.id as string, v.version as number] : (v.id as string);

/**
 * Restore a backup: the whole file is validated first; a damaged or foreign file is refused with
 * the reasons and nothing is changed. Records merge by ID: a record not here is added; one here is
 * replaced only when the file's copy is newer (updatedAt); history and logs are added when missing.
 */
export async function restoreBackup(text: string): Promise<RestoreReport> {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    throw new BackupError('This file is not a Bankside backup (it is not JSON, or it was cut short). Nothing was changed.');
  }
  const env = Envelope.safeParse(json);
  if (!env.success) {
    throw new BackupError(
      'This file is not a Bankside backup, or it comes from a newer version of Bankside. Nothing was changed.',
      env.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`),
    );
  }
  const problems: string[] = [];
  const valid: Record<string, Array<Record<string, unknown>>> = {};
  for (const [name, records] of Object.entries(env.data.stores)) {
    const schema = (STORE_SCHEMAS as Record<string, z.ZodType>)[name];
    if (!schema) {
      problems.push(`unknown section "${name}"`);
      continue;
    }
    valid[name] = [];
    records.forEach((r, i) => {
      const p = schema.safeParse(r);
      if (p.success) valid[name]!.push(p.data as Record<string, unknown>);
      else problems.push(`${name}[${i}]: ${Object.entries(fieldProblems(p.error)).map(([k, v]) => `${fieldLabel(k)}: ${v}`).join('; ')}`);
    });
  }
  if (problems.length > 0) {
    throw new BackupError(`The backup is damaged (${problems.length} problem${problems.length > 1 ? 's' : ''}). Nothing was changed.`, problems.slice(0, 50));
  }

  const report: RestoreReport = { added: 0, updated: 0, unchanged: 0, perStore: {} };
  const names = Object.keys(valid) as Array<(typeof BACKUP_STORES)[number]>;
  try {
    const db = await getDb();
    const tx = db.transaction(names, 'readwrite');
    for (const name of names) {
      const store = tx.objectStore(name);
      const tally = { added: 0, updated: 0, unchanged: 0 };
      for (const rec of valid[name]!) {
        const existing = (await store.get(keyOf(name, rec) as never)) as Record<string, unknown> | undefined;
        if (!existing) {
          await store.put(rec as never);
          tally.added++;
        } else if (typeof rec.updatedAt === 'string' && typeof existing.updatedAt === 'string' && Date.parse(rec.updatedAt) > Date.parse(existing.updatedAt)) {
          await store.put(rec as never);
          tally.updated++;
        } else tally.unchanged++;
      }
      report.perStore[name] = tally;
      report.added += tally.added;
      report.updated += tally.updated;
      report.unchanged += tally.unchanged;
    }
    await tx.done;
  } catch (e) {
    throw toStoreError(e);
  }
  for (const name of names) notifyChange({ store: name, ids: [] });
  return report;
}
