// The US EPA Water Quality Exchange (WQX) web template: Physical/Chemical Results (one row per
// result) and Monitoring Locations (one row per site), with the template's own column names and
// value lists. Pure functions, no DOM: the Send screen, the office command (Node) and a Web Worker
// call them alike. The tests validate every row against the published JSON Schema (`wqx` package),
// including its conditional rules; the package itself never enters the app.
import { ENGINE_VERSION } from '../chemistry';
import type { Derived } from '../records/derive';
import { FIELD_METHODS, ION_METHODS, kitFraction, kitMethod, labFraction, labMethod } from '../records/methods';
import type { KitResult, LabResult, MethodRef, Sample, SampleFraction, Settings, Site } from '../records/schema';
import { baseSampleCode, freeSampleCode, SAMPLE_CODE_MAX } from '../records/sample-code';
import { wallClock } from '../records/time';
import { derivedRows, ionicStrengthSource, reported, toCsv, type Cell, type ExportContext } from './csv';
import { rounded, type RoundKey } from './rounding';

export type WqxRow = Record<string, string | number>;

/** The results template's columns that Bankside fills, in the template's order. */
export const WQX_RESULT_COLUMNS = [
  'Activity ID', 'Activity Type', 'Activity Media Name', 'Activity Media Subdivision Name', 'Activity Start Date', 'Activity Start Time',
  'Activity Start Time Zone', 'Project ID', 'Organization', 'Monitoring Location ID', 'Activity Comment', 'Result Detection Condition',
  'Characteristic Name', 'Method Speciation', 'Result Sample Fraction', 'Result Value', 'Result Unit', 'Result Qualifier',
  'Statistical Base Code', 'Result Value Type', 'Result Temperature Basis', 'Upper Confidence Limit', 'Lower Confidence Limit',
  'Result Comment', 'Result Analytical Method ID', 'Result Analytical Method Context', 'Result Detection/Quantitation Limit Type',
  'Result Detection/Quantitation Limit Measure', 'Result Detection/Quantitation Limit Unit',
] as const;

/** The monitoring-locations template's columns that Bankside fills, in the template's order. */
export const WQX_LOCATION_COLUMNS = [
  'Monitoring Location ID', 'Monitoring Location Name', 'Monitoring Location Type', 'Monitoring Location Description',
  'Monitoring Location Latitude', 'Monitoring Location Longitude', 'Monitoring Location Horizontal Accuracy Measure Value',
  'Monitoring Location Horizontal Accuracy Measure Unit Code', 'Monitoring Location Horizontal Collection Method',
  'Monitoring Location Horizontal Coordinate Reference System', 'Vertical Measure', 'Vertical Unit',
] as const;

/**
 * Activity types by QC type. WQX keeps a field measurement and a collected sample in separate
 * activities: the meter readings, kits and field titration form one activity (Field Msr/Obs), lab
 * results on the bottle form another (Sample-Routine).
 */
export const FIELD_ACTIVITY_TYPE: Record<Sample['qc']['type'], string> = {
  environmental: 'Field Msr/Obs',
  replicate: 'Quality Control Field Replicate Msr/Obs',
  blank: 'Quality Control Sample-Field Blank',
};
export const LAB_ACTIVITY_TYPE: Record<Sample['qc']['type'], string> = {
  environmental: 'Sample-Routine',
  replicate: 'Quality Control Sample-Field Replicate',
  blank: 'Quality Control Sample-Field Blank',
};

const SITE_TYPE: Record<Site['type'], string> = { stream: 'River/Stream', spring: 'Spring', well: 'Well', lake: 'Lake', other: 'Other-Surface Water' };
const MEDIA_SUBDIVISION: Record<Site['type'], string> = { stream: 'Surface Water', lake: 'Surface Water', other: 'Surface Water', spring: 'Groundwater', well: 'Groundwater' };
const FRACTION: Record<SampleFraction, string> = { total: 'Total', dissolved: 'Dissolved' };

