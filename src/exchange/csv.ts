// CSV for the office: RFC 4180 via papaparse, UTF-8 (optional BOM for spreadsheets), every raw
// input with its unit in the header, computed indicators with the engine version, and no cell
// that a spreadsheet would run as a formula.
import Papa from 'papaparse';
import { DEFAULT_PROFILE, ENGINE_VERSION, median, type MethodProfile, type QcVerdict } from '../chemistry';
import { qcVerdictFor } from '../records/qc';
import type { DeriveSettings, Derived } from '../records/derive';
import { derivedFor } from '../records/derived-cache';
import { siteFactorsFrom } from '../records/site-factor';
import type { CalibrationEvent, Sample, Settings, Site } from '../records/schema';

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

/** One sample with what its columns read: its site, its derived results, its QC verdict. */
export interface Row {
  s: Sample;
  site?: Site | undefined;
  d: Derived;
  parentCode?: string | undefined;
  qc?: QcVerdict | undefined;
}

/** A column of the wide file: header (with unit) and how to read it from a sample. */
interface Col {
  h: string;
  get: (x: Row) => Cell;
}

/**
 * The value the crew reports for a repeated reading: the stabilization median derive() used, so the
 * raw columns agree with the computed ones; the median of all readings if derivation stopped early.
 */
const reported = (d: Derived, key: keyof Derived['stability'], vals: Array<{ value: number }> | undefined) =>
  d.stability[key]?.median ?? (vals && vals.length > 0 ? median(vals.map((v) => v.value)) : undefined);

const kit = (s: Sample, analyte: string) => s.field.kits.find((k) => k.analyte === analyte);

