/// <reference lib="webworker" />
// Service worker entry: listeners only. What is cached is decided at build time
// (vite-plugin-pwa injects the precache manifest into self.__WB_MANIFEST).
import { cleanupOutdatedCaches, precacheAndRoute, createHandlerBoundToURL } from 'workbox-precaching';
import { NavigationRoute, registerRoute } from 'workbox-routing';

declare const self: ServiceWorkerGlobalScope & { __WB_MANIFEST: Array<{ url: string; revision: string | null }> };

precacheAndRoute(self.__WB_MANIFEST);
cleanupOutdatedCaches();

// Every navigation (deep links such as /#/sites or a reload at the bank) is answered
// with the precached shell, so the app opens with no network at all.
registerRoute(new NavigationRoute(createHandlerBoundToURL('index.html')));

// The page asks before we take over: 'prompt' registration. A new version waits
// until the page has saved its draft and sends SKIP_WAITING.
self.addEventListener('message', (event) => {
  if (event.data && (event.data as { type?: string }).type === 'SKIP_WAITING') {
    void self.skipWaiting();
  }
});

// Background sync (Chromium): wake the open app to drain its upload outbox. The outbox lives in
// IndexedDB and is also drained on start, on 'online' and when the app returns to the foreground.
self.addEventListener('sync', (event) => {
  const e = event as ExtendableEvent & { tag?: string };
  if (e.tag !== 'bankside-outbox') return;
  e.waitUntil(
    self.clients.matchAll({ type: 'window' }).then((clients) => {
      for (const c of clients) c.postMessage({ type: 'drain-outbox' });
    }),
  );
});
