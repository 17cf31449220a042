// When the outbox drains: on app start, when the browser says it is online, when the app comes
// back to the foreground, on the service worker's background-sync message, and on the button.
import { getSettings } from '../store/records';

async function drainNow(): Promise<void> {
  const s = await getSettings();
  if (!s.office.endpoint) return;
  const { drainOutbox } = await import('../exchange/outbox');
  await drainOutbox({ office: s.office });
}

export function startOutboxTriggers(): () => void {
  const run = () => void drainNow().catch(() => undefined);
  const onVisible = () => document.visibilityState === 'visible' && run();
  const onMessage = (e: MessageEvent) => (e.data as { type?: string } | null)?.type === 'drain-outbox' && run();
  run();
  addEventListener('online', run);
  document.addEventListener('visibilitychange', onVisible);
  navigator.serviceWorker?.addEventListener('message', onMessage);
  return () => {
    removeEventListener('online', run);
    document.removeEventListener('visibilitychange', onVisible);
    navigator.serviceWorker?.removeEventListener('message', onMessage);
  };
}

/** Ask for a background sync where the browser has one (Chromium); elsewhere the triggers above do. */
export async function requestBackgroundSync(): Promise<void> {
  const reg = await navigator.serviceWorker?.getRegistration();
  const sync = (reg as (ServiceWorkerRegistration & { sync?: { register(tag: string): Promise<void> } }) | undefined)?.sync;
  if (sync) await sync.register('bankside-outbox').catch(() => undefined);
}
