// CSV for the office: RFC 4180 via papaparse, UTF-8 (optional BOM for spreadsheets), every raw
// input with its unit in the header, computed indicators with the engine version, and no cell
// that a spreadsheet would run as a formula.
import Papa from 'papaparse';
import { conductivityStandardCheck, DEFAULT_PROFILE, doAirCalibrationCheck, ENGINE_VERSION, median, phCalibration, type MethodProfile, type QcVerdict } from '../chemistry';
import { qcVerdictFor } from '../records/qc';
import type { DeriveSettings, Derived } from '../records/derive';
import { derivedFor } from '../records/derived-cache';
import { siteFactorsFrom } from '../records/site-factor';
import { kitFraction, kitMethod } from '../records/methods';
import type { CalibrationEvent, Sample, Settings, Site } from '../records/schema';
import { rounded, type RoundKey } from './rounding';
import { utcIsoOrUndefined } from '../records/time';

export type Cell = string | number | boolean | null | undefined;

const FORMULA_START = /^[=+\-@\t\r]/;
const PLAIN_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * Neutralise a cell a spreadsheet would evaluate (OWASP "CSV injection"): text starting with
 * =, +, -, @, tab or CR gets a leading apostrophe. Numbers stay numbers ("-0.25" is data).
 */
export function safeCell(v: Cell): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : '';
  if (typeof v === 'boolean') return v ? 'true' : 'false';
  if (FORMULA_START.test(v) && !PLAIN_NUMBER.test(v)) return `'${v}`;
  return v;
}

/** Undo {@link safeCell} for text we wrote (a leading apostrophe before a formula character). */
export function unsafeCell(s: string): string {
  return /^'[=+\-@\t\r]/.test(s) ? s.slice(1) : s;
}

export function toCsv(header: string[], rows: Cell[][], opts: { bom?: boolean } = {}): string {
  const body = Papa.unparse({ fields: header.map(safeCell), data: rows.map((r) => r.map(safeCell)) }, { newline: '\r\n', quotes: false, escapeFormulae: false });
  return (opts.bom ? '\uFEFF' : '') + body + '\r\n';
}

export function parseCsv(text: string): { header: string[]; rows: Array<Record<string, string>>; errors: string[] } {
  const clean = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const r = Papa.parse<Record<string, string>>(clean, { header: true, skipEmptyLines: 'greedy' });
  return {
    header: r.meta.fields ?? [],
    rows: r.data,
    errors: r.errors.map((e) => `row ${e.row !== undefined ? e.row + 2 : '?'}: ${e.message}`),
  };
}

/** A column of the wide file: header (with unit) and how to read it from a sample. */
interface Col {
  h: string;
  get: (x: ColInput) => Cell;
  /** the rounding rule of a numeric column */
  rule?: RoundKey;
}
/** One sample with what its columns read: its site, its derived results, its QC verdict. */
export interface Row {
  s: Sample;
  site?: Site | undefined;
  d: Derived;
  parentCode?: string | undefined;
  qc?: QcVerdict | undefined;
}
/** A row and the export's settings (the WQX IDs the samples CSV also writes). */
type ColInput = Row & { settings?: Partial<Pick<Settings, 'projectId' | 'organizationId'>> | undefined };

/** A numeric column rounded by its parameter's rule (rounding.ts), so no cell carries float noise. */
const num = (h: string, rule: RoundKey, get: (x: ColInput) => number | undefined | null): Col => ({ h, rule, get: (x) => rounded(rule, get(x)) });

/**
 * The value the crew reports for a repeated reading: the stabilization median derive() used, so the
 * raw columns agree with the computed ones; the median of all readings if derivation stopped early.
 */
export const reported = (d: Derived, key: keyof Derived['stability'], vals: Array<{ value: number }> | undefined) =>
  d.stability[key]?.median ?? (vals && vals.length > 0 ? median(vals.map((v) => v.value)) : undefined);

const kit = (s: Sample, analyte: string) => s.field.kits.find((k) => k.analyte === analyte);
const caKit = (s: Sample) => kit(s, 'calcium') ?? kit(s, 'calcium-hardness');
/** A method as one cell: "3500-CA(B) (APHA)". */
export const methodText = (m: { id: string; context: string }) => `${m.id} (${m.context})`;

