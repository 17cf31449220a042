// Which samples an export or upload covers: one day, a date range or one site. Shared by the Send
// screen and the export worker so both pick exactly the same samples in the same order.
import type { CalibrationEvent, Sample } from '../records/schema';
import { listCalibrations, listSamplesBetween, listSamplesForSite } from '../store/records';

export type Selection = { scope: 'site'; siteId: string } | { scope: 'dates'; from: string; to: string };

export function selectSamples(sel: Selection): Promise<Sample[]> {
  if (sel.scope === 'site') return sel.siteId ? listSamplesForSite(sel.siteId) : Promise.resolve([]);
  return listSamplesBetween(sel.from, sel.to);
}

/** Meter checks made on the days of these samples. */
export async function calibrationsFor(samples: Sample[]): Promise<CalibrationEvent[]> {
  const days = new Set(samples.map((s) => s.localDate));
  return (await listCalibrations()).filter((c) => days.has(c.localDate));
}