/** WQX time-zone codes of the zones it lists, by IANA zone and UTC offset. */
const TZ_CODES: Array<[RegExp, Record<string, string>]> = [
  [/^(America\/(New_York|Detroit|Toronto|Nassau|Indiana\/(Indianapolis|Marengo|Petersburg|Vevay|Vincennes|Winamac)|Kentucky\/.+)|US\/Eastern|EST5EDT)$/, { '-05:00': 'EST', '-04:00': 'EDT' }],
  [/^(America\/(Chicago|Winnipeg|Menominee|Indiana\/(Knox|Tell_City)|North_Dakota\/.+)|US\/Central|CST6CDT)$/, { '-06:00': 'CST', '-05:00': 'CDT' }],
  [/^(America\/(Denver|Boise|Edmonton|Phoenix)|US\/(Mountain|Arizona)|MST7MDT)$/, { '-07:00': 'MST', '-06:00': 'MDT' }],
  [/^(America\/(Los_Angeles|Vancouver)|US\/Pacific|PST8PDT)$/, { '-08:00': 'PST', '-07:00': 'PDT' }],
  [/^(America\/(Anchorage|Juneau|Sitka|Nome|Yakutat|Metlakatla)|US\/Alaska)$/, { '-09:00': 'AKST', '-08:00': 'AKDT' }],
  [/^(Pacific\/Honolulu|US\/Hawaii|America\/Adak)$/, { '-10:00': 'HAST', '-09:00': 'HADT' }],
  [/^(America\/(Halifax|Puerto_Rico|St_Thomas|Moncton|Glace_Bay|Goose_Bay)|Atlantic\/Bermuda)$/, { '-04:00': 'AST', '-03:00': 'ADT' }],
  [/^America\/St_Johns$/, { '-03:30': 'NST', '-02:30': 'NDT' }],
  [/^Europe\/(London|Dublin)$/, { '+00:00': 'GMT', '+01:00': 'BST' }],
  [/^Europe\/(Amsterdam|Berlin|Brussels|Budapest|Copenhagen|Madrid|Oslo|Paris|Prague|Rome|Stockholm|Vienna|Warsaw|Zurich)$/, { '+01:00': 'CET', '+02:00': 'CEST' }],
  [/^Pacific\/(Guam|Saipan)$/, { '+10:00': 'GST' }],
  [/^Pacific\/(Pago_Pago|Midway)$/, { '-11:00': 'SST' }],
  [/^Asia\/Seoul$/, { '+09:00': 'KST' }],
  [/^(UTC|Etc\/UTC|Etc\/GMT)$/, { '+00:00': 'UTC' }],
];

/** The WQX code of a sample's time zone (MDT, CET…), or undefined where WQX lists none: the time keeps its offset anyway. */
export function wqxTimeZoneCode(timeZone: string | undefined, offset: string): string | undefined {
  if (!timeZone) return offset === '+00:00' ? 'UTC' : undefined;
  return TZ_CODES.find(([re]) => re.test(timeZone))?.[1][offset];
}

/** Activity IDs hold at most 35 characters (WQX), as sample codes do. */
export const ACTIVITY_ID_MAX = SAMPLE_CODE_MAX;

/**
 * The Activity ID of a sample's field activity: its readable sample code (given by the store at the
 * first save, written on the bottle), or for a record without one the code it would get
 * (SITE-YYYYMMDD-HHMM, -R replicate, -B blank), made unique within the file.
 */
export function activityIdOf(s: Pick<Sample, 'time' | 'qc' | 'sampleCode'>, site: Pick<Site, 'code'> | undefined, taken: ReadonlySet<string> = new Set()): string {
  return s.sampleCode ?? freeSampleCode(baseSampleCode(site?.code ?? 'SITE', s.time, s.qc.type), taken);
}

/**
 * `id` + suffix (e.g. "-L" for the lab activity), unique among `taken`, at most 35 characters: when
 * it would not fit, the site part of the code gives way (date, time and QC letter always stay).
 */
function withSuffix(id: string, suffix: string, taken: Set<string>): string {
  for (let n = 1; ; n++) {
    const end = `${suffix}${n === 1 ? '' : `-${n}`}`;
    let out = `${id}${end}`;
    const over = out.length - ACTIVITY_ID_MAX;
    if (over > 0) {
      const stamp = /-(\d{8}-\d{4}|UNDATED)/.exec(id);
      out = stamp && stamp.index > over ? `${id.slice(0, stamp.index - over)}${id.slice(stamp.index)}${end}` : `${id.slice(0, ACTIVITY_ID_MAX - end.length)}${end}`;
    }
    if (!taken.has(out)) {
      taken.add(out);
      return out;
    }
  }
}