export const WIDE_COLUMNS: Col[] = [
  { h: 'sample_id', get: ({ s }) => s.id },
  { h: 'sample_code', get: ({ s }) => s.sampleCode },
  { h: 'site_code', get: ({ site }) => site?.code },
  { h: 'site_name', get: ({ site }) => site?.name },
  { h: 'site_type', get: ({ site }) => site?.type },
  num('latitude_deg', 'latLon', ({ site }) => site?.latitude),
  num('longitude_deg', 'latLon', ({ site }) => site?.longitude),
  { h: 'datum', get: ({ site }) => site?.datum },
  num('position_accuracy_m', 'metres', ({ site }) => site?.accuracyM),
  { h: 'time_local', get: ({ s }) => s.time },
  { h: 'time_utc', get: ({ s }) => utcIsoOrUndefined(s.time) },
  { h: 'time_zone', get: ({ s }) => s.timeZone },
  { h: 'local_date', get: ({ s }) => s.localDate },
  { h: 'crew', get: ({ s }) => s.crew.join('; ') },
  { h: 'instrument_ids', get: ({ s }) => s.instrumentIds.join('; ') },
  { h: 'method', get: ({ s }) => s.method },
  { h: 'flow', get: ({ s }) => s.flow },
  { h: 'weather', get: ({ s }) => s.weather },
  { h: 'qc_type', get: ({ s }) => s.qc.type },
  { h: 'qc_parent_id', get: ({ s }) => s.qc.parentId },
  { h: 'qc_parent_code', get: ({ parentCode }) => parentCode },
  { h: 'qc_verdict', get: ({ s, qc }) => (s.qc.type === 'environmental' ? undefined : qc?.pass === undefined ? 'not judged' : qc.pass ? 'pass' : 'fail') },
  { h: 'qc_detail', get: ({ s, qc }) => (s.qc.type === 'environmental' ? undefined : qc ? qc.checks.map((c) => `${c.pass ? 'ok' : 'FAIL'} ${c.message}`).join(' | ') || undefined : 'no parent sample') },
  { h: 'qc_profile', get: ({ qc }) => (qc ? `${qc.profile.profileId} v${qc.profile.profileVersion}` : undefined) },
  { h: 'project_id', get: ({ settings }) => settings?.projectId },
  { h: 'organization_id', get: ({ settings }) => settings?.organizationId },
  // raw inputs, as entered
  num('water_temp_degC', 'temperature', ({ s, d }) => reported(d, 'temperature', s.field.tempC?.values)),
  { h: 'water_temp_readings_n', get: ({ s }) => s.field.tempC?.values.length },
  { h: 'conductance_mode', get: ({ s }) => s.field.conductance?.mode },
  num('ec_raw_uS_cm', 'conductance', ({ s, d }) => (s.field.conductance?.mode === 'ec' ? reported(d, 'sc', s.field.conductance.values) : undefined)),
  num('ec_temp_degC', 'temperature', ({ s }) => (s.field.conductance?.mode === 'ec' ? s.field.conductance.tempC : undefined)),
  num('ec_alpha_per_degC', 'alpha', ({ s }) => (s.field.conductance?.mode === 'ec' ? s.field.conductance.alpha : undefined)),
  num('sc_field_uS_cm_25C', 'conductance', ({ s, d }) => (s.field.conductance?.mode === 'sc' ? reported(d, 'sc', s.field.conductance.values) : undefined)),
  num('ph_field', 'pH', ({ s, d }) => reported(d, 'pH', s.field.pH?.values)),
  { h: 'ph_readings_n', get: ({ s }) => s.field.pH?.values.length },
  { h: 'ph_stable', get: ({ d }) => d.stability.pH?.stable },
  { h: 'do_field', rule: 'doMgL', get: ({ s, d }) => rounded(s.field.do?.unit === '%' ? 'doPercent' : 'doMgL', reported(d, 'do', s.field.do?.values)) },
  { h: 'do_field_unit', get: ({ s }) => s.field.do?.unit },
  num('pressure', 'pressure', ({ s }) => s.pressure?.value),
  { h: 'pressure_unit', get: ({ s }) => s.pressure?.unit },
  { h: 'pressure_source', get: ({ s }) => s.pressure?.source },
  num('alkalinity_entered', 'concentration', ({ s }) => (s.field.alkalinity?.kind === 'direct' ? s.field.alkalinity.value : undefined)),
  { h: 'alkalinity_entered_unit', get: ({ s }) => (s.field.alkalinity?.kind === 'direct' ? s.field.alkalinity.unit : s.field.alkalinity ? 'titration' : undefined) },
  { h: 'titration_points_n', get: ({ s }) => (s.field.alkalinity?.kind === 'titration' ? s.field.alkalinity.titration.points.length : undefined) },
  num('ca_kit', 'concentration', ({ s }) => caKit(s)?.value),
  { h: 'ca_kit_unit', get: ({ s }) => caKit(s)?.unit },
  { h: 'ca_kit_fraction', get: ({ s }) => { const k = caKit(s); return k && kitFraction(k); } },
  { h: 'ca_kit_method', get: ({ s }) => { const k = caKit(s); return k && methodText(kitMethod(k)); } },
  num('total_hardness_kit_mg_L_CaCO3', 'concentration', ({ s }) => kit(s, 'total-hardness')?.value),
  num('mg_mg_L', 'concentration', ({ s }) => s.field.ions.mgMgL),
  num('na_mg_L', 'concentration', ({ s }) => s.field.ions.naMgL),
  num('k_mg_L', 'concentration', ({ s }) => s.field.ions.kMgL),
  num('cl_mg_L', 'concentration', ({ s }) => s.field.ions.clMgL),
  num('so4_mg_L', 'concentration', ({ s }) => s.field.ions.so4MgL),
  num('no3_mg_L_as_N', 'concentration', ({ s }) => s.field.ions.no3NMgL),
  num('f_mg_L', 'concentration', ({ s }) => s.field.ions.fMgL),
  num('sio2_mg_L', 'concentration', ({ s }) => s.field.ions.sio2MgL),
  num('tds_mg_L', 'concentration', ({ s }) => s.field.ions.tdsMgL),
  num('nh3nh4_mg_L_as_N', 'concentration', ({ s }) => s.field.ions.nh3nh4NMgL),
  { h: 'remarks', get: ({ s }) => s.remarks },
  { h: 'qualifiers', get: ({ s }) => s.qualifiers.join('; ') },
  { h: 'profile_id', get: ({ s }) => s.profileId },
  { h: 'profile_version', get: ({ s }) => s.profileVersion },
  { h: 'revision', get: ({ s }) => s.revision },
  // computed (derived now from the stored inputs by this engine version)
  { h: 'engine_version', get: ({ d }) => d.engineVersion },
  num('sc_uS_cm_25C', 'conductance', ({ d }) => d.input.scUsPerCm ?? undefined),
  num('alkalinity_mg_L_CaCO3', 'concentration', ({ d }) => d.input.alkalinityMgLCaCO3 ?? undefined),
  { h: 'alkalinity_method', get: ({ d, s }) => (s.field.alkalinity?.kind === 'titration' ? d.titration?.method : s.field.alkalinity ? 'entered' : undefined) },
  num('ca_mg_L', 'concentration', ({ d }) => d.input.caMgL ?? undefined),
  num('ionic_strength_mol_L', 'ionicStrength', ({ d }) => d.analysis?.ionicStrength.value),
  { h: 'ionic_strength_source', get: ({ d }) => ionicStrengthSource(d) },
  { h: 'activity_model', get: ({ d }) => d.analysis?.activityModel },
  num('si_calcite', 'index', ({ d }) => d.analysis?.saturationIndex.calcite),
  num('si_calcite_band_95pct', 'uncertainty', ({ d }) => d.analysis?.calciteSiUncertainty),
  { h: 'calcite_state', get: ({ d }) => d.analysis?.calciteState },
  num('si_aragonite', 'index', ({ d }) => d.analysis?.saturationIndex.aragonite),
  num('si_dolomite', 'index', ({ d }) => d.analysis?.saturationIndex.dolomite),
  num('si_gypsum', 'index', ({ d }) => d.analysis?.saturationIndex.gypsum),
  num('log_pco2_atm', 'index', ({ d }) => d.analysis?.logPco2),
  num('dic_mmol_L', 'smallConcentration', ({ d }) => d.analysis?.carbonate?.dicMmolL),
  num('ph_s', 'index', ({ d }) => d.analysis?.langelier?.pHs),
  num('langelier_index', 'index', ({ d }) => d.analysis?.langelier?.lsi),
  num('ryznar_index', 'index', ({ d }) => d.analysis?.langelier?.rsi),
  num('hardness_mg_L_CaCO3', 'concentration', ({ d }) => d.analysis?.hardnessMgLCaCO3 ?? d.analysis?.calciumHardnessMgLCaCO3),
  num('charge_balance_pct', 'percent', ({ d }) => d.analysis?.chargeBalancePercent),
  num('sc_calculated_uS_cm', 'conductance', ({ d }) => d.analysis?.calculatedScUsPerCm),
  num('do_mg_L', 'doMgL', ({ d }) => d.doMgL),
  num('do_saturation_pct', 'doPercent', ({ d }) => d.doPercent),
  num('nh3_unionized_mg_L_as_N', 'smallConcentration', ({ d }) => d.nh3?.nh3NMgL),
  { h: 'flags', get: ({ d }) => [...new Set(d.warnings.map((w) => w.code))].join('; ') },
  { h: 'checks_failed', get: ({ d }) => d.checks.filter((c) => c.status === 'fail').map((c) => c.id).join('; ') },
  { h: 'input_error', get: ({ d }) => d.error?.message },
];

