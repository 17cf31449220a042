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

const ISO_SHAPE = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2})(?:\.\d{1,3})?)?(Z|([+-])(\d{2}):(\d{2}))$/;
const DATE_SHAPE = /^(\d{4})-(\d{2})-(\d{2})$/;

function dayProblem(y: number, m: number, d: number): string | undefined {
  if (m < 1 || m > 12) return `month ${m} does not exist (01–12)`;
  const last = new Date(Date.UTC(y, m, 0)).getUTCDate();
  if (d < 1 || d > last) return `day ${d} does not exist in that month (01–${last})`;
  return undefined;
}

/**
 * Why an ISO 8601 time with offset is impossible, or undefined when it is a real instant.
 * The shape alone is not enough: hour 25, minute 61, 30 February or an offset beyond ±14:00 are
 * refused here, so every stored time converts to UTC and every export can write it.
 */
export function isoTimeProblem(s: unknown): string | undefined {
  if (typeof s !== 'string') return 'a time is needed';
  const m = ISO_SHAPE.exec(s);
  if (!m) return 'Time must be ISO 8601 with a UTC offset, e.g. 2026-06-14T09:30:00-06:00';
  const [, y, mo, d, h, mi, sec, , , oh, om] = m;
  const day = dayProblem(Number(y), Number(mo), Number(d));
  if (day) return `Impossible time: ${day}`;
  if (Number(h) > 23) return `Impossible time: hour ${h} does not exist (00–23)`;
  if (Number(mi) > 59) return `Impossible time: minute ${mi} does not exist (00–59)`;
  if (sec !== undefined && Number(sec) > 59) return `Impossible time: second ${sec} does not exist (00–59)`;
  if (oh !== undefined && (Number(oh) > 14 || Number(om) > 59 || (Number(oh) === 14 && Number(om) > 0))) return `Impossible time: UTC offset ${oh}:${om} is beyond ±14:00`;
  if (!Number.isFinite(Date.parse(s))) return 'Impossible time: it does not convert to a date';
  return undefined;
}

/** Earliest year a sample recorded with this app can carry: a year before it is a slip of the picker's year
 * part (0025 for 2025), not a sample (our choice: electronic field meters postdate it by decades). */
export const EARLIEST_SAMPLE_YEAR = 1900;

/** Why a sampling time is impossible: an impossible instant (isoTimeProblem) or a year before 1900. */
export function samplingTimeProblem(s: unknown): string | undefined {
  const problem = isoTimeProblem(s);
  if (problem) return problem;
  const year = Number((s as string).slice(0, 4));
  if (year < EARLIEST_SAMPLE_YEAR) return `Impossible sampling time: the year ${(s as string).slice(0, 4)} is before ${EARLIEST_SAMPLE_YEAR}; check the year`;
  return undefined;
}

/** Why a YYYY-MM-DD calendar date is impossible, or undefined. */
export function localDateProblem(s: unknown): string | undefined {
  if (typeof s !== 'string') return 'a date is needed';
  const m = DATE_SHAPE.exec(s);
  if (!m) return 'Date must be YYYY-MM-DD';
  const day = dayProblem(Number(m[1]), Number(m[2]), Number(m[3]));
  return day ? `Impossible date: ${day}` : undefined;
}

/** The UTC instant of a stored time as ISO text, or undefined when it cannot be read (never throws). */
export function utcIsoOrUndefined(s: string): string | undefined {
  const ms = Date.parse(s);
  return Number.isFinite(ms) ? new Date(ms).toISOString() : undefined;
}
