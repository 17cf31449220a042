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

function write(crew: string, open: Record<string, boolean>): void {
  try {
    localStorage.setItem(KEY(crew), JSON.stringify(open));
  } catch {
    /* private mode or full storage: the section simply is not remembered */
  }
}

/**
 * `crew` is null while Settings are still being read: taps in that moment are kept in memory and
 * written for the crew once it is known, so an early tap is never lost.
 */
export function useFolds(crew: string | null): { isOpen(id: string, fallback?: boolean): boolean; set(id: string, open: boolean): void } {
  const [state, setState] = useState<{ crew: string | null; open: Record<string, boolean>; early: Record<string, boolean> }>(() => ({ crew, open: crew === null ? {} : read(crew), early: {} }));
  let cur = state;
  if (state.crew !== crew) {
    const open = crew === null ? {} : { ...read(crew), ...state.early };
    if (crew !== null && Object.keys(state.early).length) write(crew, open);
    cur = { crew, open, early: {} };
    setState(cur);
  }
  return {
    isOpen: (id, fallback = false) => cur.open[id] ?? fallback,
    set: (id, open) => {
      if ((cur.open[id] ?? false) === open && cur.open[id] !== undefined) return;
      const next = { ...cur.open, [id]: open };
      if (cur.crew === null) setState({ ...cur, open: next, early: { ...cur.early, [id]: open } });
      else {
        setState({ ...cur, open: next });
        write(cur.crew, next);
      }
    },
  };
}
