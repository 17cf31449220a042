// The day's paperwork as CSV: the day summary (every sample with its ID, state, warnings, QC and
// meter checks) and the chain of custody (every hand-over of every sample). RFC 4180 via toCsv.
import type { CustodyTransfer, FieldDay, Instrument } from '../records/schema';
import { toCsv, derivedRows, type Cell, type ExportContext } from './csv';

export interface DayContext extends ExportContext {
  instruments: Instrument[];
  /** per sample id: the meter-check problems in words (from the calibration coverage), empty when covered */
  meterNotes: Map<string, string[]>;
}

/** One row per sample: what the crew checks before leaving the last site. */
export function daySummaryCsv(ctx: DayContext, opts: { bom?: boolean } = {}): string {
  const meterName = new Map(ctx.instruments.map((i) => [i.id, i.serial ? `${i.name} (${i.serial})` : i.name]));
  const rows: Cell[][] = derivedRows(ctx).map(({ s, site, d, parentCode, qc }) => [
    s.sampleCode ?? s.id,
    s.time,
    site?.code,
    site?.name,
    s.qc.type,
    parentCode,
    d.analysis?.calciteState ?? 'unknown',
    d.analysis?.saturationIndex.calcite,
    d.analysis?.calciteSiUncertainty,
    d.warnings.map((w) => w.message).join(' | '),
    s.qc.type === 'environmental' ? '' : qc?.pass === undefined ? 'not judged' : qc.pass ? 'pass' : 'fail',
    qc?.checks.filter((c) => !c.pass).map((c) => c.message).join(' | '),
    s.instrumentIds.map((id) => meterName.get(id) ?? id).join('; '),
    (ctx.meterNotes.get(s.id) ?? []).join(' | ') || 'within a passing check',
    s.crew.join('; '),
  ]);
  return toCsv(
    ['sample_code', 'time_local', 'site_code', 'site_name', 'qc_type', 'qc_parent_code', 'calcite_state', 'si_calcite', 'si_calcite_band', 'warnings', 'qc_verdict', 'qc_failures', 'instruments', 'meter_check', 'crew'],
    rows,
    opts,
  );
}

/** Chain of custody: one row per hand-over per sample, in hand-over order (the lab signs the last). */
export function custodyCsv(day: Pick<FieldDay, 'date' | 'custody'>, ctx: ExportContext, opts: { bom?: boolean } = {}): string {
  const transfers: CustodyTransfer[] = [...(day.custody ?? [])].sort((a, b) => Date.parse(a.time) - Date.parse(b.time));
  const samples = derivedRows(ctx);
  const rows: Cell[][] = [];
  transfers.forEach((t, i) => {
    for (const { s, site } of samples) {
      rows.push([day.date, i + 1, t.relinquishedBy, t.receivedBy, t.time, t.coolerTempC, t.remarks, s.sampleCode ?? s.id, site?.code, s.time, s.qc.type]);
    }
  });
  return toCsv(['field_date', 'transfer', 'relinquished_by', 'received_by', 'transfer_time', 'cooler_temp_degC', 'transfer_remarks', 'sample_code', 'site_code', 'sample_time_local', 'qc_type'], rows, opts);
}