export const WIDE_COLUMNS: Col[] = [
  { h: 'sample_id', get: ({ s }) => s.id },
  { h: 'sample_code', get: ({ s }) => s.sampleCode },
  { h: 'site_code', get: ({ site }) => site?.code },
  { h: 'site_name', get: ({ site }) => site?.name },
  { h: 'site_type', get: ({ site }) => site?.type },
  { h: 'latitude_deg', get: ({ site }) => site?.latitude },
  { h: 'longitude_deg', get: ({ site }) => site?.longitude },
  { h: 'datum', get: ({ site }) => site?.datum },
  { h: 'position_accuracy_m', get: ({ site }) => site?.accuracyM },
  { h: 'time_local', get: ({ s }) => s.time },
  { h: 'time_utc', get: ({ s }) => new Date(s.time).toISOString() },
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
  // raw inputs, as entered
  { h: 'water_temp_degC', get: ({ s, d }) => reported(d, 'temperature', s.field.tempC?.values) },
  { h: 'water_temp_readings_n', get: ({ s }) => s.field.tempC?.values.length },
  { h: 'conductance_mode', get: ({ s }) => s.field.conductance?.mode },
  { h: 'ec_raw_uS_cm', get: ({ s, d }) => (s.field.conductance?.mode === 'ec' ? reported(d, 'sc', s.field.conductance.values) : undefined) },
  { h: 'ec_temp_degC', get: ({ s }) => (s.field.conductance?.mode === 'ec' ? s.field.conductance.tempC : undefined) },
  { h: 'ec_alpha_per_degC', get: ({ s }) => (s.field.conductance?.mode === 'ec' ? s.field.conductance.alpha : undefined) },
  { h: 'sc_field_uS_cm_25C', get: ({ s, d }) => (s.field.conductance?.mode === 'sc' ? reported(d, 'sc', s.field.conductance.values) : undefined) },
  { h: 'ph_field', get: ({ s, d }) => reported(d, 'pH', s.field.pH?.values) },
  { h: 'ph_readings_n', get: ({ s }) => s.field.pH?.values.length },
  { h: 'ph_stable', get: ({ d }) => d.stability.pH?.stable },
  { h: 'do_field', get: ({ s, d }) => reported(d, 'do', s.field.do?.values) },
  { h: 'do_field_unit', get: ({ s }) => s.field.do?.unit },
  { h: 'pressure', get: ({ s }) => s.pressure?.value },
  { h: 'pressure_unit', get: ({ s }) => s.pressure?.unit },
  { h: 'pressure_source', get: ({ s }) => s.pressure?.source },
  { h: 'alkalinity_entered', get: ({ s }) => (s.field.alkalinity?.kind === 'direct' ? s.field.alkalinity.value : undefined) },
  { h: 'alkalinity_entered_unit', get: ({ s }) => (s.field.alkalinity?.kind === 'direct' ? s.field.alkalinity.unit : s.field.alkalinity ? 'titration' : undefined) },
  { h: 'titration_points_n', get: ({ s }) => (s.field.alkalinity?.kind === 'titration' ? s.field.alkalinity.titration.points.length : undefined) },
  { h: 'ca_kit', get: ({ s }) => kit(s, 'calcium')?.value ?? kit(s, 'calcium-hardness')?.value },
  { h: 'ca_kit_unit', get: ({ s }) => (kit(s, 'calcium') ?? kit(s, 'calcium-hardness'))?.unit },
  { h: 'total_hardness_kit_mg_L_CaCO3', get: ({ s }) => kit(s, 'total-hardness')?.value },
  { h: 'mg_mg_L', get: ({ s }) => s.field.ions.mgMgL },
  { h: 'na_mg_L', get: ({ s }) => s.field.ions.naMgL },
  { h: 'k_mg_L', get: ({ s }) => s.field.ions.kMgL },
  { h: 'cl_mg_L', get: ({ s }) => s.field.ions.clMgL },
  { h: 'so4_mg_L', get: ({ s }) => s.field.ions.so4MgL },
  { h: 'no3_mg_L_as_N', get: ({ s }) => s.field.ions.no3NMgL },
  { h: 'f_mg_L', get: ({ s }) => s.field.ions.fMgL },
  { h: 'sio2_mg_L', get: ({ s }) => s.field.ions.sio2MgL },
  { h: 'tds_mg_L', get: ({ s }) => s.field.ions.tdsMgL },
  { h: 'nh3nh4_mg_L_as_N', get: ({ s }) => s.field.ions.nh3nh4NMgL },
  { h: 'remarks', get: ({ s }) => s.remarks },
  { h: 'qualifiers', get: ({ s }) => s.qualifiers.join('; ') },
  { h: 'profile_id', get: ({ s }) => s.profileId },
  { h: 'profile_version', get: ({ s }) => s.profileVersion },
  { h: 'revision', get: ({ s }) => s.revision },
  // computed (derived now from the stored inputs by this engine version)
  { h: 'engine_version', get: ({ d }) => d.engineVersion },
  { h: 'sc_uS_cm_25C', get: ({ d }) => d.input.scUsPerCm ?? undefined },
  { h: 'alkalinity_mg_L_CaCO3', get: ({ d }) => d.input.alkalinityMgLCaCO3 ?? undefined },
  { h: 'alkalinity_method', get: ({ d, s }) => (s.field.alkalinity?.kind === 'titration' ? d.titration?.method : s.field.alkalinity ? 'entered' : undefined) },
  { h: 'ca_mg_L', get: ({ d }) => d.input.caMgL ?? undefined },
  { h: 'ionic_strength_mol_L', get: ({ d }) => d.analysis?.ionicStrength.value },
  { h: 'ionic_strength_source', get: ({ d }) => ionicStrengthSource(d) },
  { h: 'activity_model', get: ({ d }) => d.analysis?.activityModel },
  { h: 'si_calcite', get: ({ d }) => d.analysis?.saturationIndex.calcite },
  { h: 'si_calcite_band_95pct', get: ({ d }) => d.analysis?.calciteSiUncertainty },
  { h: 'calcite_state', get: ({ d }) => d.analysis?.calciteState },
  { h: 'si_aragonite', get: ({ d }) => d.analysis?.saturationIndex.aragonite },
  { h: 'si_dolomite', get: ({ d }) => d.analysis?.saturationIndex.dolomite },
  { h: 'si_gypsum', get: ({ d }) => d.analysis?.saturationIndex.gypsum },
  { h: 'log_pco2_atm', get: ({ d }) => d.analysis?.logPco2 },
  { h: 'dic_mmol_L', get: ({ d }) => d.analysis?.carbonate?.dicMmolL },
  { h: 'ph_s', get: ({ d }) => d.analysis?.langelier?.pHs },
  { h: 'langelier_index', get: ({ d }) => d.analysis?.langelier?.lsi },
  { h: 'ryznar_index', get: ({ d }) => d.analysis?.langelier?.rsi },
  { h: 'hardness_mg_L_CaCO3', get: ({ d }) => d.analysis?.hardnessMgLCaCO3 ?? d.analysis?.calciumHardnessMgLCaCO3 },
  { h: 'charge_balance_pct', get: ({ d }) => d.analysis?.chargeBalancePercent },
  { h: 'sc_calculated_uS_cm', get: ({ d }) => d.analysis?.calculatedScUsPerCm },
  { h: 'do_mg_L', get: ({ d }) => d.doMgL },
  { h: 'do_saturation_pct', get: ({ d }) => d.doPercent },
  { h: 'nh3_unionized_mg_L_as_N', get: ({ d }) => d.nh3?.nh3NMgL },
  { h: 'flags', get: ({ d }) => [...new Set(d.warnings.map((w) => w.code))].join('; ') },
  { h: 'checks_failed', get: ({ d }) => d.checks.filter((c) => c.status === 'fail').map((c) => c.id).join('; ') },
  { h: 'input_error', get: ({ d }) => d.error?.message },
];

