import { useState } from 'preact/hooks';
import { importSites, previewSiteFile, type SitePreview } from '../../exchange/site-import';
import { listSites } from '../../store/records';
import { useSettings } from '../data';

const ACTION_WORDS = { new: 'new site', update: 'updates the site with this code', skip: 'not imported' } as const;

/** Import a site list (office CSV or another phone's sites GeoJSON): preview with each row's problems, then store. */
export function SiteImport() {
  const settings = useSettings();
  const [preview, setPreview] = useState<SitePreview | null>(null);
  const [fileName, setFileName] = useState('');
  const [msg, setMsg] = useState('');
  const [busy, setBusy] = useState(false);

  const read = async (file: File) => {
    setMsg('');
    setFileName(file.name);
    setPreview(previewSiteFile(file.name, await file.text(), await listSites()));
  };
  const good = preview?.rows.filter((r) => r.errors.length === 0).length ?? 0;
  const bad = (preview?.rows.length ?? 0) - good;
  return (
    <div class="site-import">
      <p class="hint">
        A CSV with columns <code>code, name, type, latitude, longitude, datum</code> and optionally <code>run_order</code>, or the
        sites map file (GeoJSON) another phone exported. A code already on this phone updates that site.
      </p>
      <label class="btn file-btn">
        Choose a site file…
        <input type="file" accept=".csv,.geojson,.json,text/csv,application/geo+json,application/json" class="visually-hidden" onChange={(e) => { const f = (e.currentTarget as HTMLInputElement).files?.[0]; if (f) void read(f); }} />
      </label>
      {preview && (
        <div class="import-preview" aria-label="Site import preview">
          <p role="status">
            {fileName}: {preview.rows.length} row{preview.rows.length === 1 ? '' : 's'}, {good} ready{bad > 0 ? `, ${bad} with problems (left out)` : ''}.
          </p>
          {preview.fileErrors.map((e) => <p key={e} class="field-error" role="alert">{e}</p>)}
          <ul class="cards import-rows">
            {preview.rows.map((r) => (
              <li key={r.line} class={r.errors.length ? 'card import-row bad' : 'card import-row'}>
                <span class="card-title">{preview.format === 'csv' ? 'Line' : 'Feature'} {r.line} · {r.code || '(no code)'} {r.site ? `· ${r.site.name}` : ''}</span>
                {r.site && (
                  <span class="muted">
                    {r.site.type}
                    {r.site.latitude !== undefined ? ` · ${r.site.latitude}, ${r.site.longitude} ${r.site.datum}` : ' · no position'}
                    {r.site.runOrder !== undefined ? ` · run order ${r.site.runOrder}` : ''} · {ACTION_WORDS[r.action]}
                  </span>
                )}
                {r.errors.map((e) => <span key={e} class="field-error">{e}</span>)}
              </li>
            ))}
          </ul>
          <div class="row2">
            <button type="button" class="btn btn-primary" disabled={busy || good === 0} onClick={async () => {
              setBusy(true);
              try {
                const r = await importSites(preview, settings.operator || 'field crew');
                setMsg(`Imported: ${r.created} new, ${r.updated} updated${r.skipped ? `, ${r.skipped} left out` : ''}.`);
                setPreview(null);
              } catch (e) {
                setMsg(`Import stopped: ${e instanceof Error ? e.message : String(e)}`);
              } finally {
                setBusy(false);
              }
            }}>Import {good} site{good === 1 ? '' : 's'}</button>
            <button type="button" class="btn" onClick={() => setPreview(null)}>Cancel</button>
          </div>
        </div>
      )}
      {msg && <p class="notice" role="status">{msg}</p>}
    </div>
  );
}
