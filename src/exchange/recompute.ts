// The office side: re-run every indicator and data check on an exported samples CSV (optionally
// joined with a lab-results CSV), with the same engine the phones use. Runs in Node only (the
// office command, scripts/recompute.mjs): it streams, so memory stays flat in the number of rows.
import Papa from 'papaparse';
import { analyzeSample, dataChecks, DEFAULT_PROFILE, ENGINE_VERSION, InputError, PRESSURE_TO_KPA, specificConductance, type Analysis, type AnalyzeOptions, type SampleInput } from '../chemistry';
import { safeCell, unsafeCell, type Cell } from './csv';
import { parseDecimalLoose } from '../records/numbers';
import { engineFieldOf, type EngineField } from '../records/lab-units';
import { guessMapping, readLabRows, type LabMapping, type LabRowCheck } from './lab-import';
import { labUnit } from './ucum';

const FIELD_COLUMNS: Array<[keyof SampleInput, string]> = [
  ['tempC', 'water_temp_degC'], ['pH', 'ph_field'], ['alkalinityMgLCaCO3', 'alkalinity_mg_L_CaCO3'], ['caMgL', 'ca_mg_L'],
  ['mgMgL', 'mg_mg_L'], ['naMgL', 'na_mg_L'], ['kMgL', 'k_mg_L'], ['clMgL', 'cl_mg_L'], ['so4MgL', 'so4_mg_L'],
  ['no3NMgL', 'no3_mg_L_as_N'], ['fMgL', 'f_mg_L'], ['sio2MgL', 'sio2_mg_L'], ['tdsMgL', 'tds_mg_L'],
];

export const OFFICE_COLUMNS = [
  'office_engine_version', 'office_sc_uS_cm_25C', 'office_ionic_strength_mol_L', 'office_ionic_strength_source', 'office_activity_model',
  'office_si_calcite', 'office_si_calcite_band_95pct', 'office_calcite_state', 'office_log_pco2_atm', 'office_langelier_index',
  'office_charge_balance_pct', 'office_charge_balance_ok', 'office_sc_calculated_uS_cm', 'office_do_saturation_pct', 'office_lab_values_used',
  'office_lab_values_not_used', 'office_checks_failed', 'office_flags', 'office_differs_from_field', 'office_error',
];

export const VALUES_COLUMNS = ['sample_id', 'site_code', 'time_local', 'parameter', 'value', 'unit_ucum', 'origin', 'method', 'qualifier'];

export type RecomputeFormat = 'samples' | 'values';

export interface RecomputeOptions {
  format?: RecomputeFormat;
  analyze?: AnalyzeOptions;
}

/** Lab results joined to the samples file, by the sample ID or code the lab wrote. */
export type LabIndex = Map<string, LabRowCheck[]>;

/**
 * Read a lab CSV for the office: columns guessed as in the app, units read by the full UCUM
 * library after the common lab spellings. Any row error (an unknown unit, a value that is not a
 * number, nitrate without its basis) refuses the whole file with the rows named: nothing is
 * silently dropped.
 */
export function readLabIndex(labCsv: string, fileName = 'lab file'): LabIndex {
  const header = Papa.parse<string[]>(labCsv.replace(/^\uFEFF/, ''), { preview: 1 }).data[0] ?? [];
  const m = guessMapping(header);
  const missing = (['sampleId', 'parameter', 'value', 'unit'] as const).filter((k) => !m[k]);
  if (missing.length > 0) throw new Error(`${fileName}: no column for ${missing.join(', ')} (found: ${header.join(', ')})`);
  const { rows, fileErrors } = readLabRows(labCsv, m as LabMapping, labUnit);
  if (fileErrors.length > 0) throw new Error(`${fileName} is not valid CSV: ${fileErrors.slice(0, 3).join('; ')}`);
  const bad = rows.filter((r) => r.errors.length > 0);
  if (bad.length > 0) {
    throw new Error(`${fileName}: ${bad.length} row(s) refused, nothing was computed:\n${bad.slice(0, 20).map((r) => `  row ${r.row} (${r.label || 'no sample'} ${r.parameter}): ${r.errors.join('; ')}`).join('\n')}`);
  }
  const index: LabIndex = new Map();
  for (const r of rows) index.set(r.label, [...(index.get(r.label) ?? []), r]);
  return index;
}

const num = (r: Record<string, string>, col: string) => parseDecimalLoose(unsafeCell(r[col] ?? ''));

const ENGINE_UNIT = (field: EngineField) => (field === 'alkalinityMgLCaCO3' ? 'mg{CaCO3}/L' : field === 'no3NMgL' ? 'mg{N}/L' : 'mg/L');

