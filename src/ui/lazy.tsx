// Screens other than the day list load on first use (they are precached, so this works offline).
import type { ComponentType } from 'preact';
import { useEffect, useState } from 'preact/hooks';

export function lazyScreen<P extends object>(load: () => Promise<ComponentType<P>>): ComponentType<P> {
  let cached: ComponentType<P> | null = null;
  return function Lazy(props: P) {
    const [C, setC] = useState<ComponentType<P> | null>(() => cached);
    const [error, setError] = useState('');
    useEffect(() => {
      if (C) return;
      let live = true;
      load()
        .then((c) => {
          cached = c;
          if (live) setC(() => c);
        })
        .catch((e: unknown) => live && setError(e instanceof Error ? e.message : String(e)));
      return () => {
        live = false;
      };
    }, []);
    if (error) return <p class="field-error" role="alert">This screen could not load ({error}). Reload the app.</p>;
    return C ? <C {...props} /> : <p class="muted">Opening…</p>;
  };
}
