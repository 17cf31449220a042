// Dates and times shown one way everywhere: the device's own locale (Intl), never raw ISO text.
// A sample's time is shown as its own wall-clock time at the bank (the offset it was recorded with),
// so a record made at 09:30 reads 09:30 on any phone in any time zone.

const WALL = /^(\d{4})-(\d{2})-(\d{2})(?:T(\d{2}):(\d{2})(?::(\d{2}))?)?/;

/** The wall-clock fields of an ISO time or date as a Date in UTC (format it with timeZone 'UTC'). */
function wallClock(iso: string): Date | undefined {
  const m = WALL.exec(iso);
  if (!m) return undefined;
  const [, y, mo, d, h = '12', mi = '0', s = '0'] = m;
  const t = Date.UTC(Number(y), Number(mo) - 1, Number(d), Number(h), Number(mi), Number(s));
  return Number.isFinite(t) ? new Date(t) : undefined;
}

const fmt = (d: Date | undefined, o: Intl.DateTimeFormatOptions, fallback: string) =>
  d ? new Intl.DateTimeFormat(undefined, { ...o, timeZone: 'UTC' }).format(d) : fallback;

/** "2 Dec 2026" in the device's locale, from YYYY-MM-DD or an ISO time (its own calendar date). */
export function showDate(isoOrDate: string): string {
  return fmt(wallClock(isoOrDate), { day: 'numeric', month: 'short', year: 'numeric' }, isoOrDate);
}

/** "Wednesday 2 December 2026" for a day heading. */
export function showDayLong(date: string): string {
  return fmt(wallClock(date), { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric' }, date);
}

/** "09:30" (or "9:30 AM") at the sample's own offset. */
export function showTime(iso: string): string {
  return fmt(wallClock(iso), { hour: '2-digit', minute: '2-digit' }, iso);
}

/** Date and time of a sample (its own wall clock). */
export function showDateTime(iso: string): string {
  return fmt(wallClock(iso), { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }, iso);
}

/** An instant the phone itself recorded (a save, a send): in the phone's own time zone. */
export function showMoment(iso: string | number): string {
  const d = new Date(iso);
  if (!Number.isFinite(d.getTime())) return String(iso);
  return new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' }).format(d);
}

/** The UTC offset of an ISO time as the crew reads it: "UTC−06:00". */
export function showOffset(iso: string): string {
  const m = /(Z|[+-]\d{2}:\d{2})$/.exec(iso);
  if (!m) return '';
  return m[1] === 'Z' ? 'UTC' : `UTC${m[1]!.replace('-', '−')}`;
}

/** "12 s ago", "3 min ago": how old a position fix or a reading is. */
export function showAge(ms: number): string {
  const s = Math.max(0, Math.round(ms / 1000));
  if (s < 60) return `${s} s ago`;
  const m = Math.round(s / 60);
  return m < 60 ? `${m} min ago` : `${Math.round(m / 60)} h ago`;
}
