// Sites and samples as GeoJSON (RFC 7946): WGS84 longitude/latitude. A site recorded in another
// datum gets a null geometry (RFC 7946 allows only WGS84) and keeps its datum in properties.
import { derivedFor } from '../records/derived-cache';
import type { Sample, Settings, Site } from '../records/schema';

type Geometry = { type: 'Point'; coordinates: [number, number] } | null;

function pointOf(site: Site | undefined): Geometry {
  if (!site || site.latitude === undefined || site.longitude === undefined) return null;
  if (!/^WGS ?84$/i.test(site.datum)) return null;
  return { type: 'Point', coordinates: [site.longitude, site.latitude] };
}

export function sitesGeoJson(sites: Site[]): string {
  return JSON.stringify({
    type: 'FeatureCollection',
    features: sites.map((s) => ({
      type: 'Feature',
      id: s.id,
      geometry: pointOf(s),
      properties: { code: s.code, name: s.name, site_type: s.type, datum: s.datum, accuracy_m: s.accuracyM ?? null, elevation_m: s.elevationM ?? null, run_order: s.runOrder ?? null, demo: s.demo ?? false },
    })),
  });
}

export function samplesGeoJson(samples: Sample[], sites: Site[], settings: Pick<Settings, 'activityModel' | 'conductanceFactor'>): string {
  const byId = new Map(sites.map((s) => [s.id, s]));
  return JSON.stringify({
    type: 'FeatureCollection',
    features: samples.map((s) => {
      const d = derivedFor(s, settings);
      const a = d.analysis;
      return {
        type: 'Feature',
        id: s.id,
        geometry: pointOf(byId.get(s.siteId)),
        properties: {
          sample_code: s.sampleCode ?? null,
          site_code: byId.get(s.siteId)?.code ?? null,
          time_local: s.time,
          qc_type: s.qc.type,
          water_temp_degC: Number.isFinite(d.input.tempC) ? d.input.tempC : null,
          ph: d.input.pH ?? null,
          sc_uS_cm_25C: d.input.scUsPerCm ?? null,
          si_calcite: a?.saturationIndex.calcite ?? null,
          si_calcite_band_95pct: a?.calciteSiUncertainty ?? null,
          calcite_state: a?.calciteState ?? 'unknown',
          log_pco2_atm: a?.logPco2 ?? null,
          engine_version: d.engineVersion,
        },
      };
    }),
  });
}
