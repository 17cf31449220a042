// Site lists from the office (CSV) or from another phone (the sites GeoJSON Bankside exports):
// read, check each row, show a preview, then store all good rows. A code already on the phone
// updates that site (through its revision history); nothing is stored until the crew says so.
import type { Site } from '../records/schema';
import { parseDecimalLoose } from '../records/numbers';
import { saveSite, type SiteInput } from '../store/records';
import { parseCsv } from './csv';

const TYPES = ['stream', 'spring', 'well', 'lake', 'other'] as const;
type SiteType = (typeof TYPES)[number];

export interface SiteRow {
  /** the row in the file as a person counts it (CSV: header is line 1; GeoJSON: feature 1, 2, …) */
  line: number;
  code: string;
  /** the site to store when `errors` is empty */
  site?: SiteInput;
  errors: string[];
  /** what storing it will do */
  action: 'new' | 'update' | 'skip';
}

export interface SitePreview {
  format: 'csv' | 'geojson';
  rows: SiteRow[];
  /** problems with the file as a whole (no rows can be read) */
  fileErrors: string[];
}

/** Column names accepted for each field, lower case (the office's spreadsheets vary). */
const ALIASES: Record<string, string[]> = {
  code: ['code', 'site_code', 'site code', 'site_id', 'site id', 'station', 'station_id'],
  name: ['name', 'site_name', 'site name', 'station_name'],
  type: ['type', 'site_type', 'site type'],
  latitude: ['latitude', 'lat', 'latitude_deg', 'latitude (deg)'],
  longitude: ['longitude', 'lon', 'long', 'lng', 'longitude_deg', 'longitude (deg)'],
  datum: ['datum', 'horizontal_datum', 'crs'],
  runOrder: ['run_order', 'run order', 'order', 'run', 'visit_order'],
  accuracyM: ['accuracy_m', 'accuracy', 'position_accuracy_m'],
  elevationM: ['elevation_m', 'elevation'],
  notes: ['notes', 'remarks', 'description'],
};

const TYPE_WORDS: Record<string, SiteType> = { river: 'stream', creek: 'stream', brook: 'stream', pond: 'lake', reservoir: 'lake', borehole: 'well', bore: 'well' };

interface RawSite {
  code?: unknown;
  name?: unknown;
  type?: unknown;
  latitude?: unknown;
  longitude?: unknown;
  datum?: unknown;
  runOrder?: unknown;
  accuracyM?: unknown;
  elevationM?: unknown;
  notes?: unknown;
}

const text = (v: unknown) => (v === undefined || v === null ? '' : String(v).trim());

function num(v: unknown, label: string, errors: string[], rule: { min?: number; max?: number; integer?: boolean } = {}): number | undefined {
  if (v === undefined || v === null || text(v) === '') return undefined;
  const n = typeof v === 'number' ? v : parseDecimalLoose(String(v));
  if (n === undefined || !Number.isFinite(n)) {
    errors.push(`${label} “${text(v)}” is not a number.`);
    return undefined;
  }
  if (rule.integer && !Number.isInteger(n)) errors.push(`${label} must be a whole number.`);
  else if (rule.min !== undefined && n < rule.min) errors.push(`${label} ${n} is below ${rule.min}.`);
  else if (rule.max !== undefined && n > rule.max) errors.push(`${label} ${n} is above ${rule.max}.`);
  else return n;
  return undefined;
}

/** One row to a site, with every problem said in words. */
function checkRow(raw: RawSite, line: number, existing: Map<string, Site>, seen: Set<string>): SiteRow {
  const errors: string[] = [];
  const code = text(raw.code);
  const name = text(raw.name);
  if (!code) errors.push('No site code.');
  else if (code.length > 40) errors.push('The site code is longer than 40 characters.');
  else if (seen.has(code.toLowerCase())) errors.push(`Site code ${code} appears twice in the file.`);
  if (!name) errors.push('No site name.');
  else if (name.length > 200) errors.push('The site name is longer than 200 characters.');
  const typeWord = text(raw.type).toLowerCase();
  const type: SiteType | undefined = !typeWord ? 'other' : (TYPES as readonly string[]).includes(typeWord) ? (typeWord as SiteType) : TYPE_WORDS[typeWord];
  if (!type) errors.push(`Site type “${text(raw.type)}” is not one of ${TYPES.join(', ')}.`);
  const latitude = num(raw.latitude, 'Latitude', errors, { min: -90, max: 90 });
  const longitude = num(raw.longitude, 'Longitude', errors, { min: -180, max: 180 });
  const hasLat = text(raw.latitude) !== '';
  const hasLon = text(raw.longitude) !== '';
  if (hasLat !== hasLon) errors.push('Give both latitude and longitude, or neither.');
  const datum = text(raw.datum);
  if (hasLat && hasLon && !datum) errors.push('Coordinates need their datum (e.g. WGS84, NAD83).');
  if (datum.length > 40) errors.push('The datum is longer than 40 characters.');
  const runOrder = num(raw.runOrder, 'Run order', errors, { min: 0, max: 100000, integer: true });
  const accuracyM = num(raw.accuracyM, 'Accuracy', errors, { min: 0 });
  const elevationM = num(raw.elevationM, 'Elevation', errors);
  const notes = text(raw.notes).slice(0, 4000);
  if (code) seen.add(code.toLowerCase());
  const before = existing.get(code.toLowerCase());
  if (errors.length > 0) return { line, code, errors, action: 'skip' };
  const site: SiteInput = {
    ...(before ? { id: before.id, notes: before.notes, ...(before.demo ? { demo: true } : {}) } : {}),
    code,
    name,
    type: type!,
    datum: datum || before?.datum || 'WGS84',
    ...(latitude !== undefined ? { latitude } : before?.latitude !== undefined ? { latitude: before.latitude } : {}),
    ...(longitude !== undefined ? { longitude } : before?.longitude !== undefined ? { longitude: before.longitude } : {}),
    ...(accuracyM !== undefined ? { accuracyM } : before?.accuracyM !== undefined ? { accuracyM: before.accuracyM } : {}),
    ...(elevationM !== undefined ? { elevationM } : before?.elevationM !== undefined ? { elevationM: before.elevationM } : {}),
    ...(runOrder !== undefined ? { runOrder } : before?.runOrder !== undefined ? { runOrder: before.runOrder } : {}),
    ...(notes ? { notes } : {}),
  };
  return { line, code, site, errors, action: before ? 'update' : 'new' };
}

