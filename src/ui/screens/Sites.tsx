import { useEffect, useMemo, useRef, useState } from 'preact/hooks';
import { derivedFor } from '../../records/derived-cache';
import { siteFactorsFrom } from '../../records/site-factor';
import type { Site } from '../../records/schema';
import { getSite, listSamplesForSite, listSites, saveSite, toStoreError } from '../../store/records';
import { Choice, TextField } from '../components/Field';
import { StateBadge } from '../components/State';
import { Windowed } from '../components/Windowed';
import { decimateByTime } from '../decimate';
import { useLive, useProfile, useSettings } from '../data';
import { parseDecimal } from '../forms/parse';
import { SiteImport } from '../day/SiteImport';
import { Icon } from '../components/Icon';
import { showAge, showDateTime } from '../format';

interface Position {
  latitude: number;
  longitude: number;
  accuracyM: number;
  /** when the fix was taken (ms since epoch, from the device) */
  at: number;
}

/** A fix older than this is not taken: a new site must not get the previous site's coordinates. */
const FIX_MAX_AGE_MS = 5_000;
/** Above this the fix is shown with a warning (common practice for site positions from a phone). */
const FIX_WARN_ACCURACY_M = 30;

function usePosition(): { pos: Position | null; status: string; locate: () => void } {
  const [pos, setPos] = useState<Position | null>(null);
  const [status, setStatus] = useState('');
  const locate = () => {
    if (!('geolocation' in navigator)) {
      setStatus('This device gives no position: type the coordinates.');
      return;
    }
    setStatus('Finding your position… (works without signal, may take a minute)');
    navigator.geolocation.getCurrentPosition(
      (p) => {
        setPos({ latitude: p.coords.latitude, longitude: p.coords.longitude, accuracyM: p.coords.accuracy, at: p.timestamp || Date.now() });
        setStatus('');
      },
      (e) => setStatus(`No position (${e.code === 1 ? 'permission refused' : e.code === 3 ? 'no fix within a minute' : 'position unavailable'}). Type the coordinates instead.`),
      { enableHighAccuracy: true, timeout: 60_000, maximumAge: FIX_MAX_AGE_MS },
    );
  };
  return { pos, status, locate };
}

/** The fix's accuracy and age, ticking, with a warning when it is too coarse for a site. */
function FixInfo({ pos }: { pos: Position }) {
  const [now, setNow] = useState(Date.now());
  useEffect(() => {
    const t = setInterval(() => setNow(Date.now()), 1000);
    return () => clearInterval(t);
  }, []);
  const coarse = pos.accuracyM > FIX_WARN_ACCURACY_M;
  return (
    <p class={coarse ? 'notice warn fix-info' : 'hint fix-info'} role="status" data-testid="fix-info">
      {coarse && <Icon name="warn" size={20} />} Fix ±{Math.round(pos.accuracyM)} m, taken {showAge(now - pos.at)}.
      {coarse && ` Coarser than ${FIX_WARN_ACCURACY_M} m: wait in the open for a better fix, or type the position from a map.`}
    </p>
  );
}