export interface ExportContext {
  samples: Sample[];
  sites: Site[];
  /** engine settings; each site's own conductance factor is computed from `samples` unless given */
  settings: DeriveSettings;
  profile?: MethodProfile;
  /** the readable code of a sample outside `samples` (a QC parent from another day) */
  codeOf?: (sampleId: string) => string | undefined;
}

/** The ionic-strength source as exported: a site's own conductance factor is named, with its analyses. */
export function ionicStrengthSource(d: Derived): string | undefined {
  const i = d.analysis?.ionicStrength;
  if (!i) return undefined;
  return i.source === 'conductance' && i.conductanceFactor?.source === 'site' ? `conductance-site-factor (${i.conductanceFactor.n} full analyses)` : i.source;
}

/** Each sample with its site, derived results, parent code and QC verdict: what the columns read. */
export function derivedRows(ctx: ExportContext): Row[] {
  const siteById = new Map(ctx.sites.map((s) => [s.id, s]));
  const settings = { ...ctx.settings, siteFactors: ctx.settings.siteFactors ?? siteFactorsFrom(ctx.samples, ctx.settings) };
  const rows: Row[] = ctx.samples.map((s) => ({ s, site: siteById.get(s.siteId), d: derivedFor(s, settings, ctx.profile) }));
  const byId = new Map(rows.map((r) => [r.s.id, r]));
  const profile = ctx.profile ?? DEFAULT_PROFILE;
  for (const r of rows) {
    const parent = r.s.qc.parentId ? byId.get(r.s.qc.parentId) : undefined;
    if (r.s.qc.parentId) r.parentCode = parent?.s.sampleCode ?? ctx.codeOf?.(r.s.qc.parentId);
    r.qc = qcVerdictFor(r.s, r.d, parent ? { derived: parent.d } : undefined, profile);
  }
  return rows;
}

/** One row per sample. */
export function wideCsv(ctx: ExportContext, opts: { bom?: boolean } = {}): string {
  const rows = derivedRows(ctx).map((x) => WIDE_COLUMNS.map((c) => c.get(x)));
  return toCsv(WIDE_COLUMNS.map((c) => c.h), rows, opts);
}