export interface ExportContext {
  samples: Sample[];
  sites: Site[];
  /** engine settings (each site's own conductance factor is computed from `samples` unless given), and the WQX IDs */
  settings: DeriveSettings & Partial<Pick<Settings, 'projectId' | 'organizationId'>>;
  profile?: MethodProfile;
  /** a QC parent outside `samples` (the export worker writes a selection in slices and looks parents up in all of it) */
  parentOf?: (sampleId: string) => Sample | undefined;
  /** the readable code of a sample outside `samples` (a QC parent from another day) */
  codeOf?: (sampleId: string) => string | undefined;
  /** the profile version each sample was judged under (verdicts belong to it); `profile` when unknown */
  profileOf?: (s: Sample) => MethodProfile | undefined;
}

/** The ionic-strength source as exported: a site's own conductance factor is named, with its analyses. */
export function ionicStrengthSource(d: Derived): string | undefined {
  const i = d.analysis?.ionicStrength;
  if (!i) return undefined;
  return i.source === 'conductance' && i.conductanceFactor?.source === 'site' ? `conductance-site-factor (${i.conductanceFactor.n} full analyses)` : i.source;
}

/** Each sample with its site, derived results, parent code and QC verdict: what the columns (and the WQX writer) read. */
export function derivedRows(ctx: ExportContext): Row[] {
  const siteById = new Map(ctx.sites.map((s) => [s.id, s]));
  const settings = { ...ctx.settings, siteFactors: ctx.settings.siteFactors ?? siteFactorsFrom(ctx.samples, ctx.settings) };
  const rows: Row[] = ctx.samples.map((s) => ({ s, site: siteById.get(s.siteId), d: derivedFor(s, settings, ctx.profileOf?.(s) ?? ctx.profile) }));
  const byId = new Map(rows.map((r) => [r.s.id, r]));
  const profile = ctx.profile ?? DEFAULT_PROFILE;
  for (const r of rows) {
    const pid = r.s.qc.parentId;
    const outside = pid && !byId.has(pid) ? ctx.parentOf?.(pid) : undefined;
    const parent = pid ? byId.get(pid) ?? (outside ? { s: outside, d: derivedFor(outside, settings, ctx.profile) } : undefined) : undefined;
    if (r.s.qc.parentId) r.parentCode = parent?.s.sampleCode ?? ctx.codeOf?.(r.s.qc.parentId);
    r.qc = qcVerdictFor(r.s, r.d, parent ? { derived: parent.d } : undefined, ctx.profileOf?.(r.s) ?? profile);
  }
  return rows;
}