const KIT_CHARACTERISTIC: Record<KitResult['analyte'], { name: string; speciation?: string }> = {
  calcium: { name: 'Calcium' },
  'calcium-hardness': { name: 'Hardness, Calcium', speciation: 'as CaCO3' },
  'total-hardness': { name: 'Hardness, Ca, Mg', speciation: 'as CaCO3' },
  magnesium: { name: 'Magnesium' },
  'ammonia-n': { name: 'Ammonia', speciation: 'as N' },
  chloride: { name: 'Chloride' },
  sulfate: { name: 'Sulfate' },
};

const ION_CHARACTERISTIC: Record<string, { name: string; speciation?: string }> = {
  mgMgL: { name: 'Magnesium' },
  naMgL: { name: 'Sodium' },
  kMgL: { name: 'Potassium' },
  clMgL: { name: 'Chloride' },
  so4MgL: { name: 'Sulfate' },
  no3NMgL: { name: 'Nitrate', speciation: 'as N' },
  fMgL: { name: 'Fluoride' },
  sio2MgL: { name: 'Silica' },
  tdsMgL: { name: 'Total dissolved solids' },
  nh3nh4NMgL: { name: 'Ammonia and ammonium', speciation: 'as N' },
};

/** Lab parameter names (lower case, as labs write them) → WQX characteristic. */
const LAB_CHARACTERISTIC: Array<[RegExp, { name: string; speciation?: string }]> = [
  [/^(calcium|ca)$/, { name: 'Calcium' }],
  [/^(magnesium|mg)$/, { name: 'Magnesium' }],
  [/^(sodium|na)$/, { name: 'Sodium' }],
  [/^(potassium|k)$/, { name: 'Potassium' }],
  [/^(chloride|cl)$/, { name: 'Chloride' }],
  [/^(sulfate|sulphate|so4)$/, { name: 'Sulfate' }],
  [/^(fluoride|f)$/, { name: 'Fluoride' }],
  [/^(silica|sio2)$/, { name: 'Silica' }],
  [/^(nitrate|no3)([ _-]?(as[ _-]?)?n)?$/, { name: 'Nitrate', speciation: 'as N' }],
  [/^(ammonia|nh3|nh4|ammonia[ _-]?n)([ _-]?(as[ _-]?)?n)?$/, { name: 'Ammonia', speciation: 'as N' }],
  [/^alkalinity.*/, { name: 'Alkalinity, total', speciation: 'as CaCO3' }],
  [/^(total )?hardness.*/, { name: 'Hardness, Ca, Mg', speciation: 'as CaCO3' }],
  [/^(tds|total dissolved solids)$/, { name: 'Total dissolved solids' }],
  [/^(specific conductance|sc|conductivity)$/, { name: 'Specific conductance' }],
  [/^ph$/, { name: 'pH' }],
  [/^(iron|fe)$/, { name: 'Iron' }],
  [/^(manganese|mn)$/, { name: 'Manganese' }],
  [/^(bicarbonate|hco3)$/, { name: 'Bicarbonate' }],
];

/** A unit as labs and UCUM write it → the WQX unit code (and the speciation some spellings carry). */
export function wqxUnit(unit: string): { unit: string; speciation?: string } {
  const u = unit.trim().toLowerCase().replace(/\s+/g, ' ').replace('µ', 'u');
  if (/^mg\/l$/.test(u)) return { unit: 'mg/L' };
  if (/^(mg\{n\}\/l|mg\/l (as )?n|mg n\/l)$/.test(u)) return { unit: 'mg/L', speciation: 'as N' };
  if (/^(mg\{caco3\}\/l|mg\/l (as )?caco3)$/.test(u)) return { unit: 'mg/L', speciation: 'as CaCO3' };
  if (/^ug\/l$/.test(u)) return { unit: 'ug/L' };
  if (/^us\/cm( ?@ ?25 ?c)?$/.test(u)) return { unit: 'uS/cm' };
  if (/^meq\/l$/.test(u)) return { unit: 'meq/L' };
  if (/^mmol\/l$/.test(u)) return { unit: 'mmol/L' };
  if (/^(\[ph\]|std units|su|ph units?|1|none)$/.test(u)) return { unit: 'None' };
  if (/^(ntu|\{ntu\})$/.test(u)) return { unit: 'NTU' };
  if (/^(cel|deg c|°c)$/.test(u)) return { unit: 'deg C' };
  if (u === '%') return { unit: '%' };
  return { unit: unit.trim() };
}