/** Add a site from the sample form or the sites list, with the phone's position if wanted. */
export function SiteForm({ onCreated, compact }: { onCreated?: (id: string) => void; compact?: boolean }) {
  const settings = useSettings();
  const [code, setCode] = useState('');
  const [name, setName] = useState('');
  const [type, setType] = useState<Site['type']>('stream');
  const [lat, setLat] = useState('');
  const [lon, setLon] = useState('');
  const [acc, setAcc] = useState('');
  const [error, setError] = useState('');
  const { pos, status, locate } = usePosition();
  useEffect(() => {
    if (pos) {
      setLat(pos.latitude.toFixed(6));
      setLon(pos.longitude.toFixed(6));
      setAcc(pos.accuracyM.toFixed(0));
    }
  }, [pos]);
  const la = parseDecimal(lat, { label: 'latitude', min: -90, max: 90 });
  const lo = parseDecimal(lon, { label: 'longitude', min: -180, max: 180 });
  const ac = parseDecimal(acc, { label: 'accuracy', unit: 'm', min: 0 });
  const add = async () => {
    if (!code.trim() || !name.trim()) return setError('Give the site a short code and a name.');
    if (!la.ok || !lo.ok || !ac.ok) return setError('Fix the coordinates first.');
    try {
      const s = await saveSite(
        { code: code.trim(), name: name.trim(), type, datum: 'WGS84', ...(la.value !== undefined ? { latitude: la.value } : {}), ...(lo.value !== undefined ? { longitude: lo.value } : {}), ...(ac.value !== undefined ? { accuracyM: ac.value } : {}) },
        settings.operator || 'field crew',
      );
      setCode(''); setName(''); setLat(''); setLon(''); setAcc(''); setError('');
      onCreated?.(s.id);
    } catch (e) {
      setError(toStoreError(e).message);
    }
  };
  return (
    <div class={compact ? 'site-form compact' : 'site-form'}>
      <div class="row2">
        <TextField id="site-code" label="Site code" value={code} onInput={setCode} placeholder="e.g. MC-02" />
        <TextField id="site-name" label="Site name" value={name} onInput={setName} />
      </div>
      <Choice name="site-type" label="Site type" value={type} onChange={setType} options={[{ value: 'stream', label: 'Stream' }, { value: 'spring', label: 'Spring' }, { value: 'well', label: 'Well' }, { value: 'lake', label: 'Lake' }]} />
      <button type="button" class="btn btn-small" onClick={locate}><Icon name="locate" /> Use my position</button>
      {status && <p class="hint" role="status">{status}</p>}
      {pos && !status && <FixInfo pos={pos} />}
      <div class="row3">
        <TextField id="site-lat" label="Latitude (WGS84)" numeric value={lat} onInput={setLat} error={la.ok ? undefined : la.error} />
        <TextField id="site-lon" label="Longitude (WGS84)" numeric value={lon} onInput={setLon} error={lo.ok ? undefined : lo.error} />
        <TextField id="site-acc" label="Accuracy" unit="m" numeric value={acc} onInput={setAcc} error={ac.ok ? undefined : ac.error} />
      </div>
      {error && <p class="field-error" role="alert">{error}</p>}
      <button type="button" class="btn btn-primary" onClick={add}>Add site</button>
    </div>
  );
}

export function NewSiteInline({ onCreated }: { onCreated: (id: string) => void }) {
  const [open, setOpen] = useState(false);
  if (!open) return <button type="button" class="btn btn-icon" title="New site here" onClick={() => setOpen(true)} aria-expanded="false"><Icon name="plus" /><span class="sr-only">New site here</span></button>;
  return <SiteForm compact onCreated={(id) => { setOpen(false); onCreated(id); }} />;
}

export function SitesScreen() {
  const sites = useLive(listSites, [], ['sites']);
  const list = sites.data ?? [];
  return (
    <section>
      <p class="lead">Streams, springs and wells you sample. Open one for its history chart.</p>
      <details class="section" id="site-import">
        <summary>Import a site list</summary>
        <div class="section-body"><SiteImport /></div>
      </details>
      {list.length === 0 ? <div class="empty"><p>No sites yet.</p></div> : (
        <ul class="cards">
          {list.map((s) => (
            <li key={s.id}>
              <a class="card" href={`#/site/${encodeURIComponent(s.id)}`}>
                <span class="card-title">{s.code} · {s.name}</span>
                <span class="muted">{s.type}{s.latitude !== undefined ? ` · ${s.latitude.toFixed(5)}, ${s.longitude?.toFixed(5)} ${s.datum}${s.accuracyM !== undefined ? ` ±${s.accuracyM} m` : ''}` : ' · no position'}{s.demo ? ' · demo' : ''}</span>
              </a>
            </li>
          ))}
        </ul>
      )}
      <h2>Add a site</h2>
      <SiteForm />
    </section>
  );
}

