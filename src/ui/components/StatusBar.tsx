import { useEffect, useState } from 'preact/hooks';
import { applyUpdate, subscribeSw, swState } from '../sw-bridge';
import { Icon } from './Icon';

/** Shows whether the app will open with no signal, and offers a waiting update. */
export function StatusBar() {
  const [, force] = useState(0);
  const [online, setOnline] = useState(navigator.onLine);
  const [updateError, setUpdateError] = useState('');
  useEffect(() => {
    const unsub = subscribeSw(() => force((n) => n + 1));
    const on = () => setOnline(true);
    const off = () => setOnline(false);
    addEventListener('online', on);
    addEventListener('offline', off);
    return () => {
      unsub();
      removeEventListener('online', on);
      removeEventListener('offline', off);
    };
  }, []);

  const offlineText =
    swState.offline === 'ready'
      ? 'Ready offline'
      : swState.offline === 'checking'
        ? 'Preparing offline…'
        : swState.offline === 'unsupported'
          ? 'This browser cannot work offline'
          : 'Offline setup failed: keep signal and reload';

  return (
    <div class="status" role="status" aria-live="polite">
      <span class={`chip chip-${swState.offline}`} data-testid="offline-state">
        <Icon name={swState.offline === 'ready' ? 'offline' : swState.offline === 'checking' ? 'waiting' : 'warn'} size={16} />
        <span class="chip-text">{offlineText}</span>
      </span>
      <span class="chip chip-net">
        <Icon name={online ? 'signal' : 'no-signal'} size={16} />
        <span class="chip-text">{online ? 'Signal' : 'No signal'}</span>
      </span>
      {swState.updateWaiting && (
        <div class="update-notice">
          <span>A new version of Bankside is ready. Your open entry is saved before it loads.</span>
          <button
            type="button"
            class="btn btn-small"
            onClick={async () => {
              const r = await applyUpdate();
              if (!r.ok) setUpdateError(`Not updated: your entry could not be saved (${r.reason}).`);
            }}
          >
            Update now
          </button>
          {updateError && <p class="field-error">{updateError}</p>}
        </div>
      )}
    </div>
  );
}