/**
 * A lab value the lab reported as not detected: stored censored with its detection limit (lab import),
 * or an older record holding the limit as its value with a U / < / ND qualifier.
 */
function censoring(l: LabResult): { limit: number | undefined } | undefined {
  if (l.censored) return { limit: l.detectionLimit };
  const q = (l.qualifier ?? '').trim().toUpperCase();
  return q === '<' || q === 'U' || q === 'ND' || q === '<DL' ? { limit: l.value } : undefined;
}

const KNOWN_QUALIFIERS = new Set(['U', 'J', 'B', 'E', 'H']);

export interface WqxContext extends ExportContext {
  settings: ExportContext['settings'] & Pick<Settings, 'projectId' | 'organizationId'>;
}

export class WqxExportError extends Error {}

/**
 * One WQX row per result: each sample's meter readings, kits, titration and computed indicators as
 * one field activity, its lab results as a second (sample) activity. Numbers are rounded by the
 * export rules; blanks carry their measured values only (indices of a blank mean nothing).
 */
export function wqxResultRows(ctx: WqxContext): WqxRow[] {
  const projectId = ctx.settings.projectId?.trim() ?? '';
  if (!projectId) throw new WqxExportError('WQX needs a Project ID: set it in Settings (Office).');
  const organization = ctx.settings.organizationId?.trim() ?? '';
  const rows: WqxRow[] = [];
  const taken = new Set<string>();
  const idBySample = new Map<string, string>();
  const all = derivedRows(ctx);
  for (const { s } of all) if (s.sampleCode) taken.add(s.sampleCode);
  for (const { s, site } of all) {
    const id = s.sampleCode ?? activityIdOf(s, site, taken);
    taken.add(id);
    idBySample.set(s.id, id);
  }
  for (const { s, site, d, parentCode } of all) {
    const w = wallClock(s.time);
    const activity = (id: string, type: string): WqxRow => {
      const a: WqxRow = { 'Activity ID': id, 'Activity Type': type, 'Activity Media Name': 'Water', 'Activity Start Date': w?.date ?? s.localDate, 'Project ID': projectId };
      if (site) a['Activity Media Subdivision Name'] = MEDIA_SUBDIVISION[site.type];
      if (w) a['Activity Start Time'] = `${w.hhmmss}${w.offset}`;
      const tz = w && wqxTimeZoneCode(s.timeZone, w.offset);
      if (tz) a['Activity Start Time Zone'] = tz;
      if (organization) a['Organization'] = organization;
      if (site) a['Monitoring Location ID'] = site.code;
      const parent = (s.qc.parentId && idBySample.get(s.qc.parentId)) || parentCode;
      const comment = [s.qc.type === 'replicate' ? `Field replicate${parent ? ` of ${parent}` : ''}` : '', s.remarks].filter(Boolean).join('. ');
      if (comment) a['Activity Comment'] = comment.slice(0, 4000);
      return a;
    };
    const fieldActivity = activity(idBySample.get(s.id)!, FIELD_ACTIVITY_TYPE[s.qc.type]);
    const seen = new Set<string>();
    const estimated = s.qualifiers.includes('estimated');
    const fieldNote = s.qualifiers.filter((q) => q !== 'estimated').map((q) => `field qualifier: ${q}`).join('; ');
    const add = (base: WqxRow, r: ResultSpec) => {
      const key = `${base['Activity ID']}|${r.name}|${r.fraction ?? ''}`;
      if (seen.has(key)) return; // one result per characteristic and fraction in an activity
      seen.add(key);
      const row: WqxRow = { ...base, 'Characteristic Name': r.name };
      if (r.speciation) row['Method Speciation'] = r.speciation;
      if (r.fraction) row['Result Sample Fraction'] = FRACTION[r.fraction];
      if (r.censored) {
        row['Result Detection Condition'] = 'Not Detected';
        if (r.censoredAt !== undefined) {
          row['Result Detection/Quantitation Limit Type'] = 'Detection Limit';
          row['Result Detection/Quantitation Limit Measure'] = r.censoredAt;
          row['Result Detection/Quantitation Limit Unit'] = r.unit;
        }
      } else {
        if (r.value !== undefined) row['Result Value'] = r.value;
        row['Result Unit'] = r.unit;
      }
      if (r.qualifier) row['Result Qualifier'] = r.qualifier;
      if (r.median) row['Statistical Base Code'] = 'Median';
      row['Result Value Type'] = r.calculated ? 'Calculated' : estimated ? 'Estimated' : 'Actual';
      if (r.tempBasis) row['Result Temperature Basis'] = r.tempBasis;
      if (r.upper !== undefined && r.lower !== undefined) {
        row['Upper Confidence Limit'] = r.upper;
        row['Lower Confidence Limit'] = r.lower;
      }
      const comment = [r.comment, r.calculated ? '' : fieldNote].filter(Boolean).join('; ');
      if (comment) row['Result Comment'] = comment.slice(0, 4000);
      if (r.method) {
        row['Result Analytical Method ID'] = r.method.id;
        row['Result Analytical Method Context'] = r.method.context;
      }
      rows.push(row);
    };
    for (const r of fieldResults(s, d)) add(fieldActivity, r);
    if (s.qc.type !== 'blank') for (const r of computedResults(s, d)) add(fieldActivity, r);
    if (s.lab.length > 0) {
      const labActivity = activity(withSuffix(idBySample.get(s.id)!, '-L', taken), LAB_ACTIVITY_TYPE[s.qc.type]);
      for (const l of s.lab) add(labActivity, labResult(l));
    }
  }
  return rows;
}

