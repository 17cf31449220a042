// When the outbox drains: on app start, when the browser says it is online, when the app comes
// back to the foreground, on the service worker's background-sync message, on the button, and by
// itself while the app is open: a timer set for the next batch's due time (back-off with jitter,
// or the office's Retry-After), so a server error is retried without anyone pressing anything.
import { onChange } from '../store/connection';
import { getSettings } from '../store/records';

let timer: ReturnType<typeof setTimeout> | undefined;
let stopped = true;

async function drainNow(): Promise<void> {
  const s = await getSettings();
  if (!s.office.endpoint) return;
  const { drainOutbox } = await import('../exchange/outbox');
  await drainOutbox({ office: s.office, origin: location.origin });
}

/** Set the timer for the soonest queued batch (at least 1 s from now). */
async function schedule(run: () => void): Promise<void> {
  if (timer !== undefined) clearTimeout(timer);
  timer = undefined;
  const s = await getSettings();
  if (stopped || !s.office.endpoint) return;
  const { listOutbox, nextDueAt } = await import('../exchange/outbox');
  const next = nextDueAt(await listOutbox());
  if (next === undefined || stopped) return;
  timer = setTimeout(run, Math.min(2 ** 31 - 1, Math.max(1000, next - Date.now())));
}

export function startOutboxTriggers(): () => void {
  stopped = false;
  const run = () => void drainNow().catch(() => undefined).finally(() => void schedule(run).catch(() => undefined));
  const onVisible = () => document.visibilityState === 'visible' && run();
  const onMessage = (e: MessageEvent) => (e.data as { type?: string } | null)?.type === 'drain-outbox' && run();
  run();
  addEventListener('online', run);
  document.addEventListener('visibilitychange', onVisible);
  navigator.serviceWorker?.addEventListener('message', onMessage);
  // a batch queued or retried (here or in another tab), or a new office address: re-aim the timer
  const unChange = onChange((n) => (n.store === 'outbox' || n.store === 'settings' ? void schedule(run).catch(() => undefined) : undefined));
  return () => {
    stopped = true;
    if (timer !== undefined) clearTimeout(timer);
    unChange();
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
