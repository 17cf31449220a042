import { useState } from 'preact/hooks';
import { calibrationsCsv, longCsv, titrationsCsv, wideCsv } from '../../exchange/csv';
import { samplesGeoJson, sitesGeoJson } from '../../exchange/geojson';
import { listExportLog, logExport } from '../../exchange/log';
import { drainOutbox, enqueueUpload, listOutbox } from '../../exchange/outbox';
import { shareOrDownload } from '../../exchange/share';
import { wqxLocationsCsv, wqxResultsCsv } from '../../exchange/wqx';
import type { ExportLogEntry, OutboxItem, Sample } from '../../records/schema';
import { todayLocal } from '../../records/time';
import { createBackup } from '../../store/backup';
import { listCalibrations, listSamplesBetween, listSamplesForSite, listSites } from '../../store/records';
import { Choice, DateField, SelectField } from '../components/Field';
import { showMoment } from '../format';
import { useLive, useProfile, useSettings } from '../data';
import { requestBackgroundSync } from '../outbox-triggers';

type Scope = 'day' | 'range' | 'site';

const EXPORT_WORDS: Record<string, string> = {
  'csv-wide': 'samples CSV', 'csv-long': 'values CSV', 'csv-calibrations': 'meter checks CSV', 'csv-titrations': 'titration points CSV',
  geojson: 'map file', upload: 'upload', backup: 'backup',
};

const STATUS_WORDS: Record<OutboxItem['status'], string> = {
  queued: 'Queued: waits for signal',
  sending: 'Sending…',
  sent: '✓ Received by the office',
  failed: '✗ Refused by the office',
};

