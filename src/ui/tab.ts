// Each tab has its own id (kept in sessionStorage, so it survives a reload of the same tab) and holds
// a Web Lock named after it for as long as it lives. A draft is keyed by its tab: two tabs on the
// new-sample screen never overwrite each other's entry, and a draft whose tab is gone (closed or
// killed) is found by asking which locks are held, then adopted by the next tab that opens the form.
import { newId } from '../records/time';

const KEY = 'bankside-tab';
const LOCK_PREFIX = 'bankside-tab:';
let id: string | null = null;

export function tabId(): string {
  if (id) return id;
  try {
    id = sessionStorage.getItem(KEY);
    if (!id) {
      id = newId('tab').slice(0, 16);
      sessionStorage.setItem(KEY, id);
    }
  } catch {
    id = newId('tab').slice(0, 16);
  }
  const locks = (navigator as Navigator & { locks?: LockManager }).locks;
  // Held until the tab goes away; the browser releases it when the page is closed or killed.
  void locks?.request(LOCK_PREFIX + id, () => new Promise<void>(() => undefined)).catch(() => undefined);
  return id;
}

/** Ids of the tabs alive now (this one included); undefined where the browser cannot tell. */
export async function liveTabIds(): Promise<Set<string> | undefined> {
  const locks = (navigator as Navigator & { locks?: LockManager }).locks;
  if (!locks?.query) return undefined;
  const snap = await locks.query();
  const ids = new Set<string>([tabId()]);
  for (const l of [...(snap.held ?? []), ...(snap.pending ?? [])]) if (l.name?.startsWith(LOCK_PREFIX)) ids.add(l.name.slice(LOCK_PREFIX.length));
  return ids;
}
