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
  { id: 'cautions', title: 'Cautions' },
  { id: 'about', title: 'Methods and sources' },
] as const;

export type AreaId = (typeof AREAS)[number]['id'] | (typeof EXTRA_PAGES)[number]['id'];

const ALL_IDS = new Set<string>([...AREAS.map((a) => a.id), ...EXTRA_PAGES.map((p) => p.id)]);

export function parseHash(hash: string): AreaId {
  const id = hash.replace(/^#\/?/, '').split(/[/?]/)[0] ?? '';
  return (ALL_IDS.has(id) ? id : 'today') as AreaId;
}

export function useRoute(): AreaId {
  const [route, setRoute] = useState<AreaId>(() => parseHash(location.hash));
  useEffect(() => {
    const onHash = () => setRoute(parseHash(location.hash));
    addEventListener('hashchange', onHash);
    return () => removeEventListener('hashchange', onHash);
  }, []);
  return route;
}
