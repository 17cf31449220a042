// The IndexedDB database: its schema, its one upgrade path, and the two-tab protocol.
// Pitfalls (see DEVELOPERS.md): await nothing but IDB requests inside a transaction; an error in
// an upgrade step must abort the upgrade transaction, or a half-migrated database is left behind.
import { openDB, unwrap, type DBSchema, type IDBPDatabase, type IDBPTransaction, type StoreNames } from 'idb';
import type {
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
import type { MethodProfile } from '../chemistry';
import { baseSampleCode, freeSampleCode } from '../records/sample-code';

export const DB_NAME = 'bankside';
export const DB_VERSION = 3;

export interface BanksideDB extends DBSchema {
  sites: { key: string; value: Site; indexes: { code: string } };
  samples: { key: string; value: Sample; indexes: { localDate: string; siteId: string; sampleCode: string } };
  drafts: { key: string; value: Draft };
  settings: { key: string; value: Settings };
  fieldDays: { key: string; value: FieldDay; indexes: { date: string } };
  instruments: { key: string; value: Instrument };
  calibrations: { key: string; value: CalibrationEvent; indexes: { localDate: string; instrumentId: string } };
  revisions: { key: string; value: Revision; indexes: { entityId: string } };
  profiles: { key: [string, number]; value: MethodProfile };
  outbox: { key: string; value: OutboxItem; indexes: { status: string } };
  exportLog: { key: string; value: ExportLogEntry };
}

export type Db = IDBPDatabase<BanksideDB>;
type UpgradeTx = IDBPTransaction<BanksideDB, StoreNames<BanksideDB>[], 'versionchange'>;

/**
 * One migration step: brings the database from version `to - 1` to `to`. It may only use IDB
 * requests on `tx`; it signals failure by throwing (synchronously) or by calling `fail`, which
 * aborts the whole upgrade so the database stays at its old version with its data intact.
 */
export interface Migration {
  to: number;
  run(db: Db, tx: UpgradeTx, fail: (e: unknown) => void): void;
}

/** Version 1, the first schema: sites, flat samples, drafts, settings. */
const v1: Migration = {
  to: 1,
  run(db) {
    db.createObjectStore('sites', { keyPath: 'id' });
    db.createObjectStore('samples', { keyPath: 'id' });
    db.createObjectStore('drafts', { keyPath: 'id' });
    db.createObjectStore('settings', { keyPath: 'id' });
  },
};

/** The v1 sample record (flat readings, time in ms without offset). */
export interface SampleV1 {
  id: string;
  siteId: string;
  timestamp: number;
  tempC?: number;
  pH?: number;
  scUsPerCm?: number;
  alkalinityMgLCaCO3?: number;
  caMgL?: number;
  notes?: string;
}

/** Convert a v1 flat sample to the current shape. v1 stored no offset: its times become UTC (Z). */
export function sampleFromV1(s: SampleV1): Sample {
  const time = new Date(s.timestamp).toISOString().replace(/\.\d{3}Z$/, 'Z');
  const tv = (value: number) => ({ values: [{ time, value }] });
  return {
    id: s.id,
    siteId: s.siteId,
    time,
    localDate: time.slice(0, 10),
    createdAt: time,
    updatedAt: time,
    crew: [],
    instrumentIds: [],
    method: 'in-situ',
    flow: 'unknown',
    weather: '',
    appearance: '',
    qc: { type: 'environmental' },
    field: {
      ...(s.tempC !== undefined ? { tempC: tv(s.tempC) } : {}),
      ...(s.pH !== undefined ? { pH: tv(s.pH) } : {}),
      ...(s.scUsPerCm !== undefined ? { conductance: { mode: 'sc' as const, unit: 'uS/cm' as const, alpha: 0.0191, values: [{ time, value: s.scUsPerCm }] } } : {}),
      ...(s.alkalinityMgLCaCO3 !== undefined ? { alkalinity: { kind: 'direct' as const, value: s.alkalinityMgLCaCO3, unit: 'mg/L CaCO3' as const } } : {}),
      kits: s.caMgL !== undefined ? [{ analyte: 'calcium' as const, value: s.caMgL, unit: 'mg/L' as const }] : [],
      ions: {},
    },
    lab: [],
    remarks: s.notes ?? '',
    qualifiers: [],
    profileId: 'bankside-default',
    profileVersion: 1,
    revision: 1,
    createdBy: '',
  };
}

/** Version 2: the full record model, indexes for the day view, and v1 samples rewritten. */
const v2: Migration = {
  to: 2,
  run(db, tx, fail) {
    db.createObjectStore('fieldDays', { keyPath: 'id' }).createIndex('date', 'date');
    db.createObjectStore('instruments', { keyPath: 'id' });
    const cal = db.createObjectStore('calibrations', { keyPath: 'id' });
    cal.createIndex('localDate', 'localDate');
    cal.createIndex('instrumentId', 'instrumentId');
    db.createObjectStore('revisions', { keyPath: 'id' }).createIndex('entityId', 'entityId');
    db.createObjectStore('profiles', { keyPath: ['id', 'version'] });
    db.createObjectStore('outbox', { keyPath: 'id' }).createIndex('status', 'status');
    db.createObjectStore('exportLog', { keyPath: 'id' });
    tx.objectStore('sites').createIndex('code', 'code');
    const samples = tx.objectStore('samples');
    samples.createIndex('localDate', 'localDate');
    samples.createIndex('siteId', 'siteId');
    // Rewrite each v1 sample with raw IDB requests (no other awaits inside the upgrade). All puts are
    // placed in one callback, so a later step's requests run after every rewrite, never between them.
    const store = unwrap(samples) as unknown as IDBObjectStore;
    const all = store.getAll();
    all.onsuccess = () => {
      try {
        for (const old of all.result as Array<SampleV1 & { localDate?: string }>) {
          if (old.localDate !== undefined) continue;
          const put = store.put(sampleFromV1(old));
          put.onerror = () => fail(put.error);
        }
      } catch (e) {
        fail(e);
      }
    };
    all.onerror = () => fail(all.error);
  },
};

/**
 * Version 3: every sample gets its readable code (SITE-YYYYMMDD-HHMM, -R/-B for QC, -2… on a clash),
 * in time order, and a unique index keeps codes unique on the device from then on.
 */
const v3: Migration = {
  to: 3,
  run(_db, tx, fail) {
    const samples = tx.objectStore('samples');
    samples.createIndex('sampleCode', 'sampleCode', { unique: true });
    const siteStore = unwrap(tx.objectStore('sites')) as unknown as IDBObjectStore;
    const sampleStore = unwrap(samples) as unknown as IDBObjectStore;
    const sitesReq = siteStore.getAll();
    sitesReq.onerror = () => fail(sitesReq.error);
    sitesReq.onsuccess = () => {
      const codeOf = new Map((sitesReq.result as Site[]).map((s) => [s.id, s.code]));
      const all = sampleStore.getAll();
      all.onerror = () => fail(all.error);
      all.onsuccess = () => {
        try {
          const list = (all.result as Sample[]).sort((a, b) => Date.parse(a.time) - Date.parse(b.time));
          const taken = new Set(list.map((s) => s.sampleCode).filter((c): c is string => !!c));
          for (const s of list) {
            if (s.sampleCode) continue;
            const code = freeSampleCode(baseSampleCode(codeOf.get(s.siteId) ?? 'SITE', s.time, s.qc?.type ?? 'environmental'), taken);
            taken.add(code);
            const put = sampleStore.put({ ...s, sampleCode: code });
            put.onerror = () => fail(put.error);
          }
        } catch (e) {
          fail(e);
        }
      };
    };
  },
};

export const MIGRATIONS: Migration[] = [v1, v2, v3];

export interface OpenOptions {
  name?: string;
  version?: number;
  migrations?: Migration[];
  /** another tab wants a newer version: save the draft, then the db is closed for you */
  onBlocking?: () => void;
  /** this tab's upgrade waits for an older tab to close */
  onBlocked?: () => void;
  /** the browser closed the connection (storage cleared, quota, crash) */
  onTerminated?: () => void;
}

export class MigrationError extends Error {
  constructor(message: string, override readonly cause?: unknown) {
    super(message);
    this.name = 'MigrationError';
  }
}

/** Open (and upgrade) the database. Steps run in order from the old version to the new one. */
export async function openBanksideDb(options: OpenOptions = {}): Promise<Db> {
  const version = options.version ?? DB_VERSION;
  const steps = (options.migrations ?? MIGRATIONS).filter((m) => m.to <= version).sort((a, b) => a.to - b.to);
  let failure: unknown = null;
  let db: Db;
  try {
    db = await openDB<BanksideDB>(options.name ?? DB_NAME, version, {
      upgrade(database, oldVersion, _newVersion, tx) {
        const fail = (e: unknown) => {
          if (failure === null) failure = e ?? new Error('migration failed');
          try {
            tx.abort();
          } catch {
            /* already aborted */
          }
        };
        // idb ignores a promise returned here, so the final transaction outcome is what counts.
        tx.done.catch(() => undefined);
        for (const step of steps) {
          if (step.to <= oldVersion) continue;
          try {
            step.run(database, tx, fail);
          } catch (e) {
            fail(e);
            return;
          }
        }
      },
      blocked() {
        options.onBlocked?.();
      },
      blocking() {
        options.onBlocking?.();
      },
      terminated() {
        options.onTerminated?.();
      },
    });
  } catch (e) {
    throw new MigrationError(
      `The stored records could not be upgraded (${describe(failure ?? e)}). Nothing was changed: your data is as it was. Export a backup and report this.`,
      failure ?? e,
    );
  }
  if (failure !== null) {
    db.close();
    throw new MigrationError(`The stored records could not be upgraded (${describe(failure)}).`, failure);
  }
  return db;
}

function describe(e: unknown): string {
  return e instanceof Error ? e.message : String(e);
}