/** One row per value, with UCUM unit codes and the value's origin. */
export function longCsv(ctx: ExportContext, opts: { bom?: boolean } = {}): string {
  const out: Cell[][] = [];
  for (const { s, site, d } of derivedRows(ctx)) {
    const add = (parameter: string, value: number | undefined, ucum: string, origin: 'field' | 'lab' | 'computed', method: string, qualifier = '') => {
      if (value === undefined || !Number.isFinite(value)) return;
      out.push([s.id, s.sampleCode, site?.code, s.time, parameter, value, ucum, origin, method, qualifier]);
    };
    const q = s.qualifiers.join('; ');
    add('water_temperature', reported(d, 'temperature', s.field.tempC?.values), 'Cel', 'field', 'median of stable readings', q);
    if (s.field.conductance?.mode === 'ec') add('conductivity_raw', reported(d, 'sc', s.field.conductance.values), 'uS/cm', 'field', `at ${s.field.conductance.tempC ?? 'water'} Cel, alpha ${s.field.conductance.alpha}`, q);
    add('specific_conductance_25C', d.input.scUsPerCm ?? undefined, 'uS/cm', s.field.conductance?.mode === 'sc' ? 'field' : 'computed', s.field.conductance?.mode === 'sc' ? 'meter-compensated' : 'Standard Methods 2510 linear', q);
    add('pH', reported(d, 'pH', s.field.pH?.values), '[pH]', 'field', 'median of stable readings', q);
    add('dissolved_oxygen', d.doMgL, 'mg/L', s.field.do?.unit === 'mg/L' ? 'field' : 'computed', 'Benson & Krause', q);
    add('dissolved_oxygen_saturation', d.doPercent, '%', s.field.do?.unit === '%' ? 'field' : 'computed', 'Benson & Krause', q);
    add('alkalinity_as_CaCO3', d.input.alkalinityMgLCaCO3 ?? undefined, 'mg/L', s.field.alkalinity?.kind === 'titration' ? 'computed' : 'field', s.field.alkalinity?.kind === 'titration' ? `titration, ${d.titration?.method}` : 'entered', q);
    add('calcium', d.input.caMgL ?? undefined, 'mg/L', 'field', 'kit', q);
    for (const [k, v] of Object.entries(s.field.ions)) add(k.replace(/MgL$/, ''), v, 'mg/L', 'field', 'field kit or meter', q);
    for (const l of s.lab) {
      // a censored result keeps its row: the detection limit as the value, marked not detected
      if (l.censored) out.push([s.id, site?.code, s.time, l.parameter, l.detectionLimit, l.unitUcum ?? l.unit, 'lab', l.method ?? '', ['not detected', l.qualifier].filter(Boolean).join('; ')]);
      else add(l.parameter, l.value, l.unitUcum ?? l.unit, 'lab', l.method ?? '', l.qualifier ?? '');
    }
    const a = d.analysis;
    if (a) {
      add('ionic_strength', a.ionicStrength.value, 'mol/L', 'computed', `from ${ionicStrengthSource(d)}; engine ${ENGINE_VERSION}`);
      add('saturation_index_calcite', a.saturationIndex.calcite, '1', 'computed', `${a.activityModel}; band ±${a.calciteSiUncertainty?.toFixed(3) ?? ''} (95 %, k = 2)`);
      add('saturation_index_aragonite', a.saturationIndex.aragonite, '1', 'computed', a.activityModel);
      add('saturation_index_dolomite', a.saturationIndex.dolomite, '1', 'computed', a.activityModel);
      add('saturation_index_gypsum', a.saturationIndex.gypsum, '1', 'computed', a.activityModel);
      add('log_pCO2', a.logPco2, '1', 'computed', 'log10 atm');
      add('langelier_index', a.langelier?.lsi, '1', 'computed', 'Standard Methods 2330 B');
      add('ryznar_index', a.langelier?.rsi, '1', 'computed', 'Ryznar 1944');
      add('hardness_as_CaCO3', a.hardnessMgLCaCO3, 'mg/L', 'computed', 'Standard Methods 2340 B');
      add('charge_balance', a.chargeBalancePercent, '%', 'computed', 'Standard Methods 1030 E');
    }
  }
  return toCsv(['sample_id', 'sample_code', 'site_code', 'time_local', 'parameter', 'value', 'unit_ucum', 'origin', 'method', 'qualifier'], out, opts);
}

export function calibrationsCsv(events: CalibrationEvent[], opts: { bom?: boolean } = {}): string {
  const rows = events.map((c) => {
    const e = c.entries;
    return [
      c.id, c.instrumentId, c.parameter, c.kind, c.time, c.operator, c.pass, c.profileId, c.profileVersion,
      e.parameter === 'pH' ? e.buffers.map((b) => `${b.bufferPH}@${b.mV}mV/${b.tempC}C`).join(' | ') : '',
      e.parameter === 'sc' ? e.standardUsPerCm : '', e.parameter === 'sc' ? e.readingUsPerCm : '',
      e.parameter === 'do' ? e.readingMgL : '', e.parameter === 'do' ? e.tempC : '', e.parameter === 'do' ? e.pressureKPa : '',
      c.remarks,
    ];
  });
  return toCsv(
    ['calibration_id', 'instrument_id', 'parameter', 'kind', 'time_local', 'operator', 'pass', 'profile_id', 'profile_version', 'ph_buffers', 'sc_standard_uS_cm_25C', 'sc_reading_uS_cm_25C', 'do_reading_mg_L', 'do_temp_degC', 'do_pressure_kPa', 'remarks'],
    rows,
    opts,
  );
}

export function titrationsCsv(samples: Sample[], opts: { bom?: boolean } = {}): string {
  const rows: Cell[][] = [];
  for (const s of samples) {
    if (s.field.alkalinity?.kind !== 'titration') continue;
    const t = s.field.alkalinity.titration;
    t.points.forEach((p, i) => rows.push([s.id, i + 1, p.amount, t.equipment === 'buret' ? 'mL' : 'counts', p.pH, t.sampleVolumeMl, t.titrantNormality, t.correctionFactor, t.countsPerMl]));
  }
  return toCsv(['sample_id', 'point', 'titrant_amount', 'titrant_unit', 'pH', 'sample_volume_mL', 'titrant_normality_eq_L', 'correction_factor', 'counts_per_mL'], rows, opts);
}