/** One row per sample. */
export function wideCsv(ctx: ExportContext, opts: { bom?: boolean } = {}): string {
  const rows = derivedRows(ctx).map((x) => WIDE_COLUMNS.map((c) => c.get({ ...x, settings: ctx.settings })));
  return toCsv(WIDE_COLUMNS.map((c) => c.h), rows, opts);
}

export const LONG_HEADER = [
  'sample_id', 'sample_code', 'site_code', 'latitude_deg', 'longitude_deg', 'datum', 'time_local', 'time_zone', 'qc_type', 'qc_parent_id',
  'qc_parent_code', 'parameter', 'value', 'unit_ucum', 'band_95pct_plus_minus', 'origin', 'method', 'sample_fraction', 'qualifier',
];

/** One row per value, with UCUM unit codes, the value's origin, its QC type and position, and its band where it has one. */
export function longCsv(ctx: ExportContext, opts: { bom?: boolean } = {}): string {
  const out: Cell[][] = [];
  for (const { s, site, d, parentCode } of derivedRows(ctx)) {
    const add = (parameter: string, rule: RoundKey | undefined, value: number | undefined, ucum: string, origin: 'field' | 'lab' | 'computed', method: string, qualifier = '', extra: { band?: number | undefined; fraction?: string | undefined } = {}) => {
      if (value === undefined || !Number.isFinite(value)) return;
      out.push([
        s.id, s.sampleCode, site?.code, rounded('latLon', site?.latitude), rounded('latLon', site?.longitude), site?.datum, s.time, s.timeZone, s.qc.type, s.qc.parentId,
        parentCode, parameter, rule ? rounded(rule, value) : value, ucum, rounded('uncertainty', extra.band), origin, method, extra.fraction, qualifier,
      ]);
    };
    const q = s.qualifiers.join('; ');
    add('water_temperature', 'temperature', reported(d, 'temperature', s.field.tempC?.values), 'Cel', 'field', 'median of stable readings', q);
    if (s.field.conductance?.mode === 'ec') add('conductivity_raw', 'conductance', reported(d, 'sc', s.field.conductance.values), 'uS/cm', 'field', `at ${s.field.conductance.tempC ?? 'water'} Cel, alpha ${s.field.conductance.alpha}`, q);
    add('specific_conductance_25C', 'conductance', d.input.scUsPerCm ?? undefined, 'uS/cm', s.field.conductance?.mode === 'sc' ? 'field' : 'computed', s.field.conductance?.mode === 'sc' ? 'meter-compensated' : 'Standard Methods 2510 linear', q);
    add('pH', 'pH', reported(d, 'pH', s.field.pH?.values), '[pH]', 'field', 'median of stable readings', q);
    add('dissolved_oxygen', 'doMgL', d.doMgL, 'mg/L', s.field.do?.unit === 'mg/L' ? 'field' : 'computed', 'Benson & Krause', q);
    add('dissolved_oxygen_saturation', 'doPercent', d.doPercent, '%', s.field.do?.unit === '%' ? 'field' : 'computed', 'Benson & Krause', q);
    const alk = s.field.alkalinity;
    add('alkalinity_as_CaCO3', 'concentration', d.input.alkalinityMgLCaCO3 ?? undefined, 'mg/L', alk?.kind === 'titration' ? 'computed' : 'field', alk?.kind === 'titration' ? `titration, ${d.titration?.method}` : 'entered', q, { fraction: alk?.kind === 'titration' ? (alk.titration.filtered ? 'dissolved' : 'total') : undefined });
    const ca = caKit(s);
    add('calcium', 'concentration', d.input.caMgL ?? undefined, 'mg/L', 'field', ca ? `kit ${methodText(kitMethod(ca))}` : 'kit', q, { fraction: ca && kitFraction(ca) });
    for (const [k, v] of Object.entries(s.field.ions)) add(k.replace(/MgL$/, ''), 'concentration', v, 'mg/L', 'field', 'field kit or meter', q);
    for (const l of s.lab) {
      // a censored result keeps its row: the detection limit as the value, marked not detected
      if (l.censored) add(l.parameter, undefined, l.detectionLimit, l.unitUcum ?? l.unit, 'lab', l.method ?? '', ['not detected', l.qualifier].filter(Boolean).join('; '), { fraction: l.fraction });
      else add(l.parameter, undefined, l.value, l.unitUcum ?? l.unit, 'lab', l.method ?? '', l.qualifier ?? '', { fraction: l.fraction });
    }
    const a = d.analysis;
    if (a) {
      add('ionic_strength', 'ionicStrength', a.ionicStrength.value, 'mol/L', 'computed', `from ${ionicStrengthSource(d)}; engine ${ENGINE_VERSION}`);
      add('saturation_index_calcite', 'index', a.saturationIndex.calcite, '1', 'computed', `${a.activityModel}; band 95 %, k = 2`, '', { band: a.calciteSiUncertainty });
      add('saturation_index_aragonite', 'index', a.saturationIndex.aragonite, '1', 'computed', a.activityModel);
      add('saturation_index_dolomite', 'index', a.saturationIndex.dolomite, '1', 'computed', a.activityModel);
      add('saturation_index_gypsum', 'index', a.saturationIndex.gypsum, '1', 'computed', a.activityModel);
      add('log_pCO2', 'index', a.logPco2, '1', 'computed', 'log10 atm');
      add('langelier_index', 'index', a.langelier?.lsi, '1', 'computed', 'Standard Methods 2330 B');
      add('ryznar_index', 'index', a.langelier?.rsi, '1', 'computed', 'Ryznar 1944');
      add('hardness_as_CaCO3', 'concentration', a.hardnessMgLCaCO3, 'mg/L', 'computed', 'Standard Methods 2340 B');
      add('charge_balance', 'percent', a.chargeBalancePercent, '%', 'computed', 'Standard Methods 1030 E');
    }
  }
  return toCsv(LONG_HEADER, out, opts);
}

