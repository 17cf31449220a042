// Lab results from a CSV as labs write them: the columns are guessed (the client sample ID among
// its common names and by which column holds this phone's sample codes), each row is read with its
// unit (UCUM or a common lab spelling) and censored values ("<0.05", "ND", a U qualifier) with
// their detection limit, every stored limit is checked in the preview, and the file is stored in
// ONE transaction beside the field values (never over them), or not at all.
import { LabResult, type LabResult as LabResultT, type Sample } from '../records/schema';
import { isoWithOffset } from '../records/time';
import { engineFieldOf, parseLabUnit, parseLabValue, toEngineValue, type LabUnit } from '../records/lab-units';
import { addLabResults, getSample } from '../store/records';
import { parseCsv } from './csv';

export interface LabMapping {
  sampleId: string;
  parameter: string;
  value: string;
  unit: string;
  qualifier?: string;
  detectionLimit?: string;
  labSampleId?: string;
  method?: string;
}

export interface LabRowCheck {
  row: number;
  /** the sample ID or code as the lab wrote it */
  label: string;
  /** this phone's sample ID it matched (phone checks only) */
  sampleId: string;
  parameter: string;
  /** the result ready to store (when the row has no errors) */
  result?: LabResultT;
  value?: number;
  censored?: boolean;
  detectionLimit?: number;
  unit: string;
  unitUcum?: string;
  /** the value in the engine's unit, for a major ion, TDS or alkalinity */
  engineValue?: number;
  qualifier?: string;
  labSampleId?: string;
  method?: string;
  errors: string[];
}

const CLIENT_ID = [
  /^client[ _-]?sample[ _-]?(id|name|no\.?|number|code)$/i, /^client[ _-]?(id|sample)$/i,
  /^(customer|submitter|field)[ _-]?(sample[ _-]?)?(id|name|no\.?|number|code)$/i,
  /^sample[ _-]?(id|code|name|no\.?|number)$/i, /^sample$/i,
];
const LAB_ID = /^lab(oratory)?[ _-]?(sample[ _-]?)?(id|no\.?|number)$|^lab[ _-]?sample$|^work[ _-]?order$/i;

/**
 * Guess the mapping from common header names; the crew confirms or changes it. Of the columns
 * that could hold the client sample ID, the one holding most of `knownLabels` (this phone's sample
 * IDs and codes) wins when rows are given, else the first by name.
 */
export function guessMapping(header: string[], rows: Array<Record<string, string>> = [], knownLabels?: ReadonlySet<string>): Partial<LabMapping> {
  const find = (...words: RegExp[]) => header.find((h) => !LAB_ID.test(h.trim()) && words.some((w) => w.test(h.trim())));
  const candidates = header.filter((h) => !LAB_ID.test(h.trim()) && CLIENT_ID.some((w) => w.test(h.trim())));
  let sampleId = CLIENT_ID.map((w) => candidates.find((h) => w.test(h.trim()))).find(Boolean);
  if (knownLabels && rows.length > 0) {
    let best = 0;
    for (const h of header) {
      const hits = rows.reduce((n, r) => n + (knownLabels.has((r[h] ?? '').trim()) ? 1 : 0), 0);
      if (hits > best) [best, sampleId] = [hits, h];
    }
  }
  const m: Partial<LabMapping> = {
    sampleId,
    parameter: find(/^param/i, /analyte/i, /^characteristic/i, /^test$/i, /^determinand/i),
    value: find(/^value$/i, /^result$/i, /result.?value/i, /^conc/i),
    unit: find(/^units?$/i, /^result.?units?$/i, /units?$/i),
    qualifier: find(/qualif/i, /^flag/i, /^q$/i),
    detectionLimit: find(/^(m?dl|mrl|rl|pql|lod|loq)$/i, /detection.?limit/i, /reporting.?limit/i),
    labSampleId: header.find((h) => LAB_ID.test(h.trim())),
    method: find(/method/i),
  };
  for (const k of Object.keys(m) as Array<keyof LabMapping>) if (m[k] === undefined) delete m[k];
  return m;
}

/**
 * Read every row of a lab file with the mapping: value or censored value, unit, the engine value
 * for a major ion. `unitOf` reads a unit (the phone's small mapping by default; the office command
 * passes the full UCUM reader). Row errors are collected, never thrown.
 */
