// Derived results computed once. `deriveSample` (derive.ts) is pure: the same stored entries, engine
// version, settings and method profile always give the same result, so a result can be reused until one
// of those changes. The day view, the site page, exports and uploads all read through `derivedFor`.
//
// Key of one result: sample id + revision + updatedAt (every saved edit bumps both; a restore or merge
// writes a new updatedAt), and a context key: engine version, the activity model and conductance factor
// from Settings plus the sites' own conductance factors, and the profile's id, version and a fingerprint of its content (so a profile edited
// without a new version still invalidates). A result under an old key is never served again; it ages
// out: the cache holds at most `maxEntries` results (least recently used go first). One result is a
// few kB, so the default keeps memory bounded on a phone while a 10,000-sample export stays warm.
//
// Results are shared: callers must treat a returned `Derived` as read-only.
import { ENGINE_VERSION, type MethodProfile, DEFAULT_PROFILE } from '../chemistry';
import { deriveSample, type DeriveSettings, type Derived } from './derive';
import type { Sample } from './schema';

export type { DeriveSettings };
type DerivableSample = Pick<Sample, 'id' | 'revision' | 'updatedAt' | 'field' | 'pressure' | 'lab'> & { siteId?: string };

export interface DeriveContext {
  settings: DeriveSettings;
  profile?: MethodProfile | undefined;
  /** the engine version the results belong to; the running engine's by default */
  engineVersion?: string;
}

/** FNV-1a over a string, as 8 hex digits: a cheap content fingerprint (not for security). */
function fnv1a(text: string): string {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return (h >>> 0).toString(16).padStart(8, '0');
}

const profilePrints = new WeakMap<MethodProfile, string>();
function profileKey(p: MethodProfile): string {
  let print = profilePrints.get(p);
  if (print === undefined) {
    print = `${p.id}@${p.version}#${fnv1a(JSON.stringify(p))}`;
    profilePrints.set(p, print);
  }
  return print;
}

const sitePrints = new WeakMap<object, string>();
function siteFactorsKey(f: NonNullable<DeriveSettings['siteFactors']>): string {
  let print = sitePrints.get(f);
  if (print === undefined) {
    print = fnv1a(JSON.stringify(f));
    sitePrints.set(f, print);
  }
  return print;
}

/** The part of the key shared by every sample derived under the same engine, settings and profile. */
export function contextKey(ctx: DeriveContext): string {
  const s = ctx.settings;
  const sites = s.siteFactors ? siteFactorsKey(s.siteFactors) : '';
  return `${ctx.engineVersion ?? ENGINE_VERSION}|${s.activityModel}|${s.conductanceFactor ?? ''}|${sites}|${profileKey(ctx.profile ?? DEFAULT_PROFILE)}`;
}

export const sampleKey = (s: Pick<Sample, 'id' | 'revision' | 'updatedAt'>) => `${s.id}|${s.revision}|${s.updatedAt}`;

export class DerivedCache {
  private entries = new Map<string, Derived>();
  /** how many results were computed (not served from the cache) since creation */
  computed = 0;
  hits = 0;

  constructor(readonly maxEntries = 12_000) {}

  get size(): number {
    return this.entries.size;
  }

  get(sample: DerivableSample, ctx: DeriveContext): Derived {
    const key = `${contextKey(ctx)}\u0000${sampleKey(sample)}`;
    const hit = this.entries.get(key);
    if (hit) {
      this.hits++;
      // refresh its place in the least-recently-used order
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    const d = deriveSample(sample, ctx.settings, ctx.profile);
    this.computed++;
    this.entries.set(key, d);
    if (this.entries.size > this.maxEntries) {
      const oldest = this.entries.keys().next().value;
      if (oldest !== undefined) this.entries.delete(oldest);
    }
    return d;
  }

  clear(): void {
    this.entries.clear();
  }
}

/** The cache of this page or worker. */
export const derivedCache = new DerivedCache();

/** A stored sample's derived result, computed at most once per revision, engine, settings and profile. */
export function derivedFor(sample: DerivableSample, settings: DeriveSettings, profile?: MethodProfile, engineVersion?: string): Derived {
  return derivedCache.get(sample, { settings, profile, ...(engineVersion !== undefined ? { engineVersion } : {}) });
}
