// The one validation rule for every way a record gets in: the sample form, the store, restore from a
// backup, lab import and the office command all call these functions before anything is stored.
// An impossible time (hour 25, minute 61), value or length is refused with the field named, so what
// is stored is always exportable. Pure (zod, no storage): usable in the page, a worker and Node.
import type { z } from 'zod';
import * as S from './schema';

export * from './schema';
export { isoTimeProblem, localDateProblem, samplingTimeProblem, utcIsoOrUndefined } from './time';

/** Field path → what is wrong with it, in words. */
export type FieldProblems = Record<string, string>;

export type Validation<T> = { ok: true; value: T } | { ok: false; fields: FieldProblems; message: string };

/** Plain names for the paths a crew or an office clerk will meet. */
const FIELD_WORDS: Array<[RegExp, string]> = [
  [/^time$/, 'sampling time'],
  [/^localDate$/, 'local date'],
  [/^field\.tempC\.values\.(\d+)\.time$/, 'water temperature reading time'],
  [/^field\.pH\.values\.(\d+)\.time$/, 'pH reading time'],
  [/^field\.conductance\.values\.(\d+)\.time$/, 'conductance reading time'],
  [/^field\.do\.values\.(\d+)\.time$/, 'dissolved oxygen reading time'],
  [/^lab\.(\d+)\.importedAt$/, 'lab result import time'],
  [/^remarks$/, 'remarks'],
  [/^weather$/, 'weather'],
];

/** A path with a plain name where we have one, e.g. "time (sampling time)". */
export function fieldLabel(path: string): string {
  const hit = FIELD_WORDS.find(([re]) => re.test(path));
  return hit ? `${path} (${hit[1]})` : path;
}

/** The problems of a failed zod parse, keyed by field path ('(record)' for the whole record). */
export function fieldProblems(error: z.ZodError): FieldProblems {
  const fields: FieldProblems = {};
  for (const issue of error.issues) {
    const key = issue.path.map(String).join('.') || '(record)';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** "The sample has invalid values: time (sampling time): Impossible time: hour 25 …" */
export function describeProblems(what: string, fields: FieldProblems): string {
  return `The ${what} has invalid values: ${Object.entries(fields).map(([k, v]) => `${fieldLabel(k)}: ${v}`).join('; ')}`;
}

export function validateWith<T>(schema: z.ZodType<T>, value: unknown, what: string): Validation<T> {
  const r = schema.safeParse(value);
  if (r.success) return { ok: true, value: r.data };
  const fields = fieldProblems(r.error);
  return { ok: false, fields, message: describeProblems(what, fields) };
}

export const RECORD_SCHEMAS = {
  sample: S.Sample,
  site: S.Site,
  calibration: S.CalibrationEvent,
  instrument: S.Instrument,
  fieldDay: S.FieldDay,
  labResult: S.LabResult,
} as const;
export type RecordKind = keyof typeof RECORD_SCHEMAS;

/** Validate one record of a kind by the stored schema (times, values, lengths). */
export function validateRecord<K extends RecordKind>(kind: K, value: unknown): Validation<z.infer<(typeof RECORD_SCHEMAS)[K]>> {
  return validateWith(RECORD_SCHEMAS[kind] as unknown as z.ZodType<z.infer<(typeof RECORD_SCHEMAS)[K]>>, value, kind === 'labResult' ? 'lab result' : kind);
}

export const validateSample = (value: unknown) => validateRecord('sample', value);
export const validateLabResult = (value: unknown) => validateRecord('labResult', value);