interface ResultSpec {
  name: string;
  value?: number;
  unit: string;
  speciation?: string | undefined;
  fraction?: SampleFraction | undefined;
  method?: MethodRef | undefined;
  calculated?: boolean;
  median?: boolean;
  tempBasis?: string;
  upper?: number;
  lower?: number;
  comment?: string;
  censored?: boolean;
  censoredAt?: number | undefined;
  qualifier?: string;
}

const r = (rule: RoundKey, v: number | undefined | null) => rounded(rule, v);

/** Meter readings, the titration, kits and typed ions of one sample. */
function fieldResults(s: Sample, d: Derived): ResultSpec[] {
  const out: ResultSpec[] = [];
  const push = (x: ResultSpec) => {
    if (x.value !== undefined && Number.isFinite(x.value)) out.push(x);
  };
  const f = s.field;
  const many = (vals: unknown[] | undefined) => (vals?.length ?? 0) > 1;
  push({ name: 'Temperature, water', value: r('temperature', reported(d, 'temperature', f.tempC?.values)), unit: 'deg C', method: FIELD_METHODS.temperature, median: many(f.tempC?.values) });
  const c = f.conductance;
  if (c?.mode === 'ec') {
    push({ name: 'Conductivity', value: r('conductance', reported(d, 'sc', c.values)), unit: 'uS/cm', method: FIELD_METHODS.conductance, median: many(c.values), comment: `raw, at ${c.tempC ?? 'the water temperature'} deg C` });
    push({ name: 'Specific conductance', value: r('conductance', d.input.scUsPerCm), unit: 'uS/cm', tempBasis: '25 Deg C', calculated: true, comment: `linear compensation, alpha ${c.alpha} per deg C (Standard Methods 2510)` });
  } else if (c) {
    push({ name: 'Specific conductance', value: r('conductance', d.input.scUsPerCm), unit: 'uS/cm', tempBasis: '25 Deg C', method: FIELD_METHODS.conductance, median: many(c.values) });
  }
  push({ name: 'pH', value: r('pH', reported(d, 'pH', f.pH?.values)), unit: 'None', method: FIELD_METHODS.pH, median: many(f.pH?.values) });
  if (f.do) {
    const measuredMgL = f.do.unit === 'mg/L';
    push({ name: 'Dissolved oxygen (DO)', value: r('doMgL', d.doMgL), unit: 'mg/L', ...(measuredMgL ? { method: FIELD_METHODS.do, median: many(f.do.values) } : { calculated: true, comment: 'from % saturation (Benson & Krause)' }) });
    push({ name: 'Dissolved oxygen saturation', value: r('doPercent', d.doPercent), unit: '%', ...(!measuredMgL ? { method: FIELD_METHODS.do, median: many(f.do.values) } : { calculated: true, comment: 'from mg/L (Benson & Krause)' }) });
  }
  const alk = f.alkalinity;
  if (alk) {
    const titr = alk.kind === 'titration';
    push({
      name: 'Alkalinity, total', value: r('concentration', d.input.alkalinityMgLCaCO3), unit: 'mg/L', speciation: 'as CaCO3', method: FIELD_METHODS.alkalinity,
      fraction: titr ? (alk.titration.filtered ? 'dissolved' : 'total') : 'total',
      comment: titr ? `field titration, ${d.titration?.method ?? 'endpoint'}` : 'field value as entered',
    });
  }
  for (const k of f.kits) {
    const ch = KIT_CHARACTERISTIC[k.analyte];
    const u = wqxUnit(k.unit);
    push({ name: u.speciation === 'as CaCO3' && k.analyte === 'calcium' ? 'Hardness, Calcium' : ch.name, value: r('concentration', k.value), unit: u.unit, speciation: u.speciation ?? ch.speciation, fraction: kitFraction(k), method: kitMethod(k), comment: 'field kit' });
  }
  for (const [key, v] of Object.entries(f.ions)) {
    const ch = ION_CHARACTERISTIC[key];
    if (!ch || v === undefined) continue;
    push({ name: ch.name, value: r('concentration', v), unit: 'mg/L', speciation: ch.speciation, fraction: 'total', method: ION_METHODS[key], comment: 'field kit or meter' });
  }
  return out;
}