interface RowResult {
  input: Record<string, number>;
  lab: LabRowCheck[];
  a?: Analysis;
  used: string[];
  notUsed: string[];
  error?: string;
}

/** Re-run the engine on one row of a samples CSV, filling only missing inputs from its lab results. */
function recomputeRow(r: Record<string, string>, lab: LabIndex, options: AnalyzeOptions): RowResult {
  const input: Record<string, number> = {};
  for (const [key, col] of FIELD_COLUMNS) {
    const v = num(r, col);
    if (v !== undefined) input[key] = v;
  }
  const used: string[] = [];
  const notUsed: string[] = [];
  const labRows = [...(lab.get(unsafeCell(r.sample_id ?? '').trim()) ?? []), ...(r.sample_code ? lab.get(unsafeCell(r.sample_code).trim()) ?? [] : [])];
  try {
    const sc = num(r, 'sc_field_uS_cm_25C');
    const ec = num(r, 'ec_raw_uS_cm');
    if (sc !== undefined) input.scUsPerCm = sc;
    else if (ec !== undefined) {
      const t = num(r, 'ec_temp_degC') ?? input.tempC;
      if (t !== undefined) input.scUsPerCm = specificConductance(ec, t, num(r, 'ec_alpha_per_degC') ?? 0.0191);
    }
    for (const l of labRows) {
      const field = engineFieldOf(l.parameter)?.field;
      if (!field) notUsed.push(`${l.parameter}: not an engine input`);
      else if (l.censored) notUsed.push(`${l.parameter}: not detected${l.detectionLimit !== undefined ? ` (< ${l.detectionLimit} ${l.unit})` : ''}`);
      else if (input[field] !== undefined && !used.includes(field)) notUsed.push(`${l.parameter}: field value kept`);
      else if (l.engineValue !== undefined) {
        input[field as EngineField] = l.engineValue;
        if (!used.includes(field)) used.push(field);
      }
    }
    // DO and pressure go to the engine, which corrects saturation for salinity (from SC) and pressure
    const dox = num(r, 'do_field');
    if (dox !== undefined) input[(r.do_field_unit ?? '').trim() === '%' ? 'doPercent' : 'doMgL'] = dox;
    const p = num(r, 'pressure');
    const pUnit = (r.pressure_unit ?? '').trim() as keyof typeof PRESSURE_TO_KPA;
    if (p !== undefined && pUnit in PRESSURE_TO_KPA) input.pressureKPa = p * PRESSURE_TO_KPA[pUnit];
    if (input.tempC === undefined) throw new InputError('tempC', 'no water temperature in the row');
    return { input, lab: labRows, a: analyzeSample(input as unknown as SampleInput, options), used, notUsed };
  } catch (e) {
    return { input, lab: labRows, used, notUsed, error: e instanceof Error ? e.message : String(e) };
  }
}

