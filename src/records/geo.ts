// Distances between positions on the phone (no chemistry, no storage).

/** Mean Earth radius, m (IUGG R1 = 6,371,008.8 m; read). */
const EARTH_RADIUS_M = 6_371_008.8;

/**
 * Great-circle distance in metres between two WGS84 positions in degrees (haversine formula on a
 * sphere; within about 0.5 % of the ellipsoidal distance, far below a phone fix's accuracy).
 */
export function distanceM(lat1: number, lon1: number, lat2: number, lon2: number): number {
  const rad = Math.PI / 180;
  const dLat = (lat2 - lat1) * rad;
  const dLon = (lon2 - lon1) * rad;
  const h = Math.sin(dLat / 2) ** 2 + Math.cos(lat1 * rad) * Math.cos(lat2 * rad) * Math.sin(dLon / 2) ** 2;
  return 2 * EARTH_RADIUS_M * Math.asin(Math.min(1, Math.sqrt(h)));
}

export interface Fix {
  latitude: number;
  longitude: number;
  /** the fix's horizontal accuracy, m (68 % radius as browsers report it) */
  accuracyM: number;
}

export interface Located<T> {
  site: T;
  distanceM: number;
  /** the distance lies within the fix's accuracy plus the site's own (when known) */
  within: boolean;
}

/**
 * The nearest site with a WGS84 position, and whether the crew stands at it: the distance is no more
 * than the fix's accuracy plus the site's recorded accuracy. Sites in another datum are skipped
 * (their coordinates are not comparable without a transformation).
 */
export function nearestSite<T extends { latitude?: number | undefined; longitude?: number | undefined; accuracyM?: number | undefined; datum: string }>(
  fix: Fix,
  sites: T[],
): Located<T> | undefined {
  let best: Located<T> | undefined;
  for (const site of sites) {
    if (site.latitude === undefined || site.longitude === undefined || !/^WGS ?84$/i.test(site.datum)) continue;
    const d = distanceM(fix.latitude, fix.longitude, site.latitude, site.longitude);
    if (!best || d < best.distanceM) best = { site, distanceM: d, within: d <= fix.accuracyM + (site.accuracyM ?? 0) };
  }
  return best;
}
