// The page's only contact with the service worker: register it, report "ready
// offline", and apply an update only after every open entry has been saved.
import { registerSW } from 'virtual:pwa-register';

export type OfflineState = 'checking' | 'ready' | 'unsupported' | 'error';

type Listener = () => void;

/** Functions that save whatever the crew is typing; all run before an update reloads the page. */
const savers = new Set<() => Promise<void>>();
const listeners = new Set<Listener>();

export const swState = {
  offline: 'checking' as OfflineState,
  updateWaiting: false,
  errorMessage: '',
};

let updateFn: ((reload?: boolean) => Promise<void>) | null = null;

function emit(): void {
  for (const l of listeners) l();
}

export function subscribeSw(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

/** Register a function that saves unsaved input; returns an unregister function. */
export function registerDraftSaver(save: () => Promise<void>): () => void {
  savers.add(save);
  return () => savers.delete(save);
}

export function startServiceWorker(): void {
  if (!('serviceWorker' in navigator)) {
    swState.offline = 'unsupported';
    emit();
    return;
  }
  // A page already controlled by our worker works offline now.
  if (navigator.serviceWorker.controller) swState.offline = 'ready';
  updateFn = registerSW({
    immediate: true,
    onOfflineReady() {
      swState.offline = 'ready';
      emit();
    },
    onNeedRefresh() {
      swState.updateWaiting = true;
      emit();
    },
    onRegisteredSW(_url, registration) {
      if (registration?.active) swState.offline = 'ready';
      emit();
    },
    onRegisterError(error: unknown) {
      swState.offline = 'error';
      swState.errorMessage = error instanceof Error ? error.message : String(error);
      emit();
    },
  });
  emit();
}

/**
 * Save every open entry, then let the waiting worker take over and reload.
 * If a save fails, the update is not applied and the error is returned, so the
 * crew keeps what they typed on screen.
 */
export async function applyUpdate(): Promise<{ ok: true } | { ok: false; reason: string }> {
  try {
    for (const save of savers) await save();
  } catch (e) {
    return { ok: false, reason: e instanceof Error ? e.message : String(e) };
  }
  if (updateFn) await updateFn(true);
  return { ok: true };
}