/** The rows this samples-CSV row becomes in the chosen format. */
function outputRows(header: string[], r: Record<string, string>, x: RowResult, format: RecomputeFormat): Cell[][] {
  const a = x.a;
  if (format === 'values') {
    const id = unsafeCell(r.sample_id ?? '');
    const base = [id, unsafeCell(r.site_code ?? ''), r.time_local ?? ''];
    const out: Cell[][] = [];
    const add = (parameter: string, value: number | undefined, ucum: string, origin: string, method: string, qualifier = '') => {
      if (value !== undefined && Number.isFinite(value)) out.push([...base, parameter, value, ucum, origin, method, qualifier]);
    };
    add('water_temperature', x.input.tempC, 'Cel', 'field', 'as exported');
    add('specific_conductance_25C', x.input.scUsPerCm, 'uS/cm', 'field', 'as exported');
    add('pH', x.input.pH, '[pH]', 'field', 'as exported');
    for (const [key, col] of FIELD_COLUMNS.slice(2)) {
      const name = key === 'alkalinityMgLCaCO3' ? 'alkalinity_as_CaCO3' : key === 'caMgL' ? 'calcium' : key.replace(/MgL$/, '');
      if (!x.used.includes(key)) add(name, x.input[key], ENGINE_UNIT(key as EngineField), 'field', 'as exported');
    }
    for (const l of x.lab) {
      const method = [l.method, l.labSampleId && `lab sample ${l.labSampleId}`].filter(Boolean).join('; ');
      const field = engineFieldOf(l.parameter)?.field;
      if (l.censored) add(l.parameter, l.detectionLimit, l.unitUcum ?? l.unit, 'lab', method, ['not detected', l.qualifier].filter(Boolean).join('; '));
      else if (field && l.engineValue !== undefined) add(l.parameter, l.engineValue, ENGINE_UNIT(field), 'lab', [method, `reported as ${l.value} ${l.unit}`].filter(Boolean).join('; '), l.qualifier);
      else add(l.parameter, l.value, l.unitUcum ?? l.unit, 'lab', method, l.qualifier);
    }
    if (a) {
      const m = `office recompute, engine ${ENGINE_VERSION}`;
      add('ionic_strength', a.ionicStrength.value, 'mol/L', 'computed', `${m}; from ${a.ionicStrength.source}`);
      add('saturation_index_calcite', a.saturationIndex.calcite, '1', 'computed', `${m}; ${a.activityModel}; band ±${a.calciteSiUncertainty?.toFixed(3) ?? ''}`);
      add('log_pCO2', a.logPco2, '1', 'computed', `${m}; log10 atm`);
      add('langelier_index', a.langelier?.lsi, '1', 'computed', `${m}; Standard Methods 2330 B`);
      add('charge_balance', a.chargeBalancePercent, '%', 'computed', `${m}; Standard Methods 1030 E`);
      add('sc_calculated', a.calculatedScUsPerCm, 'uS/cm', 'computed', `${m}; Standard Methods 2510`);
    }
    return out;
  }
  const passthrough = header.map((h) => unsafeCell(r[h] ?? ''));
  if (!a) return [[...passthrough, ENGINE_VERSION, ...OFFICE_COLUMNS.slice(1, -1).map(() => ''), x.error ?? '']];
  const checks = dataChecks(x.input as unknown as SampleInput, a, DEFAULT_PROFILE);
  const fieldSi = num(r, 'si_calcite');
  const differs = fieldSi !== undefined && a.saturationIndex.calcite !== undefined ? Math.abs(fieldSi - a.saturationIndex.calcite) > 0.01 : undefined;
  return [[
    ...passthrough,
    ENGINE_VERSION, x.input.scUsPerCm, a.ionicStrength.value, a.ionicStrength.source, a.activityModel,
    a.saturationIndex.calcite, a.calciteSiUncertainty, a.calciteState, a.logPco2, a.langelier?.lsi,
    a.chargeBalancePercent, a.chargeBalance?.acceptable, a.calculatedScUsPerCm, a.oxygen?.percentSaturation, x.used.join('; '), x.notUsed.join('; '),
    checks.filter((c) => c.status === 'fail').map((c) => c.id).join('; '),
    [...new Set(a.warnings.map((w) => w.code))].join('; '),
    differs === undefined ? '' : differs ? 'yes' : 'no',
    '',
  ]];
}

/** One CSV line block, every cell (header names included) made formula-safe. */
function csvLines(rows: Cell[][]): string {
  return rows.length === 0 ? '' : Papa.unparse(rows.map((row) => row.map(safeCell)), { newline: '\r\n', quotes: false, escapeFormulae: false }) + '\r\n';
}

/**
 * A recomputer fed the samples file's rows one at a time: header first, then each row. Holds only
 * the lab index, never the rows.
 */
export function recomputer(lab: LabIndex, options: RecomputeOptions = {}) {
  const format = options.format ?? 'samples';
  let header: string[] | null = null;
  const seen = new Set<string>();
  return {
    /** lab sample labels that matched no row of the samples file (reported, never silently dropped) */
    unmatchedLab(): string[] {
      return [...lab.keys()].filter((k) => !seen.has(k));
    },
    /** CSV text for the next parsed row (the first row is the header). */
    push(cells: string[]): string {
      if (!header) {
        header = cells.map((h, i) => (i === 0 ? h.replace(/^\uFEFF/, '') : h).trim());
        if (!header.includes('sample_id')) throw new Error('The samples file has no sample_id column: is it a Bankside samples CSV?');
        return csvLines([format === 'values' ? VALUES_COLUMNS : [...header.map(unsafeCell), ...OFFICE_COLUMNS]]);
      }
      if (cells.length === 1 && cells[0] === '') return '';
      const r: Record<string, string> = {};
      header.forEach((h, i) => (r[h] = cells[i] ?? ''));
      for (const c of ['sample_id', 'sample_code']) if (r[c]) seen.add(unsafeCell(r[c]).trim());
      return csvLines(outputRows(header, r, recomputeRow(r, lab, options.analyze ?? {}), format));
    },
    get started() {
      return header !== null;
    },
  };
}

