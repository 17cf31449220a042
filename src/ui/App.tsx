import { useEffect } from 'preact/hooks';
import { AREAS, EXTRA_PAGES, useRoute, type AreaId } from './router';
import { Icon } from './components/Icon';
import { StatusBar } from './components/StatusBar';
import { startServiceWorker } from './sw-bridge';
import { TodayScreen } from './screens/Today';
import { NewSampleScreen } from './screens/NewSample';
import { SitesScreen } from './screens/Sites';
import { ChecksScreen } from './screens/Checks';
import { SendScreen } from './screens/Send';
import { MoreScreen } from './screens/More';
import { SettingsScreen } from './screens/Settings';
import { CautionsScreen } from './screens/Cautions';
import { AboutScreen } from './screens/About';

const SCREENS: Record<AreaId, () => preact.JSX.Element> = {
  today: TodayScreen,
  new: NewSampleScreen,
  sites: SitesScreen,
  checks: ChecksScreen,
  send: SendScreen,
  more: MoreScreen,
  settings: SettingsScreen,
  cautions: CautionsScreen,
  about: AboutScreen,
};

function titleOf(route: AreaId): string {
  return (
    AREAS.find((a) => a.id === route)?.title ?? EXTRA_PAGES.find((p) => p.id === route)?.title ?? 'Bankside'
  );
}

export function App() {
  const route = useRoute();
  useEffect(() => {
    startServiceWorker();
  }, []);
  useEffect(() => {
    document.title = `${titleOf(route)} · Bankside`;
  }, [route]);
  const Screen = SCREENS[route];
  const activeArea = EXTRA_PAGES.some((p) => p.id === route) ? 'more' : route;
  return (
    <div class="shell">
      <header class="topbar">
        <div class="brand">
          <img src="/icons/icon-192.png" alt="" width="32" height="32" />
          <span>Bankside</span>
        </div>
        <StatusBar />
      </header>
      <main id="main" tabIndex={-1}>
        <h1>{titleOf(route)}</h1>
        <Screen />
      </main>
      <nav class="tabs" aria-label="Main areas">
        {AREAS.map((a) => (
          <a
            key={a.id}
            href={`#/${a.id}`}
            class={a.id === activeArea ? 'tab active' : 'tab'}
            aria-current={a.id === activeArea ? 'page' : undefined}
          >
            <Icon name={a.id} />
            <span>{a.label}</span>
          </a>
        ))}
      </nav>
    </div>
  );
}
