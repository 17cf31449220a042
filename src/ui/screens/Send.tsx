import { useState } from 'preact/hooks';
import { sitesGeoJson } from '../../exchange/geojson';
import { startExport, type ExportJob } from '../../exchange/export-job';
import type { StreamedExportKind } from '../../exchange/export-stream';
import { selectSamples, type Selection } from '../../exchange/selection';
import { listExportLog, logExport } from '../../exchange/log';
import { drainOutbox, enqueueUpload, listOutbox } from '../../exchange/outbox';
import { shareOrDownload } from '../../exchange/share';
import { wqxLocationsCsv, wqxResultsCsv } from '../../exchange/wqx';
import type { ExportLogEntry, OutboxItem } from '../../records/schema';
import { todayLocal } from '../../records/time';
import { createBackup } from '../../store/backup';
import { listSites } from '../../store/records';
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
  const [job, setJob] = useState<{ job: ExportJob; done: number; total: number } | null>(null);

  const selection = (): Selection => (scope === 'site' ? { scope: 'site', siteId } : { scope: 'dates', from, to: scope === 'day' ? from : to });
  /** Exports are written in a worker, chunk by chunk, so the screen never freezes; they can be cancelled. */
  const exportFile = async (kind: StreamedExportKind, withBom: boolean) => {
    const j = startExport({ kind, selection: selection(), settings, profile, bom: withBom }, (done, total) => setJob({ job: j, done, total }));
    setJob({ job: j, done: 0, total: 0 });
    try {
      return await j.result;
    } finally {
      setJob(null);
    }
  };
  const label = scope === 'site' ? (sites.data ?? []).find((s) => s.id === siteId)?.code ?? 'site' : scope === 'day' ? from : `${from}_to_${to}`;

  const run = async (kind: StreamedExportKind | 'wqx-results' | 'wqx-locations') => {
    setErr('');
    setMsg('');
    try {
      if (kind === 'wqx-results' || kind === 'wqx-locations') {
        // WQX files are written on the page in one piece (not yet in the export worker)
        const samples = await selectSamples(selection());
        if (samples.length === 0) return setErr('No samples in that selection.');
        const allSites = await listSites();
        const used = new Set(samples.map((x) => x.siteId));
        const fileName = `bankside_${label}_${kind === 'wqx-results' ? 'wqx_results' : 'wqx_locations'}.csv`;
        const text = kind === 'wqx-results' ? wqxResultsCsv({ samples, sites: allSites, settings, profile }, { bom }) : wqxLocationsCsv(allSites.filter((x) => used.has(x.id)), { bom });
        const outcome = await shareOrDownload(fileName, text, 'text/csv');
        if (outcome !== 'cancelled') await logExport(kind, fileName, samples.map((x) => x.id));
        return setMsg(outcome === 'shared' ? `Shared ${fileName}.` : outcome === 'downloaded' ? `Saved ${fileName} to downloads.` : 'Cancelled.');
      }
      const out = await exportFile(kind, kind === 'geojson' ? false : bom);
      if (out.status === 'cancelled') return setMsg('Export cancelled: no file was made.');
      if (out.sampleIds.length === 0) return setErr('No samples in that selection.');
      const [suffix, ext, type] = ({
        'csv-wide': ['samples', 'csv', 'text/csv'],
        'csv-long': ['values', 'csv', 'text/csv'],
        'csv-calibrations': ['meter_checks', 'csv', 'text/csv'],
        'csv-titrations': ['titrations', 'csv', 'text/csv'],
        geojson: ['samples', 'geojson', 'application/geo+json'],
      } as const)[kind];
      const fileName = `bankside_${label}_${suffix}.${ext}`;
      const outcome = await shareOrDownload(fileName, out.blob, type);
      if (outcome !== 'cancelled') await logExport(kind, fileName, out.sampleIds);
      setMsg(outcome === 'shared' ? `Shared ${fileName}.` : outcome === 'downloaded' ? `Saved ${fileName} to downloads.` : 'Cancelled.');
    } catch (e) {
      setErr(e instanceof Error ? e.message : String(e));
    }
  };

  const queue = async () => {
    setErr('');
    setMsg('');
    try {
      const out = await exportFile('csv-wide', false);
      if (out.status === 'cancelled') return setMsg('Cancelled: nothing was queued.');
      if (out.sampleIds.length === 0) return setErr('No samples in that selection.');
      const fileName = `bankside_${label}_samples.csv`;
      await enqueueUpload({ fileName, contentType: 'text/csv', body: await out.blob.text(), sampleIds: out.sampleIds });
      await logExport('upload', fileName, out.sampleIds);
      setMsg(settings.office.endpoint ? 'Queued for the office; it goes as soon as there is signal.' : 'Queued. Set the office address in Settings to send it.');
      void requestBackgroundSync();
      if (settings.office.endpoint) void drainOutbox({ office: settings.office, force: true });
    } catch (e) {
      setErr(e instanceof Error ? e.message : String(e));
    }
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
      {job && (
        <div class="export-progress" role="status">
          <label for="export-progress">{job.total > 0 ? `Writing the file: ${job.done.toLocaleString()} of ${job.total.toLocaleString()} samples` : 'Reading the samples…'}</label>
          <progress id="export-progress" max={job.total || 1} value={job.total ? job.done : undefined} />
          <button type="button" class="btn" onClick={() => job.job.cancel()}>Cancel export</button>
        </div>
      )}
      <div class="export-buttons">
        <button type="button" class="btn btn-primary" disabled={!!job} onClick={() => run('csv-wide')}>Samples CSV (one row each)</button>
        <button type="button" class="btn" disabled={!!job} onClick={() => run('csv-long')}>Values CSV (one row per value)</button>
        <button type="button" class="btn" disabled={!!job} onClick={() => run('csv-calibrations')}>Meter checks CSV</button>
        <button type="button" class="btn" disabled={!!job} onClick={() => run('csv-titrations')}>Titration points CSV</button>
        <button type="button" class="btn" disabled={!!job} onClick={() => run('wqx-results')}>WQX results CSV</button>
        <button type="button" class="btn" disabled={!!job} onClick={() => run('wqx-locations')}>WQX monitoring locations CSV</button>
        <button type="button" class="btn" disabled={!!job} onClick={() => run('geojson')}>Map file (GeoJSON)</button>
        <button type="button" class="btn" onClick={async () => shareOrDownload('bankside_sites.geojson', sitesGeoJson(await listSites()), 'application/geo+json')}>Sites map file</button>
      </div>
      {err && <p class="field-error" role="alert">{err}</p>}
      {msg && <p class="notice" role="status">{msg}</p>}

      <h2>Upload to the office</h2>
      <p class="muted">{settings.office.endpoint ? `To ${settings.office.endpoint}` : 'No office address yet: set it in Settings.'}</p>
      <div class="row2">
        <button type="button" class="btn btn-primary" disabled={!!job} onClick={queue}>Queue selection for upload</button>
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
