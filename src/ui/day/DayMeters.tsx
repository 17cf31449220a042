import type { CalibrationEvent, Instrument, Sample } from '../../records/schema';
import { getFieldDay, listInstruments, updateFieldDay } from '../../store/records';
import { useLive, useSettings } from '../data';

/** The meters chosen for the day of `time` (a new sample of that day links to them). */
export async function dayMeters(time: string): Promise<string[]> {
  return (await getFieldDay(time.slice(0, 10)))?.instrumentIds ?? [];
}

/** Choose the day's meters once; every sample saved afterwards that day records them. */
export function DayMeters({ date }: { date: string }) {
  const settings = useSettings();
  const instruments = useLive(listInstruments, [], ['instruments']);
  const day = useLive(() => getFieldDay(date), [date], ['fieldDays']);
  const chosen = new Set(day.data?.instrumentIds ?? []);
  const list = instruments.data ?? [];
  const toggle = (id: string) => {
    const next = new Set(chosen);
    if (next.has(id)) next.delete(id);
    else next.add(id);
    void updateFieldDay(date, { instrumentIds: [...next] }, settings.operator || 'field crew');
  };
  return (
    <fieldset class="day-meters">
      <legend>Meters used today</legend>
      {list.length === 0 ? <p class="muted">No meters yet: add one on the Checks screen.</p> : list.map((i) => (
        <label key={i.id} class="check-line">
          <input type="checkbox" checked={chosen.has(i.id)} onChange={() => toggle(i.id)} /> {i.name}{i.serial ? ` (${i.serial})` : ''}
        </label>
      ))}
      <p class="hint">Each new sample of this day records these meters.</p>
    </fieldset>
  );
}

const PARAM_WORDS: Record<string, string> = { pH: 'pH', sc: 'conductance', do: 'oxygen', temperature: 'temperature' };
const MEASURED: Array<{ key: CalibrationEvent['parameter']; has: (s: Sample) => boolean }> = [
  { key: 'pH', has: (s) => !!s.field.pH },
  { key: 'sc', has: (s) => !!s.field.conductance },
  { key: 'do', has: (s) => !!s.field.do },
];

export interface EndCheck {
  parameter: string;
  lastSample: string;
  /** the passing check after the last sample of the day, if any */
  check?: CalibrationEvent;
}

/**
 * The end-of-day meter check: for each parameter measured this day, a passing check (of a meter the
 * samples used, or any meter when none is linked) after the day's last sample of that parameter.
 */
export function endOfDayChecks(samples: Sample[], calibrations: CalibrationEvent[]): EndCheck[] {
  const out: EndCheck[] = [];
  for (const p of MEASURED) {
    const measured = samples.filter(p.has);
    if (measured.length === 0) continue;
    const last = measured.reduce((a, b) => (Date.parse(a.time) >= Date.parse(b.time) ? a : b));
    const meters = new Set(measured.flatMap((s) => s.instrumentIds));
    const check = calibrations.find((c) => c.parameter === p.key && c.pass && Date.parse(c.time) >= Date.parse(last.time) && (meters.size === 0 || meters.has(c.instrumentId)));
    out.push({ parameter: PARAM_WORDS[p.key]!, lastSample: last.time, ...(check ? { check } : {}) });
  }
  return out;
}

export function meterNames(ids: string[], instruments: Instrument[]): string {
  const byId = new Map(instruments.map((i) => [i.id, i.name]));
  return ids.map((id) => byId.get(id) ?? id).join(', ');
}
