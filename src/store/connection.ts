// One shared connection per page, plus the two-tab protocol and change notices across tabs.
import { openBanksideDb, type Db, type OpenOptions } from './db';

export type ConnectionEvent = 'blocking' | 'blocked' | 'terminated';

const listeners = new Set<(e: ConnectionEvent) => void>();
let dbPromise: Promise<Db> | null = null;
/** run before this tab lets go of the database for a newer version in another tab */
let beforeClose: (() => Promise<void>) | null = null;

export function onConnectionEvent(fn: (e: ConnectionEvent) => void): () => void {
  listeners.add(fn);
  return () => listeners.delete(fn);
}

/** The UI registers its draft saver here: it runs before the db is closed for another tab's upgrade. */
export function setBeforeClose(fn: (() => Promise<void>) | null): void {
  beforeClose = fn;
}

function emit(e: ConnectionEvent): void {
  for (const l of listeners) l(e);
}

export function getDb(options: OpenOptions = {}): Promise<Db> {
  if (!dbPromise) {
    const p = openBanksideDb({
      ...options,
      onBlocking: () => {
        // Another tab needs a newer version: save what is typed, then close so it can proceed.
        const close = () => {
          void p.then((db) => db.close());
          dbPromise = null;
          emit('blocking');
        };
        if (beforeClose) beforeClose().finally(close);
        else close();
      },
      onBlocked: () => emit('blocked'),
      onTerminated: () => {
        dbPromise = null;
        emit('terminated');
      },
    });
    dbPromise = p;
    p.catch(() => {
      if (dbPromise === p) dbPromise = null;
    });
  }
  return dbPromise;
}

/** Close and forget the shared connection (tests, and after a restore). */
export async function resetDb(): Promise<void> {
  const p = dbPromise;
  dbPromise = null;
  if (p) {
    try {
      (await p).close();
    } catch {
      /* it never opened */
    }
  }
}

// ---- change notices across tabs (BroadcastChannel where present) ----

export interface ChangeNotice {
  store: string;
  ids: string[];
}

const CHANNEL = 'bankside-changes';
let channel: BroadcastChannel | null = null;
const changeListeners = new Set<(n: ChangeNotice) => void>();

function getChannel(): BroadcastChannel | null {
  if (channel) return channel;
  if (typeof BroadcastChannel === 'undefined') return null;
  channel = new BroadcastChannel(CHANNEL);
  channel.onmessage = (ev: MessageEvent<ChangeNotice>) => {
    for (const l of changeListeners) l(ev.data);
  };
  return channel;
}

/** Tell this tab's listeners and other tabs that records changed. */
export function notifyChange(n: ChangeNotice): void {
  for (const l of changeListeners) l(n);
  getChannel()?.postMessage(n);
}

export function onChange(fn: (n: ChangeNotice) => void): () => void {
  getChannel();
  changeListeners.add(fn);
  return () => changeListeners.delete(fn);
}

export function closeChangeChannel(): void {
  channel?.close();
  channel = null;
}