/**
 * What a meter check found, from the engine's calibration functions: pH slope (% of Nernst) and
 * offset at pH 7 (mV); SC and DO deviation from the standard (% and mg/L). Undefined where the
 * entries cannot give it (the engine refuses them).
 */
export function calibrationFigures(c: CalibrationEvent): { slopePercent?: number; offsetMv?: number; deviation?: number; deviationUnit?: string } {
  const e = c.entries;
  try {
    if (e.parameter === 'pH') {
      const r = phCalibration(e.buffers);
      return { slopePercent: rounded('percent', r.slopePercent), offsetMv: rounded('mV', r.offsetMv), deviation: rounded('pH', r.readBack.length > 2 ? Math.max(...r.readBack.slice(2).map((b) => Math.abs(b.errorPH))) : undefined), deviationUnit: r.readBack.length > 2 ? 'pH' : undefined };
    }
    if (e.parameter === 'sc') return { deviation: rounded('percent', conductivityStandardCheck(e.standardUsPerCm, e.readingUsPerCm).deviationPercent), deviationUnit: '%' };
    if (e.parameter === 'do') return { deviation: rounded('doMgL', doAirCalibrationCheck(e.readingMgL, e.tempC, e.pressureKPa, e.salinity).differenceMgL), deviationUnit: 'mg/L' };
    return { deviation: rounded('temperature', e.readingC - e.referenceC), deviationUnit: 'Cel' };
  } catch {
    return {};
  }
}