export function readLabRows(text: string, mapping: LabMapping, unitOf: (raw: string) => LabUnit | undefined = parseLabUnit): { rows: LabRowCheck[]; fileErrors: string[] } {
  const { header, rows, errors } = parseCsv(text);
  const fileErrors = [...errors];
  for (const [k, col] of Object.entries(mapping)) {
    if (col && !header.includes(col)) fileErrors.push(`Column “${col}” (for ${k}) is not in the file.`);
  }
  if (fileErrors.length > 0) return { rows: [], fileErrors };
  const out = rows.map((r, i): LabRowCheck => {
    const get = (c?: string) => (c ? (r[c] ?? '').trim() : '');
    const errs: string[] = [];
    const label = get(mapping.sampleId);
    const parameter = get(mapping.parameter);
    const unitText = get(mapping.unit);
    const check: LabRowCheck = { row: i + 2, label, sampleId: '', parameter, unit: unitText, errors: errs };
    if (!label) errs.push('no sample ID');
    if (!parameter) errs.push('no parameter');
    const v = parseLabValue(get(mapping.value), get(mapping.qualifier), get(mapping.detectionLimit));
    if ('error' in v) errs.push(v.error);
    else if ('censored' in v) {
      check.censored = true;
      if (v.limit !== undefined) check.detectionLimit = v.limit;
    } else check.value = v.value;
    const unit = unitText ? unitOf(unitText) : undefined;
    if (unitText && !unit) errs.push(`unit “${unitText}” is not a UCUM unit or a lab spelling Bankside knows (e.g. mg/L, ug/L, meq/L, mg/L as N, uS/cm @25C, std units, NTU)`);
    if (!unitText && !/^ph\b/i.test(parameter)) errs.push('no unit');
    if (unit) check.unitUcum = unit.ucum;
    for (const key of ['qualifier', 'labSampleId', 'method'] as const) {
      const cell = get(mapping[key]);
      if (cell) check[key] = cell;
    }
    const target = engineFieldOf(parameter);
    if (target && unit && check.value !== undefined) {
      const e = toEngineValue(target.field, check.value, unit, target.basis);
      if ('error' in e) errs.push(`${parameter}: ${e.error}`);
      else check.engineValue = e.value;
    }
    return check;
  });
  return { rows: out, fileErrors };
}

/** This phone's samples by every label a lab may use: the sample ID and its readable code. */
export function sampleLabels(samples: ReadonlyArray<Pick<Sample, 'id' | 'sampleCode' | 'deletedAt'>>): Map<string, Pick<Sample, 'id' | 'sampleCode' | 'deletedAt'>> {
  const m = new Map<string, Pick<Sample, 'id' | 'sampleCode' | 'deletedAt'>>();
  for (const s of samples) {
    m.set(s.id, s);
    if (s.sampleCode) m.set(s.sampleCode, s);
  }
  return m;
}

/**
 * The phone's preview: every row read, matched to a sample that is on this phone and not deleted,
 * and built into the stored record, so every stored limit (lengths, numbers) is checked here and
 * not first at storing.
 */
export function checkLabRows(text: string, mapping: LabMapping, samples: ReturnType<typeof sampleLabels>, importedAt = isoWithOffset()): { rows: LabRowCheck[]; fileErrors: string[] } {
  const read = readLabRows(text, mapping);
  for (const r of read.rows) {
    const s = r.label ? samples.get(r.label) : undefined;
    if (r.label && !s) r.errors.push(`sample “${r.label}” is not on this phone`);
    else if (s?.deletedAt) r.errors.push(`sample “${r.label}” was deleted on this phone: restore it first`);
    else if (s) r.sampleId = s.id;
    if (r.errors.length > 0) continue;
    const record: Record<string, unknown> = { parameter: r.parameter, unit: r.unit, importedAt };
    if (r.censored) {
      record.censored = true;
      if (r.detectionLimit !== undefined) record.detectionLimit = r.detectionLimit;
    } else record.value = r.value;
    for (const key of ['unitUcum', 'qualifier', 'labSampleId', 'method'] as const) if (r[key]) record[key] = r[key];
    const parsed = LabResult.safeParse(record);
    if (parsed.success) r.result = parsed.data;
    else for (const issue of parsed.error.issues) r.errors.push(`${issue.path.join('.') || 'result'}: ${issue.message}`);
  }
  return read;
}

/**
 * Store the ready rows as lab values on their samples, all in one transaction (one 'import'
 * revision per sample): all of them, or none if anything fails. A result already stored (same
 * parameter, value or limit, unit and lab sample ID) is not added twice. Rows with errors are
 * never stored; the count says how many were left out.
 */
export async function applyLabRows(rows: LabRowCheck[], by: string): Promise<{ samples: number; values: number; skipped: number }> {
  const ready = rows.filter((r) => r.errors.length === 0 && r.result);
  const key = (l: LabResultT) => [l.parameter, l.value ?? `<${l.detectionLimit ?? ''}`, l.unit, l.labSampleId ?? ''].join('|');
  const additions: Array<{ sampleId: string; lab: LabResultT[] }> = [];
  const bySample = new Map<string, LabResultT[]>();
  for (const r of ready) bySample.set(r.sampleId, [...(bySample.get(r.sampleId) ?? []), r.result!]);
  for (const [sampleId, list] of bySample) {
    const have = new Set(((await getSample(sampleId))?.lab ?? []).map(key));
    const lab = list.filter((l) => !have.has(key(l)) && have.add(key(l)));
    if (lab.length > 0) additions.push({ sampleId, lab });
  }
  if (additions.length > 0) await addLabResults(additions, by);
  return { samples: additions.length, values: additions.reduce((n, a) => n + a.lab.length, 0), skipped: rows.length - ready.length };
}
