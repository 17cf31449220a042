import { useMemo, useState } from 'preact/hooks';
import { custodyCsv, daySummaryCsv } from '../../exchange/day-sheets';
import { derivedRows } from '../../exchange/csv';
import { shareOrDownload } from '../../exchange/share';
import { isoWithOffset, newId } from '../../records/time';
import { getFieldDay, listCalibrations, listDay, listInstruments, listSites, updateFieldDay } from '../../store/records';
import { parseDecimalLoose } from '../../records/numbers';
import { PARAM_WORDS, uncoveredParameters } from '../coverage';
import { useLive, useProfile, useSettings } from '../data';
import { showDayLong, showMoment, showTime } from '../format';
import { SampleCode } from '../components/SampleCode';
import { StateBadge } from '../components/State';
import { DayMeters, endOfDayChecks, meterNames } from './DayMeters';
import type { Route } from '../router';
import { todayLocal } from '../../records/time';

/** The day on one page: every sample with its ID, state, warnings, QC and meter checks; custody; export and print. */
export function DaySummary({ route }: { route: Route }) {
  const date = route.query.get('date') || todayLocal();
  const settings = useSettings();
  const profile = useProfile();
  const samples = useLive(() => listDay(date), [date], ['samples']);
  const sites = useLive(listSites, [], ['sites']);
  const cals = useLive(listCalibrations, [], ['calibrations']);
  const instruments = useLive(listInstruments, [], ['instruments']);
  const day = useLive(() => getFieldDay(date), [date], ['fieldDays']);
  const [msg, setMsg] = useState('');
  const list = samples.data ?? [];
  const ctx = useMemo(() => ({ samples: list, sites: sites.data ?? [], settings, profile }), [list, sites.data, settings, profile]);
  const rows = useMemo(() => derivedRows(ctx), [ctx]);
  const meterNotes = useMemo(
    () => new Map(list.map((s) => [s.id, uncoveredParameters(s, cals.data ?? [], profile).map((u) => `outside a passing ${PARAM_WORDS[u.parameter] ?? u.parameter} check`)])),
    [list, cals.data, profile],
  );
  const ends = endOfDayChecks(list, (cals.data ?? []).filter((c) => c.localDate >= date));
  const open = rows.filter((r) => r.d.warnings.length > 0 || r.qc?.pass === false || (meterNotes.get(r.s.id) ?? []).length > 0).length;

  const download = async (name: string, text: string) => {
    const outcome = await shareOrDownload(name, text, 'text/csv');
    setMsg(outcome === 'shared' ? `Shared ${name}.` : outcome === 'downloaded' ? `Saved ${name} to downloads.` : 'Cancelled.');
  };
  return (
    <section class="day-summary">
      <p class="lead">{showDayLong(date)}: {list.length} sample{list.length === 1 ? '' : 's'}{list.length ? `, ${open === 0 ? 'nothing to check' : `${open} to check before leaving`}` : ''}.</p>
      <div class="no-print">
        <DayMeters date={date} />
      </div>
      <h2>End-of-day meter check</h2>
      {ends.length === 0 ? <p class="muted">No meter readings on this day.</p> : (
        <ul class="end-checks">
          {ends.map((e) => (
            <li key={e.parameter} class={e.check ? 'ok' : 'bad'}>
              {e.check ? `✓ ${e.parameter}: passing check at ${showTime(e.check.time)}, after the last sample (${showTime(e.lastSample)})` : `✗ ${e.parameter}: no passing check after the last sample (${showTime(e.lastSample)})`}
            </li>
          ))}
        </ul>
      )}
      {ends.some((e) => !e.check) && <a class="btn btn-small no-print" href="#/checks">Record the end-of-day check</a>}

      <h2>Samples</h2>
      <ul class="cards day-rows" aria-label="Samples of the day, checked">
        {rows.map(({ s, site, d, parentCode, qc }) => {
          const notes = meterNotes.get(s.id) ?? [];
          return (
            <li key={s.id} class="card day-row">
              <span class="card-title"><SampleCode code={s.sampleCode} /> {showTime(s.time)} · {site?.code ?? '?'}{s.qc.type !== 'environmental' ? ` · ${s.qc.type}` : ''}</span>
              <StateBadge state={d.analysis?.calciteState ?? 'unknown'} />
              {s.qc.type !== 'environmental' && (
                <span class={qc?.pass === false ? 'flag' : 'muted'} data-testid="day-qc">
                  QC {s.qc.type}{parentCode ? ` of ${parentCode}` : ''}: {qc?.pass === undefined ? 'not judged' : qc.pass ? '✓ pass' : `✗ fail (${qc.checks.filter((c) => !c.pass).map((c) => c.parameter).join(', ')})`}
                </span>
              )}
              <span class="muted">Meters: {s.instrumentIds.length ? meterNames(s.instrumentIds, instruments.data ?? []) : 'none linked'}{notes.length ? '' : ' · within a passing check'}</span>
              {notes.map((n) => <span key={n} class="flag">⚠ {n}</span>)}
              {d.warnings.length > 0 && (
                <details>
                  <summary>{d.warnings.length} warning{d.warnings.length > 1 ? 's' : ''}</summary>
                  <ul>{d.warnings.map((w, i) => <li key={i}>{w.message}</li>)}</ul>
                </details>
              )}
              <a class="linkish no-print" href={`#/sample/${encodeURIComponent(s.id)}`}>Open</a>
            </li>
          );
        })}
      </ul>

      <Custody date={date} transfers={day.data?.custody ?? []} />

      <div class="export-buttons no-print">
        <button type="button" class="btn btn-primary" disabled={list.length === 0} onClick={() => download(`bankside_${date}_day_summary.csv`, daySummaryCsv({ ...ctx, instruments: instruments.data ?? [], meterNotes }, { bom: true }))}>Day summary CSV</button>
        <button type="button" class="btn" disabled={list.length === 0 || !(day.data?.custody ?? []).length} onClick={() => download(`bankside_${date}_chain_of_custody.csv`, custodyCsv({ date, custody: day.data?.custody ?? [] }, ctx, { bom: true }))}>Chain of custody CSV</button>
        <a class="btn" href={`#/labels?date=${date}`}>Bottle labels</a>
        <button type="button" class="btn" onClick={() => print()}>Print this page</button>
      </div>
      {msg && <p class="notice" role="status">{msg}</p>}
    </section>
  );
}