/** Indicators the engine computed from the field values (WQX "Calculated"). */
function computedResults(s: Sample, d: Derived): ResultSpec[] {
  const a = d.analysis;
  if (!a) return [];
  const out: ResultSpec[] = [];
  const basis = `Bankside engine ${ENGINE_VERSION}, ${a.activityModel} activity model, ionic strength from ${ionicStrengthSource(d)}`;
  const push = (name: string, value: number | undefined, unit: string, comment: string, extra: Partial<ResultSpec> = {}) => {
    if (value !== undefined && Number.isFinite(value)) out.push({ name, value, unit, calculated: true, comment, ...extra });
  };
  const si = r('index', a.saturationIndex.calcite);
  const band = r('uncertainty', a.calciteSiUncertainty);
  push('Saturation Index Calcite', si, 'None', `${basis}; uncertainty band ±${band ?? '?'}`, si !== undefined && band !== undefined ? { upper: r('index', si + band)!, lower: r('index', si - band)! } : {});
  push('Saturation Index Aragonite', r('index', a.saturationIndex.aragonite), 'None', basis);
  push('Saturation Index Dolomite', r('index', a.saturationIndex.dolomite), 'None', basis);
  push('Saturation Index Gypsum', r('index', a.saturationIndex.gypsum), 'None', basis);
  push('Ionic strength', a.ionicStrength.value === undefined ? undefined : r('ionicStrength', a.ionicStrength.value * 1000), 'mmol/L', basis);
  push('Partial Pressure of Carbon Dioxide', a.logPco2 === undefined ? undefined : r('smallConcentration', 10 ** r('index', a.logPco2)!), 'atm', `${basis}; log pCO2 ${r('index', a.logPco2)}`);
  push('Langelier Saturation Index', r('index', a.langelier?.lsi), 'None', `Standard Methods 2330 B, pHs ${r('index', a.langelier?.pHs)}`);
  push('Corrosion & scaling control, Ryznar Stability Index', r('index', a.langelier?.rsi), 'None', 'Ryznar 1944');
  if (!s.field.kits.some((k) => k.analyte === 'total-hardness')) push('Hardness, Ca, Mg', r('concentration', a.hardnessMgLCaCO3), 'mg/L', 'Standard Methods 2340 B from Ca and Mg', { speciation: 'as CaCO3' });
  push('Ion Balance', r('percent', a.chargeBalancePercent), '%', 'Standard Methods 1030 E');
  return out;
}