export function SendScreen() {
  const settings = useSettings();
  const profile = useProfile();
  const sites = useLive(listSites, [], ['sites']);
  const outbox = useLive(listOutbox, [], ['outbox']);
  const log = useLive(listExportLog, [], ['exportLog']);
  const [scope, setScope] = useState<Scope>('day');
  const [from, setFrom] = useState(todayLocal());
  const [to, setTo] = useState(todayLocal());
  const [siteId, setSiteId] = useState('');
  const [bom, setBom] = useState(true);
  const [msg, setMsg] = useState('');
  const [err, setErr] = useState('');

  const pick = async (): Promise<Sample[]> => {
    if (scope === 'site') return siteId ? listSamplesForSite(siteId) : [];
    return listSamplesBetween(from, scope === 'day' ? from : to);
  };
  const label = scope === 'site' ? (sites.data ?? []).find((s) => s.id === siteId)?.code ?? 'site' : scope === 'day' ? from : `${from}_to_${to}`;

  const run = async (kind: ExportLogEntry['kind']) => {
    setErr('');
    setMsg('');
    try {
      const samples = await pick();
      if (samples.length === 0) return setErr('No samples in that selection.');
      const allSites = await listSites();
      const ctx = { samples, sites: allSites, settings, profile };
      const name = (suffix: string, ext: string) => `bankside_${label}_${suffix}.${ext}`;
      let file: { name: string; text: string; type: string };
      switch (kind) {
        case 'csv-wide': file = { name: name('samples', 'csv'), text: wideCsv(ctx, { bom }), type: 'text/csv' }; break;
        case 'csv-long': file = { name: name('values', 'csv'), text: longCsv(ctx, { bom }), type: 'text/csv' }; break;
        case 'csv-calibrations': {
          const ids = new Set(samples.map((s) => s.localDate));
          const cals = (await listCalibrations()).filter((c) => ids.has(c.localDate));
          file = { name: name('meter_checks', 'csv'), text: calibrationsCsv(cals, { bom }), type: 'text/csv' };
          break;
        }
        case 'csv-titrations': file = { name: name('titrations', 'csv'), text: titrationsCsv(samples, { bom }), type: 'text/csv' }; break;
        case 'geojson': file = { name: name('samples', 'geojson'), text: samplesGeoJson(samples, allSites, settings), type: 'application/geo+json' }; break;
        case 'wqx-results': file = { name: name('wqx_results', 'csv'), text: wqxResultsCsv(ctx, { bom }), type: 'text/csv' }; break;
        case 'wqx-locations': {
          const used = new Set(samples.map((s) => s.siteId));
          file = { name: name('wqx_locations', 'csv'), text: wqxLocationsCsv(allSites.filter((s) => used.has(s.id)), { bom }), type: 'text/csv' };
          break;
        }
        default: return;
      }
      const outcome = await shareOrDownload(file.name, file.text, file.type);
      if (outcome !== 'cancelled') await logExport(kind, file.name, samples.map((s) => s.id));
      setMsg(outcome === 'shared' ? `Shared ${file.name}.` : outcome === 'downloaded' ? `Saved ${file.name} to downloads.` : 'Cancelled.');
    } catch (e) {
      setErr(e instanceof Error ? e.message : String(e));
    }
  };

  const queue = async () => {
    setErr('');
    const samples = await pick();
    if (samples.length === 0) return setErr('No samples in that selection.');
    const ctx = { samples, sites: await listSites(), settings, profile };
    const fileName = `bankside_${label}_samples.csv`;
    await enqueueUpload({ fileName, contentType: 'text/csv', body: wideCsv(ctx), sampleIds: samples.map((s) => s.id) });
    await logExport('upload', fileName, samples.map((s) => s.id));
    setMsg(settings.office.endpoint ? 'Queued for the office; it goes as soon as there is signal.' : 'Queued. Set the office address in Settings to send it.');
    void requestBackgroundSync();
    if (settings.office.endpoint) void drainOutbox({ office: settings.office, force: true });
  };

  return (
    <section>
      <p class="lead">Send the records to the office once you have signal. Nothing leaves the phone until you say so.</p>
      <Choice name="scope" label="Which samples" value={scope} onChange={setScope} options={[{ value: 'day', label: 'One day' }, { value: 'range', label: 'Date range' }, { value: 'site', label: 'One site' }]} />
      {scope !== 'site' ? (
        <div class="row2">
          <DateField id="from" label={scope === 'day' ? 'Day' : 'From'} value={from} onChange={setFrom} />
          {scope === 'range' && <DateField id="to" label="To" value={to} onChange={setTo} />}
        </div>
      ) : (
        <SelectField id="send-site" label="Site" value={siteId} onChange={setSiteId}>
          <option value="">Choose a site…</option>
          {(sites.data ?? []).map((s) => <option key={s.id} value={s.id}>{s.code} · {s.name}</option>)}
        </SelectField>
      )}
      <label class="check-line"><input type="checkbox" checked={bom} onChange={() => setBom(!bom)} /> Mark files for spreadsheets (UTF-8 BOM)</label>
      <div class="export-buttons">
        <button type="button" class="btn btn-primary" onClick={() => run('csv-wide')}>Samples CSV (one row each)</button>
        <button type="button" class="btn" onClick={() => run('csv-long')}>Values CSV (one row per value)</button>
        <button type="button" class="btn" onClick={() => run('csv-calibrations')}>Meter checks CSV</button>
        <button type="button" class="btn" onClick={() => run('csv-titrations')}>Titration points CSV</button>
        <button type="button" class="btn" onClick={() => run('wqx-results')}>WQX results CSV</button>
        <button type="button" class="btn" onClick={() => run('wqx-locations')}>WQX monitoring locations CSV</button>
        <button type="button" class="btn" onClick={() => run('geojson')}>Map file (GeoJSON)</button>
        <button type="button" class="btn" onClick={async () => shareOrDownload('bankside_sites.geojson', sitesGeoJson(await listSites()), 'application/geo+json')}>Sites map file</button>
      </div>
      {err && <p class="field-error" role="alert">{err}</p>}
      {msg && <p class="notice" role="status">{msg}</p>}

      <h2>Upload to the office</h2>
      <p class="muted">{settings.office.endpoint ? `To ${settings.office.endpoint}` : 'No office address yet: set it in Settings.'}</p>
      <div class="row2">
        <button type="button" class="btn btn-primary" onClick={queue}>Queue selection for upload</button>
        <button type="button" class="btn" onClick={async () => { const r = await drainOutbox({ office: settings.office, force: true }); setMsg(`Sent ${r.sent}; ${r.queued} still queued; ${r.failed} refused.`); }}>Send now</button>
      </div>
      {(outbox.data ?? []).length === 0 ? <p class="muted">Nothing waiting to be sent.</p> : (
        <ul class="cards" aria-label="Upload queue">
          {(outbox.data ?? []).map((o) => (
            <li key={o.id} class="card" data-status={o.status}>
              <span class="card-title">{o.fileName} · {o.sampleIds.length} samples</span>
              <span>{STATUS_WORDS[o.status]}{o.status === 'queued' && o.nextAttemptAt ? ` (next try ${showMoment(o.nextAttemptAt)})` : ''}</span>
              {o.lastError && o.status !== 'sent' && <span class="muted">Last try: {o.lastError}</span>}
              {o.sentAt && <span class="muted">Received {showMoment(o.sentAt)}</span>}
            </li>
          ))}
        </ul>
      )}

      <h2>Lab results</h2>
      <p><a class="btn" href="#/lab">Import a lab results file</a></p>

      <h2>Backup</h2>
      <button type="button" class="btn btn-block" onClick={async () => shareOrDownload(`bankside-backup-${todayLocal()}.json`, JSON.stringify(await createBackup()), 'application/json')}>
        Download a full backup
      </button>
      {(log.data ?? []).length > 0 && (
        <details class="section">
          <summary>Export log ({(log.data ?? []).length})</summary>
          <ul>{(log.data ?? []).slice(0, 50).map((l) => <li key={l.id}>{showMoment(l.at)} · {EXPORT_WORDS[l.kind] ?? l.kind} · {l.fileName} · {l.sampleIds.length} samples · engine {l.engineVersion}</li>)}</ul>
        </details>
      )}
    </section>
  );
}