export function calibrationsCsv(events: CalibrationEvent[], opts: { bom?: boolean } = {}): string {
  const rows = events.map((c) => {
    const e = c.entries;
    const f = calibrationFigures(c);
    return [
      c.id, c.instrumentId, c.parameter, c.kind, c.time, c.operator, c.pass, c.profileId, c.profileVersion,
      e.parameter === 'pH' ? e.buffers.map((b) => `${rounded('pH', b.bufferPH)}@${rounded('mV', b.mV)}mV/${rounded('temperature', b.tempC)}C`).join(' | ') : '',
      e.parameter === 'sc' ? rounded('conductance', e.standardUsPerCm) : '', e.parameter === 'sc' ? rounded('conductance', e.readingUsPerCm) : '',
      e.parameter === 'do' ? rounded('doMgL', e.readingMgL) : '', e.parameter === 'do' ? rounded('temperature', e.tempC) : '', e.parameter === 'do' ? rounded('pressure', e.pressureKPa) : '',
      f.slopePercent, f.offsetMv, f.deviation, f.deviationUnit,
      c.remarks,
    ];
  });
  return toCsv(
    ['calibration_id', 'instrument_id', 'parameter', 'kind', 'time_local', 'operator', 'pass', 'profile_id', 'profile_version', 'ph_buffers', 'sc_standard_uS_cm_25C', 'sc_reading_uS_cm_25C', 'do_reading_mg_L', 'do_temp_degC', 'do_pressure_kPa', 'ph_slope_pct_nernst', 'ph_offset_mV_at_pH7', 'deviation', 'deviation_unit', 'remarks'],
    rows,
    opts,
  );
}

export function titrationsCsv(samples: Sample[], opts: { bom?: boolean } = {}): string {
  const rows: Cell[][] = [];
  for (const s of samples) {
    if (s.field.alkalinity?.kind !== 'titration') continue;
    const t = s.field.alkalinity.titration;
    t.points.forEach((p, i) => rows.push([s.id, i + 1, rounded('titrant', p.amount), t.equipment === 'buret' ? 'mL' : 'counts', rounded('pH', p.pH), t.sampleVolumeMl, t.titrantNormality, t.correctionFactor, t.countsPerMl]));
  }
  return toCsv(['sample_id', 'point', 'titrant_amount', 'titrant_unit', 'pH', 'sample_volume_mL', 'titrant_normality_eq_L', 'correction_factor', 'counts_per_mL'], rows, opts);
}
