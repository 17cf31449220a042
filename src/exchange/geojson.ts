// Sites and samples as GeoJSON (RFC 7946): WGS84 longitude/latitude. A WGS84 position maps as is;
// a NAD83 position maps when its stated accuracy is coarser than the NAD83–WGS84 shift; any other
// datum (or NAD83 finer than the shift) gets a null geometry and a `no_geometry_reason`. The datum
// is kept as a property either way. Numbers are rounded by the export rules (rounding.ts).
import { derivedFor } from '../records/derived-cache';
import type { Sample, Settings, Site } from '../records/schema';
import { rounded } from './rounding';

type Geometry = { type: 'Point'; coordinates: [number, number] } | null;

/**
 * NAD83 (as realised in North America) and WGS84 (G1762) differ by about 1–2 m across the
 * continental US (NOAA NGS, from memory): within that, NAD83 coordinates are WGS84 coordinates.
 */
export const NAD83_WGS84_SHIFT_M = 2;

const WGS84 = /^(WGS ?-?84|EPSG:4326)$/i;
const NAD83 = /^(NAD ?-?83( ?\(.*\))?|EPSG:4269)$/i;

/** Where a site goes on a WGS84 map, or why it does not. */
export function sitePoint(site: Site | undefined): { geometry: Geometry; reason?: string } {
  if (!site || site.latitude === undefined || site.longitude === undefined) return { geometry: null, reason: 'no position recorded' };
  const point: Geometry = { type: 'Point', coordinates: [rounded('latLon', site.longitude)!, rounded('latLon', site.latitude)!] };
  const datum = site.datum.trim();
  if (WGS84.test(datum)) return { geometry: point };
  if (NAD83.test(datum)) {
    if (site.accuracyM !== undefined && site.accuracyM >= NAD83_WGS84_SHIFT_M) return { geometry: point };
    return {
      geometry: null,
      reason: site.accuracyM === undefined
        ? `NAD83 position without a stated accuracy: the NAD83–WGS84 shift (up to ${NAD83_WGS84_SHIFT_M} m) may matter; state the accuracy or convert to WGS84`
        : `NAD83 position stated to ${site.accuracyM} m, finer than the NAD83–WGS84 shift (up to ${NAD83_WGS84_SHIFT_M} m); convert to WGS84`,
    };
  }
  return { geometry: null, reason: `datum ${datum || 'unknown'} is not WGS84-compatible; convert to WGS84 before mapping` };
}

/** A feature at a site's point, with the reason when it has none. */
function feature(id: string, site: Site | undefined, properties: Record<string, unknown>) {
  const p = sitePoint(site);
  return { type: 'Feature', id, geometry: p.geometry, properties: p.reason ? { ...properties, no_geometry_reason: p.reason } : properties };
}

export function sitesGeoJson(sites: Site[]): string {
  return JSON.stringify({
    type: 'FeatureCollection',
    features: sites.map((s) =>
      feature(s.id, s, { code: s.code, name: s.name, site_type: s.type, datum: s.datum, accuracy_m: rounded('metres', s.accuracyM) ?? null, elevation_m: rounded('metres', s.elevationM) ?? null, run_order: s.runOrder ?? null, demo: s.demo ?? false }),
    ),
  });
}

export function samplesGeoJson(samples: Sample[], sites: Site[], settings: Pick<Settings, 'activityModel' | 'conductanceFactor'>): string {
  const byId = new Map(sites.map((s) => [s.id, s]));
  return JSON.stringify({
    type: 'FeatureCollection',
    features: samples.map((s) => {
      const d = derivedFor(s, settings);
      const a = d.analysis;
      const site = byId.get(s.siteId);
      return feature(s.id, site, {
        sample_code: s.sampleCode ?? null,
        site_code: site?.code ?? null,
        datum: site?.datum ?? null,
        time_local: s.time,
        time_zone: s.timeZone ?? null,
        qc_type: s.qc.type,
        water_temp_degC: rounded('temperature', d.input.tempC) ?? null,
        ph: rounded('pH', d.input.pH) ?? null,
        sc_uS_cm_25C: rounded('conductance', d.input.scUsPerCm) ?? null,
        si_calcite: rounded('index', a?.saturationIndex.calcite) ?? null,
        si_calcite_band_95pct: rounded('uncertainty', a?.calciteSiUncertainty) ?? null,
        calcite_state: a?.calciteState ?? 'unknown',
        log_pco2_atm: rounded('index', a?.logPco2) ?? null,
        engine_version: d.engineVersion,
      });
    }),
  });
}
