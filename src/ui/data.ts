// Small hooks that read the store and stay fresh when records change (in this tab or another).
import { useCallback, useEffect, useState } from 'preact/hooks';
import { onChange } from '../store/connection';
import { getActiveProfile, getSettings, profileLookup } from '../store/records';
import { DEFAULT_PROFILE, type MethodProfile } from '../chemistry';
import { DEFAULT_SETTINGS } from '../records/defaults';
import type { Settings } from '../records/schema';

export function useLive<T>(load: () => Promise<T>, deps: unknown[], stores: string[]): { data: T | undefined; error: string; reload: () => void } {
  const [data, setData] = useState<T | undefined>(undefined);
  const [error, setError] = useState('');
  const [tick, setTick] = useState(0);
  const reload = useCallback(() => setTick((n) => n + 1), []);
  useEffect(() => {
    let live = true;
    load()
      .then((d) => {
        if (live) {
          setData(d);
          setError('');
        }
      })
      .catch((e: unknown) => live && setError(e instanceof Error ? e.message : String(e)));
    return () => {
      live = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [...deps, tick]);
  useEffect(() => onChange((n) => (stores.includes(n.store) ? reload() : undefined)), [stores.join(','), reload]);
  return { data, error, reload };
}

export function useSettings(): Settings {
  return useSettingsState().settings;
}

/** The settings, and whether they have been read yet (until then the defaults stand in). */
export function useSettingsState(): { settings: Settings; loaded: boolean } {
  const { data } = useLive(getSettings, [], ['settings']);
  return { settings: data ?? DEFAULT_SETTINGS, loaded: data !== undefined };
}

/** The method profile chosen in Settings (its newest version). */
export function useProfile(): MethodProfile {
  const settings = useSettings();
  const { data } = useLive(() => getActiveProfile(settings.profileId), [settings.profileId], ['profiles', 'settings']);
  return data ?? DEFAULT_PROFILE;
}

/**
 * The profile each record was judged under (its own id and version), falling back to the active
 * profile only for a version this phone does not hold. Editing the profile never re-judges old records.
 */
export function useProfileOf(): (ref: { profileId: string; profileVersion: number }) => MethodProfile {
  const active = useProfile();
  const { data } = useLive(profileLookup, [], ['profiles']);
  return useCallback((ref) => data?.(ref) ?? active, [data, active]);
}
