import { useState } from 'preact/hooks';
import { nearestSite, type Fix, type Located } from '../../records/geo';
import type { Sample, Site } from '../../records/schema';

/** The first site in run order with no sample yet on this day (undefined when the run is done or has no order). */
export function nextInRunOrder(sites: Site[], daySamples: Sample[]): { site: Site; position: number; total: number } | undefined {
  const run = sites.filter((s) => s.runOrder !== undefined).sort((a, b) => a.runOrder! - b.runOrder! || a.code.localeCompare(b.code));
  const visited = new Set(daySamples.map((s) => s.siteId));
  const i = run.findIndex((s) => !visited.has(s.id));
  return i < 0 ? undefined : { site: run[i]!, position: i + 1, total: run.length };
}

/** A fresh fix only: a position a few seconds old could be the previous site's. */
const FIX_OPTIONS: PositionOptions = { enableHighAccuracy: true, timeout: 60_000, maximumAge: 5_000 };

/** The day's way through its sites: the next site in run order, and the known site the crew stands at. */
export function DayGuide({ sites, daySamples, isToday }: { sites: Site[]; daySamples: Sample[]; isToday: boolean }) {
  const [fix, setFix] = useState<Fix | null>(null);
  const [found, setFound] = useState<Located<Site> | undefined>(undefined);
  const [status, setStatus] = useState('');
  const next = nextInRunOrder(sites, daySamples);
  const locate = () => {
    if (!('geolocation' in navigator)) return setStatus('This device gives no position.');
    setStatus('Finding your position… (works without signal, may take a minute)');
    navigator.geolocation.getCurrentPosition(
      (p) => {
        const f = { latitude: p.coords.latitude, longitude: p.coords.longitude, accuracyM: p.coords.accuracy };
        setFix(f);
        setFound(nearestSite(f, sites));
        setStatus('');
      },
      (e) => setStatus(`No position: ${e.message}.`),
      FIX_OPTIONS,
    );
  };
  if (!isToday || sites.length === 0) return null;
  return (
    <div class="day-guide">
      {next && (
        <p class="next-site">
          <span>Next in run order ({next.position} of {next.total}): <strong>{next.site.code}</strong> {next.site.name}</span>
          <a class="btn btn-small" href={`#/new?site=${encodeURIComponent(next.site.id)}`}>Sample {next.site.code}</a>
        </p>
      )}
      <button type="button" class="btn btn-small" onClick={locate}>Which site am I at?</button>
      {status && <p class="hint" role="status">{status}</p>}
      {fix && (
        <p class="notice" role="status">
          {!found ? (
            <>No site on this phone has a WGS84 position to compare with.</>
          ) : found.within ? (
            <>
              You are at <strong>{found.site.code}</strong> {found.site.name} ({Math.round(found.distanceM)} m away, fix ±{Math.round(fix.accuracyM)} m).{' '}
              <a class="btn btn-small" href={`#/new?site=${encodeURIComponent(found.site.id)}`}>Sample {found.site.code}</a>
            </>
          ) : (
            <>
              No known site within your fix's accuracy (±{Math.round(fix.accuracyM)} m). The nearest is {found.site.code} {found.site.name},{' '}
              {found.distanceM < 2000 ? `${Math.round(found.distanceM)} m` : `${(found.distanceM / 1000).toFixed(1)} km`} away.
            </>
          )}
        </p>
      )}
    </div>
  );
}