function labResult(l: LabResult): ResultSpec {
  const p = l.parameter.trim().toLowerCase();
  const ch = LAB_CHARACTERISTIC.find(([re]) => re.test(p))?.[1] ?? { name: l.parameter.trim() };
  const u = wqxUnit(l.unitUcum ?? l.unit);
  const cens = censoring(l);
  const q = (l.qualifier ?? '').trim().toUpperCase();
  const rule: RoundKey = ch.name === 'pH' ? 'pH' : ch.name === 'Specific conductance' ? 'conductance' : 'concentration';
  return {
    name: ch.name,
    unit: u.unit,
    speciation: u.speciation ?? ch.speciation,
    fraction: labFraction(l),
    method: labMethod(l),
    ...(ch.name === 'Specific conductance' ? { tempBasis: '25 Deg C' } : {}),
    ...(cens ? { censored: true, censoredAt: rounded('smallConcentration', cens.limit) } : { value: rounded(rule, l.value) }),
    ...(KNOWN_QUALIFIERS.has(q) ? { qualifier: q } : {}),
    comment: [l.labSampleId ? `lab sample ${l.labSampleId}` : '', l.method ? `lab method: ${l.method}` : '', q && !KNOWN_QUALIFIERS.has(q) && !cens ? `lab qualifier ${l.qualifier}` : ''].filter(Boolean).join('; '),
  };
}

const asCells = (columns: readonly string[], rows: WqxRow[]): Cell[][] => rows.map((row) => columns.map((c) => row[c]));

/** The Physical/Chemical Results file (RFC 4180, the template's column names). */
export function wqxResultsCsv(ctx: WqxContext, opts: { bom?: boolean } = {}): string {
  return toCsv([...WQX_RESULT_COLUMNS], asCells(WQX_RESULT_COLUMNS, wqxResultRows(ctx)), opts);
}

const CRS: Record<string, string> = { WGS84: 'WGS84', NAD83: 'NAD83', NAD27: 'NAD27', WGS72: 'WGS72' };

/** One Monitoring Locations row per site. */
export function wqxLocationRows(sites: Site[]): WqxRow[] {
  return sites.map((site) => {
    const row: WqxRow = {
      'Monitoring Location ID': site.code,
      'Monitoring Location Name': site.name,
      'Monitoring Location Type': SITE_TYPE[site.type],
      'Monitoring Location Horizontal Collection Method': site.accuracyM !== undefined ? 'GPS-Unspecified' : 'Unknown',
      'Monitoring Location Horizontal Coordinate Reference System': CRS[site.datum.toUpperCase().replace(/[\s-]/g, '').replace(/\(.*\)$/, '')] ?? 'OTHER',
    };
    if (site.notes.trim()) row['Monitoring Location Description'] = site.notes.trim().slice(0, 1999);
    if (site.latitude !== undefined) row['Monitoring Location Latitude'] = rounded('latLon', site.latitude)!;
    if (site.longitude !== undefined) row['Monitoring Location Longitude'] = rounded('latLon', site.longitude)!;
    if (site.accuracyM !== undefined) {
      row['Monitoring Location Horizontal Accuracy Measure Value'] = rounded('metres', site.accuracyM)!;
      row['Monitoring Location Horizontal Accuracy Measure Unit Code'] = 'm';
    }
    if (site.elevationM !== undefined) {
      row['Vertical Measure'] = rounded('metres', site.elevationM)!;
      row['Vertical Unit'] = 'm';
    }
    return row;
  });
}

/** The Monitoring Locations file (RFC 4180, the template's column names). */
export function wqxLocationsCsv(sites: Site[], opts: { bom?: boolean } = {}): string {
  return toCsv([...WQX_LOCATION_COLUMNS], asCells(WQX_LOCATION_COLUMNS, wqxLocationRows(sites)), opts);
}
