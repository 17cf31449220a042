// Sample codes: the short ID a crew writes on a bottle and the office uses as the WQX Activity ID.
// Pure functions (no storage): the store picks a code that is free on this device.

/** The WQX Activity Identifier holds at most 35 characters; so does every code made here. */
export const SAMPLE_CODE_MAX = 35;
/** Room kept for the site part so date, time, QC letter and a collision number always fit. */
const SITE_PART_MAX = 16;

const QC_SUFFIX: Record<'environmental' | 'replicate' | 'blank', string> = { environmental: '', replicate: '-R', blank: '-B' };

/** Upper-case letters, digits and hyphens only: readable on a bottle, safe in a file name and a QR code. */
export function cleanSiteCode(code: string): string {
  const c = code
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toUpperCase()
    .replace(/[^A-Z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, SITE_PART_MAX)
    .replace(/-+$/g, '');
  return c || 'SITE';
}

/**
 * The code a sample would get before collisions: SITE-YYYYMMDD-HHMM, plus -R for a replicate and -B
 * for a blank. Date and time are read from the sample's own ISO time (its local clock at the site, as
 * written), never re-zoned by the phone.
 */
export function baseSampleCode(siteCode: string, time: string, qcType: keyof typeof QC_SUFFIX = 'environmental'): string {
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})/.exec(time);
  const stamp = m ? `${m[1]}${m[2]}${m[3]}-${m[4]}${m[5]}` : 'UNDATED';
  return `${cleanSiteCode(siteCode)}-${stamp}${QC_SUFFIX[qcType]}`;
}

/**
 * The first of base, base-2, base-3 … not in `taken`, never longer than {@link SAMPLE_CODE_MAX}: when
 * a number would not fit, the site part gives way (date, time, QC letter and number always stay).
 */
export function freeSampleCode(base: string, taken: ReadonlySet<string>): string {
  const m = /-(\d{8}-\d{4}|UNDATED)(-[RB])?$/.exec(base);
  const site = m ? base.slice(0, m.index) : base;
  const tail = m ? base.slice(m.index) : '';
  const fit = (suffix: string) => {
    const room = SAMPLE_CODE_MAX - tail.length - suffix.length;
    return `${site.slice(0, room).replace(/-+$/, '')}${tail}${suffix}`;
  };
  for (let n = 1; ; n++) {
    const code = fit(n === 1 ? '' : `-${n}`);
    if (!taken.has(code)) return code;
  }
}

/** What a sample needs to show its code. */
export interface HasCode {
  id: string;
  sampleCode?: string | undefined;
}

/**
 * The readable ID of a sample: its stored code (given once, at the first save, and kept through
 * edits), or the internal id for a record not yet coded. The office's WQX export uses this as the
 * Activity ID.
 */
export function sampleLabelId(sample: HasCode): string {
  return sample.sampleCode ?? sample.id;
}
