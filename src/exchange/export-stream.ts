// Exports in chunks: the file is the concatenation of the SAME export functions (csv.ts, geojson.ts)
// run on consecutive slices of the samples, so a chunked file is byte for byte the file those
// functions write in one go. Used by the export worker; pure (no DOM, no storage).
import { calibrationsCsv, longCsv, titrationsCsv, wideCsv, type ExportContext } from './csv';
import { samplesGeoJson } from './geojson';
import type { CalibrationEvent } from '../records/schema';
import { siteFactorsFrom } from '../records/site-factor';

export type StreamedExportKind = 'csv-wide' | 'csv-long' | 'csv-titrations' | 'csv-calibrations' | 'geojson';

export interface StreamInput extends ExportContext {
  kind: StreamedExportKind;
  calibrations?: CalibrationEvent[];
  bom?: boolean;
}

export interface ExportPart {
  text: string;
  /** samples handled so far, of `total` */
  done: number;
  total: number;
}

/** Samples per chunk: about 50–150 ms of derivation on a slow phone, so a cancel is heard soon. */
export const CHUNK_SAMPLES = 250;

/** Drop the header line a CSV writer puts first (our headers never hold a line break). */
function withoutHeader(csv: string): string {
  const end = csv.indexOf('\r\n');
  return end < 0 ? '' : csv.slice(end + 2);
}

/**
 * The export as consecutive text parts. CSV files: each slice is written by the export function and
 * all but the first lose their header line (RFC 4180 rows are independent, so quoting is the same).
 * GeoJSON and the meter checks are written in one piece after the samples were derived slice by slice
 * (GeoJSON's one JSON document is not split).
 */
export function* exportParts(input: StreamInput, chunk = CHUNK_SAMPLES): Generator<ExportPart> {
  const { kind, samples } = input;
  const total = samples.length;
  // each site's own conductance factor comes from the whole selection (as the one-piece writers do), not from a slice
  const settings = kind === 'csv-wide' || kind === 'csv-long' ? { ...input.settings, siteFactors: input.settings.siteFactors ?? siteFactorsFrom(samples, input.settings) } : input.settings;
  // a QC sample's parent is looked up in the whole selection too (it may sit in another slice)
  const byId = new Map(samples.map((s) => [s.id, s]));
  const parentOf = (id: string) => byId.get(id) ?? input.parentOf?.(id);
  const ctx: ExportContext = { samples, sites: input.sites, settings, parentOf, ...(input.codeOf ? { codeOf: input.codeOf } : {}), ...(input.profile ? { profile: input.profile } : {}) };
  if (kind === 'csv-calibrations') {
    yield { text: calibrationsCsv(input.calibrations ?? [], { bom: input.bom ?? false }), done: total, total };
    return;
  }
  if (kind === 'geojson') {
    // derive slice by slice (the derived-result cache keeps them), then write the one document
    for (let i = 0; i < total; i += chunk) {
      samplesGeoJson(samples.slice(i, i + chunk), input.sites, input.settings);
      yield { text: '', done: Math.min(total, i + chunk), total };
    }
    yield { text: samplesGeoJson(samples, input.sites, input.settings), done: total, total };
    return;
  }
  const write = (part: typeof samples, bom: boolean): string => {
    const opts = { bom };
    if (kind === 'csv-wide') return wideCsv({ ...ctx, samples: part }, opts);
    if (kind === 'csv-long') return longCsv({ ...ctx, samples: part }, opts);
    return titrationsCsv(part, opts);
  };
  // The header comes from the writer itself (an empty slice); a slice without rows adds nothing, and a
  // file without any row ends as the writer ends an empty table.
  const empty = write([], input.bom ?? false);
  const headerEnd = empty.indexOf('\r\n') + 2;
  yield { text: empty.slice(0, headerEnd), done: 0, total };
  let rows = false;
  for (let i = 0; i < total; i += chunk) {
    const body = withoutHeader(write(samples.slice(i, i + chunk), false));
    const has = body !== '' && body !== '\r\n';
    rows ||= has;
    yield { text: has ? body : '', done: Math.min(total, i + chunk), total };
  }
  if (!rows) yield { text: empty.slice(headerEnd), done: total, total };
}
