// Which optional sections of the sample screen are open, remembered per crew (the operator's
// name in Settings) on this phone: a crew that always titrates finds its titration points open.
// A screen preference, not a record: it lives in localStorage and is never exported.
import { useState } from 'preact/hooks';

const KEY = (crew: string) => `bankside:folds:${crew.trim().toLowerCase() || 'anyone'}`;

function read(crew: string): Record<string, boolean> {
  try {
    const raw = localStorage.getItem(KEY(crew));
    const v = raw ? (JSON.parse(raw) as unknown) : {};
    return v && typeof v === 'object' ? (v as Record<string, boolean>) : {};
  } catch {
    return {};
  }
}

export function useFolds(crew: string): { isOpen(id: string, fallback?: boolean): boolean; set(id: string, open: boolean): void } {
  const [state, setState] = useState<{ crew: string; open: Record<string, boolean> }>(() => ({ crew, open: read(crew) }));
  const cur = state.crew === crew ? state.open : read(crew);
  if (state.crew !== crew) setState({ crew, open: cur });
  return {
    isOpen: (id, fallback = false) => cur[id] ?? fallback,
    set: (id, open) => {
      if ((cur[id] ?? false) === open) return;
      const next = { ...cur, [id]: open };
      setState({ crew, open: next });
      try {
        localStorage.setItem(KEY(crew), JSON.stringify(next));
      } catch {
        /* private mode or full storage: the section simply is not remembered */
      }
    },
  };
}