/** The whole file in memory (tests, small files): same rows as the streaming command. */
export function recomputeCsv(samplesCsv: string, labCsv?: string, options: RecomputeOptions = {}): string {
  const parsed = Papa.parse<string[]>(samplesCsv.replace(/^\uFEFF/, ''), { skipEmptyLines: 'greedy' });
  if (parsed.errors.length > 0) throw new Error(`The samples file is not valid CSV: ${parsed.errors.slice(0, 3).map((e) => `row ${(e.row ?? 0) + 1}: ${e.message}`).join('; ')}`);
  const rc = recomputer(labCsv ? readLabIndex(labCsv) : new Map(), options);
  if (parsed.data.length === 0) throw new Error('The samples file is empty: is it a Bankside samples CSV?');
  return parsed.data.map((cells) => rc.push(cells)).join('');
}

/**
 * Text of a file from its bytes, checked as UTF-8 as it streams (a BOM is dropped; UTF-16 with a
 * BOM is converted). Any other encoding is refused with where the first bad byte is, unless the
 * caller names the encoding to convert from (e.g. windows-1252).
 */
export async function* decodeText(chunks: AsyncIterable<Uint8Array>, fileName: string, encoding?: string): AsyncGenerator<string> {
  let decoder: TextDecoder | null = encoding ? new TextDecoder(encoding) : null;
  let offset = 0;
  let lines = 1;
  for await (const chunk of chunks) {
    if (!decoder) {
      const utf16 = chunk[0] === 0xff && chunk[1] === 0xfe ? 'utf-16le' : chunk[0] === 0xfe && chunk[1] === 0xff ? 'utf-16be' : null;
      decoder = new TextDecoder(utf16 ?? 'utf-8', { fatal: true });
    }
    try {
      yield decoder.decode(chunk, { stream: true });
    } catch {
      const at = firstBadUtf8(chunk);
      for (let i = 0; i < at; i++) if (chunk[i] === 0x0a) lines++;
      throw new Error(
        `${fileName} is not UTF-8 text (byte 0x${(chunk[at] ?? 0).toString(16).toUpperCase()} at byte ${offset + at + 1}, line ${lines}). ` +
          'Save it as “CSV UTF-8” from the spreadsheet, or name its encoding to convert it: --encoding windows-1252',
      );
    }
    for (const b of chunk) if (b === 0x0a) lines++;
    offset += chunk.length;
  }
  if (decoder) {
    const rest = decoder.decode();
    if (rest) yield rest;
  }
}

/** Index of the first byte that breaks UTF-8 in a chunk (a sequence cut at the chunk's end is not counted). */
function firstBadUtf8(b: Uint8Array): number {
  for (let i = 0; i < b.length; ) {
    const c = b[i]!;
    const n = c < 0x80 ? 0 : c >= 0xc2 && c <= 0xdf ? 1 : c >= 0xe0 && c <= 0xef ? 2 : c >= 0xf0 && c <= 0xf4 ? 3 : -1;
    if (n < 0) return i;
    for (let k = 1; k <= n; k++) if (i + k < b.length && (b[i + k]! & 0xc0) !== 0x80) return i;
    i += n + 1;
  }
  return 0;
}

/**
 * Stream a samples CSV through the engine: text chunks in, CSV text out through `write` (awaited,
 * so a slow disk holds the reading back). Memory holds the lab index and one parser buffer.
 */
export async function recomputeStream(text: AsyncIterable<string>, write: (csv: string) => Promise<void>, lab: LabIndex, options: RecomputeOptions = {}): Promise<{ rows: number; unmatchedLab: string[] }> {
  const rc = recomputer(lab, options);
  let rows = 0;
  let failure: Error | null = null;
  const parser = Papa.parse(Papa.NODE_STREAM_INPUT, { skipEmptyLines: 'greedy' });
  const feed = (async () => {
    try {
      for await (const t of text) {
        if (!parser.write(t)) await new Promise((r) => parser.once('drain', r));
      }
    } catch (e) {
      failure = e instanceof Error ? e : new Error(String(e));
    }
    parser.end();
  })();
  let batch = '';
  for await (const cells of parser as AsyncIterable<string[]>) {
    if (failure) break;
    batch += rc.push(cells);
    if (rc.started) rows++;
    if (batch.length > 64_000) {
      await write(batch);
      batch = '';
    }
  }
  await feed;
  if (failure) throw failure;
  if (!rc.started) throw new Error('The samples file is empty: is it a Bankside samples CSV?');
  if (batch) await write(batch);
  return { rows: rows - 1, unmatchedLab: rc.unmatchedLab() };
}