/** Chain of custody: each hand-over of the day's samples, added as it happens. */
function Custody({ date, transfers }: { date: string; transfers: NonNullable<import('../../records/schema').FieldDay['custody']> }) {
  const settings = useSettings();
  const [from, setFrom] = useState(settings.operator);
  const [to, setTo] = useState('');
  const [temp, setTemp] = useState('');
  const [err, setErr] = useState('');
  const add = async () => {
    const t = temp.trim() ? parseDecimalLoose(temp) : undefined;
    if (!from.trim() || !to.trim()) return setErr('Give who hands the samples over and who receives them.');
    if (temp.trim() && t === undefined) return setErr('The cooler temperature is not a number.');
    setErr('');
    const next = [...transfers, { id: newId('custody'), relinquishedBy: from.trim(), receivedBy: to.trim(), time: isoWithOffset(), ...(t !== undefined ? { coolerTempC: t } : {}), remarks: '' }];
    try {
      await updateFieldDay(date, { custody: next }, settings.operator || 'field crew');
      setTo('');
      setTemp('');
    } catch (e) {
      setErr(e instanceof Error ? e.message : String(e));
    }
  };
  return (
    <div class="custody">
      <h2>Chain of custody</h2>
      {transfers.length === 0 ? <p class="muted">No hand-over recorded yet.</p> : (
        <ol class="custody-list">
          {transfers.map((t) => (
            <li key={t.id}>
              {showMoment(t.time)}: <strong>{t.relinquishedBy}</strong> → <strong>{t.receivedBy}</strong>
              {t.coolerTempC !== undefined ? `, cooler ${t.coolerTempC} °C` : ''}
              <span class="print-only sign"> Signatures: ________ / ________</span>
            </li>
          ))}
        </ol>
      )}
      <div class="custody-form no-print">
        <div class="field"><label for="coc-from">Relinquished by</label><input id="coc-from" value={from} onInput={(e) => setFrom((e.currentTarget as HTMLInputElement).value)} autoComplete="off" /></div>
        <div class="field"><label for="coc-to">Received by</label><input id="coc-to" value={to} onInput={(e) => setTo((e.currentTarget as HTMLInputElement).value)} autoComplete="off" /></div>
        <div class="field"><label for="coc-temp">Cooler temperature (°C)</label><input id="coc-temp" inputMode="decimal" value={temp} onInput={(e) => setTemp((e.currentTarget as HTMLInputElement).value)} autoComplete="off" /></div>
        {err && <p class="field-error" role="alert">{err}</p>}
        <button type="button" class="btn" onClick={add}>Record hand-over now</button>
      </div>
    </div>
  );
}
