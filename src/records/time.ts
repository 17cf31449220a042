/** ISO 8601 local time with its UTC offset, e.g. 2026-06-14T09:30:05-06:00 (what a field record needs). */
export function isoWithOffset(d: Date = new Date()): string {
  const pad = (n: number, w = 2) => String(Math.trunc(Math.abs(n))).padStart(w, '0');
  const off = -d.getTimezoneOffset();
  const sign = off >= 0 ? '+' : '-';
  return (
    `${d.getFullYear()}-${pad(d.getMonth() + 1)}-${pad(d.getDate())}T${pad(d.getHours())}:${pad(d.getMinutes())}:${pad(d.getSeconds())}` +
    `${sign}${pad(off / 60)}:${pad(off % 60)}`
  );
}

/** The local calendar date written in an ISO time with offset (its first 10 characters). */
export function localDateOf(iso: string): string {
  return iso.slice(0, 10);
}

export function todayLocal(d: Date = new Date()): string {
  return localDateOf(isoWithOffset(d));
}

/** A random id (UUID v4 where the platform has it). */
export function newId(prefix = ''): string {
  const c = (globalThis as { crypto?: Crypto }).crypto;
  const u =
    c && typeof c.randomUUID === 'function'
      ? c.randomUUID()
      : 'xxxxxxxx-xxxx-4xxx-yxxx-xxxxxxxxxxxx'.replace(/[xy]/g, (ch) => {
          const r = (Math.random() * 16) | 0;
          return (ch === 'x' ? r : (r & 0x3) | 0x8).toString(16);
        });
  return prefix ? `${prefix}-${u}` : u;
}

let lastSeq = 0;
/** A strictly increasing sequence number for ordering events on this device. */
export function nextSeq(): number {
  lastSeq = Math.max(lastSeq + 1, Date.now() * 1000);
  return lastSeq;
}

/** The IANA time zone of this device (e.g. America/Denver), or undefined where the platform does not say. */
export function currentTimeZone(): string | undefined {
  try {
    const z = Intl.DateTimeFormat().resolvedOptions().timeZone;
    return z && z.length <= 64 ? z : undefined;
  } catch {
    return undefined;
  }
}

/**
 * The wall clock written in an ISO time with offset, read from the text itself: the sample's own
 * local date, time and offset, never re-zoned to the viewer's time zone.
 */
export function wallClock(iso: string): { date: string; hhmm: string; hhmmss: string; offset: string } | undefined {
  const m = /^(\d{4}-\d{2}-\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?(?:\.\d+)?(Z|[+-]\d{2}:\d{2})$/.exec(iso);
  if (!m) return undefined;
  return { date: m[1]!, hhmm: `${m[2]}:${m[3]}`, hhmmss: `${m[2]}:${m[3]}:${m[4] ?? '00'}`, offset: m[5] === 'Z' ? '+00:00' : m[5]! };
}
