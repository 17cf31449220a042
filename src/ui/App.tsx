import { useEffect, useState } from 'preact/hooks';
import { AREAS, DETAIL_PAGES, EXTRA_PAGES, useRoute, type Route } from './router';
import { Icon } from './components/Icon';
import { StatusBar } from './components/StatusBar';
import { startServiceWorker } from './sw-bridge';
import { startOutboxTriggers } from './outbox-triggers';
import { startLaunchQueue } from './launch';
import { onConnectionEvent, type ConnectionEvent } from '../store/connection';
import { TodayScreen } from './screens/Today';
import { MoreScreen } from './screens/More';
import { CautionsScreen } from './screens/Cautions';
import { lazyScreen } from './lazy';
import { NotFound } from './components/NotFound';

const SampleEditor = lazyScreen(() => import('./screens/SampleEditor').then((m) => m.SampleEditor));
const SitesScreen = lazyScreen(() => import('./screens/Sites').then((m) => m.SitesScreen));
const SiteDetail = lazyScreen(() => import('./screens/Sites').then((m) => m.SiteDetail));
const ChecksScreen = lazyScreen(() => import('./screens/Checks').then((m) => m.ChecksScreen));
const SendScreen = lazyScreen(() => import('./screens/Send').then((m) => m.SendScreen));
const SettingsScreen = lazyScreen(() => import('./screens/Settings').then((m) => m.SettingsScreen));
const LabImport = lazyScreen(() => import('./screens/LabImport').then((m) => m.LabImport));
const DaySummary = lazyScreen(() => import('./day/DaySummary').then((m) => m.DaySummary));
const LabelsScreen = lazyScreen(() => import('./day/Labels').then((m) => m.LabelsScreen));
const AboutScreen = lazyScreen(() => import('./screens/About').then((m) => m.AboutScreen));

function titleOf(route: Route): string {
  const all = [...AREAS, ...EXTRA_PAGES, ...DETAIL_PAGES] as ReadonlyArray<{ id: string; title: string }>;
  if (route.area === 'sample') return 'Sample';
  return all.find((a) => a.id === route.area)?.title ?? 'Bankside';
}

function Screen({ route }: { route: Route }) {
  switch (route.area) {
    case 'today': return <TodayScreen route={route} />;
    case 'new': return <SampleEditor key={`new:${route.query.get('site') ?? ''}`} siteId={route.query.get('site') ?? undefined} />;
    case 'sample': return <SampleEditor key={route.param} sampleId={route.param} />;
    case 'sites': return <SitesScreen />;
    case 'site': return <SiteDetail siteId={route.param} />;
    case 'checks': return <ChecksScreen />;
    case 'send': return <SendScreen />;
    case 'more': return <MoreScreen />;
    case 'settings': return <SettingsScreen />;
    case 'lab': return <LabImport />;
    case 'day': return <DaySummary route={route} />;
    case 'labels': return <LabelsScreen route={route} />;
    case 'cautions': return <CautionsScreen />;
    case 'about': return <AboutScreen />;
    case 'not-found': return <NotFound what="This link does not lead to a page of Bankside." detail={`The link “${route.param}” is malformed or incomplete.`} />;
  }
}

const CONNECTION_WORDS: Record<ConnectionEvent, string> = {
  blocking: 'Bankside was updated in another tab. Your entry here was saved. Reload this tab to continue.',
  blocked: 'Another Bankside tab is still open with an older version. Close it (your entry there is saved) to continue here.',
  terminated: 'The browser closed Bankside’s storage. Reload to continue; your saved entries are kept.',
};

export function App() {
  const route = useRoute();
  const [conn, setConn] = useState<ConnectionEvent | null>(null);
  useEffect(() => {
    startServiceWorker();
    startLaunchQueue();
    const stopTriggers = startOutboxTriggers();
    const stopConn = onConnectionEvent(setConn);
    return () => {
      stopTriggers();
      stopConn();
    };
  }, []);
  useEffect(() => {
    document.title = `${titleOf(route)} · Bankside`;
  }, [route.area]);
  const detailParent = DETAIL_PAGES.find((p) => p.id === route.area)?.parent;
  const activeArea = EXTRA_PAGES.some((p) => p.id === route.area) ? 'more' : detailParent ?? route.area;
  return (
    <div class="shell">
      <header class="topbar">
        <div class="brand">
          <img src={`${import.meta.env.BASE_URL}icons/icon-192.png`} alt="" width="32" height="32" />
          <span class="brand-name">Bankside</span>
        </div>
        <StatusBar />
      </header>
      {conn && (
        <div class="notice warn conn" role="alert">
          {CONNECTION_WORDS[conn]} <button type="button" class="btn btn-small" onClick={() => location.reload()}>Reload</button>
        </div>
      )}
      <main id="main" tabIndex={-1}>
        <h1>{titleOf(route)}</h1>
        <Screen route={route} />
      </main>
      <nav class="tabs" aria-label="Main areas">
        {AREAS.map((a) => (
          <a key={a.id} href={`#/${a.id}`} class={a.id === activeArea ? 'tab active' : 'tab'} aria-current={a.id === activeArea ? 'page' : undefined}>
            <Icon name={a.id} />
            <span>{a.label}</span>
          </a>
        ))}
      </nav>
    </div>
  );
}
