import { derivedFor } from '../../records/derived-cache';
import { todayLocal } from '../../records/time';
import { listCalibrations, listDay, listSites, restoreSample } from '../../store/records';
import { loadDemo } from '../../demo/load';
import { StateBadge } from '../components/State';
import { SampleCode } from '../components/SampleCode';
import { DayGuide } from '../day/DayGuide';
import { useLive, useProfile, useSettings } from '../data';
import { PARAM_WORDS, uncoveredParameters } from '../coverage';
import type { Route } from '../router';
import { go } from '../router';
import { useState } from 'preact/hooks';
import { Windowed } from '../components/Windowed';
import { Icon } from '../components/Icon';
import { showDayLong, showTime } from '../format';
import { splitWarnings } from '../warning-kinds';

function shiftDate(date: string, days: number): string {
  const d = new Date(`${date}T12:00:00`);
  d.setDate(d.getDate() + days);
  return todayLocal(d);
}

export function TodayScreen({ route }: { route: Route }) {
  const date = route.query.get('date') || todayLocal();
  const settings = useSettings();
  const profile = useProfile();
  const samples = useLive(() => listDay(date), [date], ['samples']);
  const sites = useLive(listSites, [], ['sites']);
  const cals = useLive(listCalibrations, [], ['calibrations']);
  const [busy, setBusy] = useState('');
  const siteById = new Map((sites.data ?? []).map((s) => [s.id, s]));
  const list = samples.data ?? [];
  const deleted = route.query.get('deleted');
  const isToday = date === todayLocal();
  return (
    <section>
      <div class="day-nav">
        <a class="btn btn-small" href={`#/today?date=${shiftDate(date, -1)}`} aria-label="Previous day"><Icon name="prev" /></a>
        <p class="lead day-label">{showDayLong(date)}{isToday ? ' (today)' : ''}</p>
        <a class="btn btn-small" href={`#/today?date=${shiftDate(date, 1)}`} aria-label="Next day"><Icon name="next" /></a>
      </div>
      {route.query.get('saved') && <p class="notice" role="status">Sample saved on this phone.</p>}
      {deleted && (
        <p class="notice" role="status">
          Sample deleted. <button type="button" class="btn btn-small" onClick={() => restoreSample(deleted, settings.operator || 'field crew').then(() => go(`#/today?date=${date}`))}>Undo</button>
        </p>
      )}
      <a class="btn btn-primary btn-block" href="#/new">+ New sample</a>
      <DayGuide sites={sites.data ?? []} daySamples={list} isToday={isToday} />
      {list.length > 0 && <a class="btn btn-block day-summary-link" href={`#/day?date=${date}`}>Day summary, custody and labels</a>}
      {list.length === 0 ? (
        <div class="empty">
          <p>No samples recorded {isToday ? 'today' : 'on this day'}.</p>
          {(sites.data ?? []).length === 0 && (
            <>
              <p class="muted">Trying Bankside out? Load the invented demo creek (marked as demo, removable in Settings).</p>
              <button type="button" class="btn" disabled={!!busy} onClick={async () => { setBusy('Loading…'); await loadDemo(); setBusy(''); }}>
                {busy || 'Load demo creek'}
              </button>
            </>
          )}
        </div>
      ) : (
        // Derived results come from the cache (once per sample revision); a long day renders only the
        // cards on screen.
        <Windowed class="cards" aria-label="Samples of the day" items={list} rowHeight={340} windowFrom={100} row={(s) => {
            const d = derivedFor(s, settings, profile);
            const uncovered = uncoveredParameters(s, cals.data ?? [], profile);
            const a = d.analysis;
            const site = siteById.get(s.siteId);
            const nWarn = splitWarnings(d.warnings).action.length + uncovered.length;
            return (
              <li key={s.id}>
                <a class="card sample-card" href={`#/sample/${encodeURIComponent(s.id)}`}>
                  <span class="card-title">
                    {showTime(s.time)} · {site ? `${site.code} ${site.name}` : 'unknown site'}
                    {s.qc.type !== 'environmental' && <span class="tag">{s.qc.type}</span>}
                    {s.demo && <span class="tag">demo</span>}
                  </span>
                  {s.sampleCode && <span class="card-code">Sample ID <SampleCode code={s.sampleCode} /></span>}
                  <StateBadge state={a?.calciteState ?? 'unknown'} />
                  <span class="keyvals">
                    {d.input.tempC !== undefined && Number.isFinite(d.input.tempC) && <span>{d.input.tempC.toFixed(1)} °C</span>}
                    {d.input.pH != null && <span>pH {d.input.pH.toFixed(2)}</span>}
                    {d.input.scUsPerCm != null && <span>{d.input.scUsPerCm.toFixed(0)} µS/cm</span>}
                    {a?.saturationIndex.calcite !== undefined && <span>SI {a.saturationIndex.calcite.toFixed(2)} ± {a.calciteSiUncertainty!.toFixed(2)}</span>}
                    {a?.logPco2 !== undefined && <span>log pCO₂ {a.logPco2.toFixed(2)}</span>}
                  </span>
                  {uncovered.length > 0 && <span class="flag"><Icon name="warn" size={18} /> Outside a passing {uncovered.map((u) => PARAM_WORDS[u.parameter]).join(' / ')} check</span>}
                  {nWarn > 0 && <span class="muted">{nWarn} thing{nWarn > 1 ? 's' : ''} to check</span>}
                </a>
              </li>
            );
          }} />
      )}
    </section>
  );
}