/** One site: its samples over time, with calcite SI (band) and log pCO₂ on a chart loaded on demand. */
export function SiteDetail({ siteId }: { siteId: string }) {
  const settings = useSettings();
  const profile = useProfile();
  const site = useLive(() => getSite(siteId), [siteId], ['sites']);
  const samples = useLive(() => listSamplesForSite(siteId), [siteId], ['samples']);
  // the site's own SC → I factor once it has three full analyses (issue 12); the generic one before
  const siteFactor = useMemo(() => siteFactorsFrom(samples.data ?? [], settings)[siteId], [samples.data, settings, siteId]);
  const siteSettings = useMemo(() => (siteFactor ? { ...settings, siteFactors: { [siteId]: siteFactor } } : settings), [settings, siteFactor, siteId]);
  const list = samples.data ?? [];
  const chartRef = useRef<HTMLDivElement>(null);
  const [chartError, setChartError] = useState('');
  useEffect(() => {
    const el = chartRef.current;
    if (!el || list.length === 0) return;
    let plot: { destroy(): void } | null = null;
    let cancelled = false;
    const width = Math.min(el.clientWidth || 320, 720);
    (async () => {
      // decimate first (about two samples per pixel column), then derive only those, a slice at a time
      const picked = decimateByTime(list, (x) => Date.parse(x.time), width);
      const pts = [];
      for (let i = 0; i < picked.length; i += 100) {
        for (const x of picked.slice(i, i + 100)) {
          const a = derivedFor(x, siteSettings, profile).analysis;
          if (a?.saturationIndex.calcite !== undefined) pts.push({ t: Date.parse(x.time) / 1000, si: a.saturationIndex.calcite, band: a.calciteSiUncertainty ?? 0, logPco2: a.logPco2 ?? null });
        }
        await new Promise((r) => setTimeout(r, 0));
        if (cancelled) return;
      }
      if (pts.length === 0) return;
      const { siteChart } = await import('../chart');
      if (cancelled) return;
      el.innerHTML = '';
      plot = siteChart(el, pts, width);
    })().catch((e) => setChartError(`Chart unavailable: ${e instanceof Error ? e.message : String(e)}`));
    return () => {
      cancelled = true;
      plot?.destroy();
    };
  }, [samples.data, siteSettings, profile]);
  if (!site.data) return <p class="muted">{site.error || 'Opening…'}</p>;
  const s = site.data;
  return (
    <section>
      <p class="lead">{s.code} · {s.name} ({s.type})</p>
      <p class="muted">{s.latitude !== undefined ? `${s.latitude.toFixed(5)}, ${s.longitude?.toFixed(5)} ${s.datum}` : 'No position recorded'}{s.notes ? ` · ${s.notes}` : ''}</p>
      <p class="muted" data-testid="site-factor">
        {siteFactor
          ? `Own conductance factor: ${(siteFactor.factor * 1e5).toFixed(2)}×10⁻⁵ mol/L per µS/cm (±${Math.round(200 * siteFactor.relUncertainty)} %, 95 %), from ${siteFactor.n} full analyses: used for this site's ionic strength.`
          : `Generic conductance factor in use; three full analyses (field or lab major ions) give this site its own.`}
      </p>
      <h2>Calcite SI and log pCO₂ over time</h2>
      <div ref={chartRef} class="chart" role="img" aria-label="Chart of calcite saturation index with its band, and log pCO₂, over time" />
      <ul class="chart-legend" aria-label="Chart legend">
        <li><svg width="28" height="14" aria-hidden="true"><line x1="2" x2="26" y1="7" y2="7" stroke="#0b3d4f" stroke-width="3" /><circle cx="14" cy="7" r="4" fill="#0b3d4f" /></svg>Calcite SI</li>
        <li><svg width="28" height="14" aria-hidden="true"><rect x="2" y="2" width="24" height="10" fill="#1f7f9040" stroke="#1f7f90" /></svg>Uncertainty band</li>
        <li><svg width="28" height="14" aria-hidden="true"><line x1="2" x2="26" y1="7" y2="7" stroke="#101a1f" stroke-width="2" stroke-dasharray="6 4" /></svg>SI = 0 (saturation)</li>
        <li><svg width="28" height="14" aria-hidden="true"><line x1="2" x2="26" y1="7" y2="7" stroke="#7a4b00" stroke-width="2" stroke-dasharray="10 4" /><circle cx="14" cy="7" r="4" fill="#7a4b00" /></svg>log pCO₂ (lower panel)</li>
      </ul>
      {chartError && <p class="field-error">{chartError}</p>}
      <h2>Samples at this site</h2>
      {/* only the cards on screen are rendered (and derived) once the site has many samples */}
      <Windowed class="cards row-cards" aria-label="Samples at this site" items={list} rowHeight={112} windowFrom={150} row={(x) => {
        const d = derivedFor(x, siteSettings, profile);
        return (
          <li key={x.id}>
            <a class="card" href={`#/sample/${encodeURIComponent(x.id)}`}>
              <span class="card-title">{showDateTime(x.time)}</span>
              <StateBadge state={d.analysis?.calciteState ?? 'unknown'} />
              <span class="keyvals">
                <span>SI {d.analysis?.saturationIndex.calcite?.toFixed(2) ?? '—'}</span>
                <span>log pCO₂ {d.analysis?.logPco2?.toFixed(2) ?? '—'}</span>
              </span>
            </a>
          </li>
        );
      }} />
    </section>
  );
}
