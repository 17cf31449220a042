// Hash routes: they work from the precached shell with no server round trip.
import { useEffect, useState } from 'preact/hooks';

export const AREAS = [
  { id: 'today', label: 'Today', title: "Today's samples" },
  { id: 'new', label: 'New', title: 'New sample' },
  { id: 'sites', label: 'Sites', title: 'Sites' },
  { id: 'checks', label: 'Checks', title: 'Meter checks' },
  { id: 'send', label: 'Send', title: 'Send to office' },
  { id: 'more', label: 'More', title: 'Settings and help' },
] as const;

export const EXTRA_PAGES = [
  { id: 'settings', title: 'Settings' },
  { id: 'lab', title: 'Lab results' },
  { id: 'cautions', title: 'Cautions' },
  { id: 'about', title: 'Methods and sources' },
  { id: 'not-found', title: 'Link not found' },
] as const;

export const DETAIL_PAGES = [
  { id: 'sample', title: 'Sample', parent: 'today' },
  { id: 'site', title: 'Site', parent: 'sites' },
  { id: 'day', title: 'Day summary', parent: 'today' },
  { id: 'labels', title: 'Bottle labels', parent: 'today' },
] as const;

export type AreaId =
  | (typeof AREAS)[number]['id']
  | (typeof EXTRA_PAGES)[number]['id']
  | (typeof DETAIL_PAGES)[number]['id'];

export interface Route {
  area: AreaId;
  /** the id after the area, e.g. #/sample/<id> */
  param: string;
  /** ?date=YYYY-MM-DD and the like */
  query: URLSearchParams;
}

const ALL_IDS = new Set<string>([...AREAS, ...EXTRA_PAGES, ...DETAIL_PAGES].map((a) => a.id));

/**
 * An empty hash is today's list; a hash that names no page, or whose ID cannot be decoded
 * (`#/sample/%`), is the 'not-found' page with the link as its param (never a blank app).
 */
export function parseRoute(hash: string): Route {
  const clean = hash.replace(/^#\/?/, '');
  const [path = '', qs = ''] = clean.split('?');
  const [id = '', param = ''] = path.split('/');
  if (id === '') return { area: 'today', param: '', query: new URLSearchParams(qs) };
  if (!ALL_IDS.has(id) || id === 'not-found') return { area: 'not-found', param: hash, query: new URLSearchParams() };
  try {
    return { area: id as AreaId, param: decodeURIComponent(param), query: new URLSearchParams(qs) };
  } catch {
    return { area: 'not-found', param: hash, query: new URLSearchParams() };
  }
}

/** Just the area (kept for callers that only need it). */
export function parseHash(hash: string): AreaId {
  return parseRoute(hash).area;
}

export function useRoute(): Route {
  const [route, setRoute] = useState<Route>(() => parseRoute(location.hash));
  useEffect(() => {
    const onHash = () => setRoute(parseRoute(location.hash));
    addEventListener('hashchange', onHash);
    return () => removeEventListener('hashchange', onHash);
  }, []);
  return route;
}

export function go(hash: string): void {
  location.hash = hash;
}
