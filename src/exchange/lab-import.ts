// Lab results from a CSV: map the lab's columns, check each row, join to samples by ID, and store
// as lab values beside the field values (never over them).
import type { LabResult, Sample } from '../records/schema';
import { isoWithOffset } from '../records/time';
import { getSample, saveSample } from '../store/records';
import { parseCsv } from './csv';
import { parseDecimalLoose } from '../records/numbers';

export interface LabMapping {
  sampleId: string;
  parameter: string;
  value: string;
  unit: string;
  qualifier?: string;
  labSampleId?: string;
  method?: string;
}

export interface LabRowCheck {
  row: number;
  sampleId: string;
  parameter: string;
  value?: number;
  unit: string;
  qualifier?: string;
  labSampleId?: string;
  method?: string;
  errors: string[];
}

/** Guess the mapping from common header words; the crew confirms or changes it. */
export function guessMapping(header: string[]): Partial<LabMapping> {
  const find = (...words: RegExp[]) => header.find((h) => words.some((w) => w.test(h)));
  return {
    sampleId: find(/^sample[_ ]?id$/i, /field.*id/i, /^sample$/i),
    parameter: find(/^param/i, /analyte/i, /^characteristic/i),
    value: find(/^value$/i, /^result$/i, /result.?value/i),
    unit: find(/^unit/i, /units/i),
    qualifier: find(/qualif/i, /remark/i, /flag/i),
    labSampleId: find(/lab.?(sample)?.?id/i),
    method: find(/method/i),
  };
}

export function checkLabRows(text: string, mapping: LabMapping, known: Set<string>): { rows: LabRowCheck[]; fileErrors: string[] } {
  const { header, rows, errors } = parseCsv(text);
  const fileErrors = [...errors];
  for (const [k, col] of Object.entries(mapping)) {
    if (col && !header.includes(col)) fileErrors.push(`Column “${col}” (for ${k}) is not in the file.`);
  }
  if (fileErrors.length > 0) return { rows: [], fileErrors };
  const out = rows.map((r, i) => {
    const get = (c?: string) => (c ? (r[c] ?? '').trim() : '');
    const errs: string[] = [];
    const sampleId = get(mapping.sampleId);
    const parameter = get(mapping.parameter);
    const unit = get(mapping.unit);
    const qualifier = get(mapping.qualifier);
    const raw = get(mapping.value);
    const v = parseDecimalLoose(raw);
    if (!sampleId) errs.push('no sample ID');
    else if (!known.has(sampleId)) errs.push(`sample “${sampleId}” is not on this phone`);
    if (!parameter) errs.push('no parameter');
    if (v === undefined) errs.push(raw ? `value “${raw}” is not a number` : 'no value');
    const check: LabRowCheck = { row: i + 2, sampleId, parameter, unit, errors: errs };
    if (v !== undefined) check.value = v;
    if (qualifier) check.qualifier = qualifier;
    const lab = get(mapping.labSampleId);
    if (lab) check.labSampleId = lab;
    const m = get(mapping.method);
    if (m) check.method = m;
    return check;
  });
  return { rows: out, fileErrors };
}

/** Store the valid rows as lab values on their samples (one revision per sample). Returns counts. */
export async function applyLabRows(rows: LabRowCheck[], by: string): Promise<{ samples: number; values: number; skipped: number }> {
  const good = rows.filter((r) => r.errors.length === 0);
  const bySample = new Map<string, LabRowCheck[]>();
  for (const r of good) bySample.set(r.sampleId, [...(bySample.get(r.sampleId) ?? []), r]);
  let values = 0;
  const now = isoWithOffset();
  for (const [id, list] of bySample) {
    const s = (await getSample(id)) as Sample | undefined;
    if (!s) continue;
    const key = (l: Pick<LabResult, 'parameter' | 'value' | 'unit' | 'labSampleId'>) => `${l.parameter}|${l.value}|${l.unit}|${l.labSampleId ?? ''}`;
    const have = new Set(s.lab.map(key));
    const added: LabResult[] = [];
    for (const r of list) {
      const l: LabResult = { parameter: r.parameter, value: r.value!, unit: r.unit, importedAt: now, ...(r.qualifier ? { qualifier: r.qualifier } : {}), ...(r.labSampleId ? { labSampleId: r.labSampleId } : {}), ...(r.method ? { method: r.method } : {}) };
      if (!have.has(key(l))) {
        added.push(l);
        have.add(key(l));
      }
    }
    if (added.length > 0) {
      await saveSample({ ...s, lab: [...s.lab, ...added] }, by);
      values += added.length;
    }
  }
  return { samples: bySample.size, values, skipped: rows.length - good.length };
}