function byCode(existing: Site[]): Map<string, Site> {
  return new Map(existing.map((s) => [s.code.toLowerCase(), s]));
}

/** A site list as CSV (header row; columns named as in {@link ALIASES}, any order, any case). */
export function previewSiteCsv(csv: string, existing: Site[]): SitePreview {
  const { header, rows, errors } = parseCsv(csv);
  const column: Partial<Record<keyof RawSite, string>> = {};
  for (const h of header) {
    const key = Object.entries(ALIASES).find(([, names]) => names.includes(h.trim().toLowerCase()))?.[0] as keyof RawSite | undefined;
    if (key && !column[key]) column[key] = h;
  }
  const fileErrors = [...errors.filter((e) => !/TooFewFields|TooManyFields/.test(e))];
  if (!column.code || !column.name) {
    return { format: 'csv', rows: [], fileErrors: [`The file needs a code and a name column (found: ${header.join(', ') || 'no header'}).`, ...fileErrors] };
  }
  const have = byCode(existing);
  const seen = new Set<string>();
  const out = rows.map((r, i) => {
    const raw: RawSite = {};
    for (const [k, h] of Object.entries(column)) raw[k as keyof RawSite] = r[h!];
    return checkRow(raw, i + 2, have, seen);
  });
  return { format: 'csv', rows: out, fileErrors: [] };
}

/** The sites GeoJSON Bankside exports (RFC 7946 FeatureCollection of Points, WGS84 lon/lat). */
export function previewSiteGeoJson(json: string, existing: Site[]): SitePreview {
  let doc: unknown;
  try {
    doc = JSON.parse(json);
  } catch (e) {
    return { format: 'geojson', rows: [], fileErrors: [`Not valid JSON: ${e instanceof Error ? e.message : String(e)}`] };
  }
  const fc = doc as { type?: unknown; features?: unknown };
  if (fc?.type !== 'FeatureCollection' || !Array.isArray(fc.features)) {
    return { format: 'geojson', rows: [], fileErrors: ['Not a GeoJSON FeatureCollection.'] };
  }
  const have = byCode(existing);
  const seen = new Set<string>();
  const rows = fc.features.map((f: unknown, i: number) => {
    const feature = f as { geometry?: { type?: unknown; coordinates?: unknown } | null; properties?: Record<string, unknown> | null };
    const p = feature?.properties ?? {};
    const g = feature?.geometry;
    const point = g && g.type === 'Point' && Array.isArray(g.coordinates) ? (g.coordinates as unknown[]) : undefined;
    const row = checkRow(
      {
        code: p.code ?? p.site_code,
        name: p.name ?? p.site_name,
        type: p.site_type ?? p.type,
        // RFC 7946: a Point is [longitude, latitude] in WGS84
        ...(point ? { longitude: point[0], latitude: point[1], datum: 'WGS84' } : { datum: p.datum }),
        runOrder: p.run_order,
        accuracyM: p.accuracy_m,
        elevationM: p.elevation_m,
        notes: p.notes,
      },
      i + 1,
      have,
      seen,
    );
    if (g && !point) row.errors.push('The geometry is not a Point: the position was left out.');
    return row;
  });
  return { format: 'geojson', rows, fileErrors: [] };
}

/** Pick the reader by the file's name or, failing that, its first character. */
export function previewSiteFile(fileName: string, content: string, existing: Site[]): SitePreview {
  const body = content.replace(/^\uFEFF/, '');
  const json = /\.(geo)?json$/i.test(fileName) || body.trimStart().startsWith('{');
  return json ? previewSiteGeoJson(body, existing) : previewSiteCsv(body, existing);
}

/** Store every row without errors (new sites created, known codes updated); rows with errors are left out. */
export async function importSites(preview: SitePreview, by: string): Promise<{ created: number; updated: number; skipped: number }> {
  let created = 0;
  let updated = 0;
  for (const row of preview.rows) {
    if (row.errors.length > 0 || !row.site) continue;
    await saveSite(row.site, by);
    if (row.action === 'update') updated++;
    else created++;
  }
  return { created, updated, skipped: preview.rows.length - created - updated };
}
