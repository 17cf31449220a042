// Long lists render only what is on screen: a fixed-row-height window over the page's own scroll.
// Rows above and below the window are stood in for by two spacers of the right height, so the
// scrollbar, keyboard scrolling and "find in page" of the visible part behave as in a full list.
// Used by the day view and the site page; restyle the rows freely, but keep each row exactly
// `rowHeight` px tall (the component sets it) or the window drifts.
import { cloneElement, type JSX } from 'preact';
import { useEffect, useLayoutEffect, useRef, useState } from 'preact/hooks';

/** Which rows [start, end) to render for a list whose top is `listTop` px below the viewport's top. */
export function visibleRange(count: number, rowHeight: number, listTop: number, viewportHeight: number, overscan: number): [number, number] {
  if (count === 0) return [0, 0];
  const first = Math.floor(-listTop / rowHeight);
  const last = Math.ceil((viewportHeight - listTop) / rowHeight);
  const start = Math.max(0, Math.min(count, first - overscan));
  const end = Math.max(start, Math.min(count, last + overscan));
  return [start, end];
}

interface WindowedProps<T> {
  items: T[];
  rowHeight: number;
  /** one row; it must be a single element of the list's row type (li for ul, tr for tbody) */
  row: (item: T, index: number) => JSX.Element;
  /** 'ul' (a list of cards) or 'tbody' (inside a table) */
  as?: 'ul' | 'tbody';
  class?: string;
  'aria-label'?: string;
  overscan?: number;
  /** rows rendered before the first layout (the first screen on a small phone) */
  initialRows?: number;
  /** lists up to this long render in full, each row its natural height */
  windowFrom?: number;
}

export function Windowed<T>({ items, rowHeight, row, as = 'ul', overscan = 8, initialRows = 20, windowFrom = 0, ...rest }: WindowedProps<T>) {
  const windowed = items.length > windowFrom;
  const ref = useRef<HTMLElement>(null);
  const [range, setRange] = useState<[number, number]>([0, Math.min(items.length, initialRows)]);
  const measure = () => {
    const el = ref.current;
    if (!el || !windowed) return;
    const next = visibleRange(items.length, rowHeight, el.getBoundingClientRect().top, window.innerHeight, overscan);
    setRange((r) => (r[0] === next[0] && r[1] === next[1] ? r : next));
  };
  useLayoutEffect(measure, [items.length, rowHeight]);
  useEffect(() => {
    let frame = 0;
    const onScroll = () => {
      if (!frame) frame = requestAnimationFrame(() => { frame = 0; measure(); });
    };
    window.addEventListener('scroll', onScroll, { passive: true });
    window.addEventListener('resize', onScroll);
    return () => {
      window.removeEventListener('scroll', onScroll);
      window.removeEventListener('resize', onScroll);
      cancelAnimationFrame(frame);
    };
  }, [items.length, rowHeight]);
  if (!windowed) {
    const all = items.map((it, i) => row(it, i));
    return as === 'tbody' ? <tbody class={rest.class} aria-label={rest['aria-label']}>{all}</tbody> : <ul class={rest.class} aria-label={rest['aria-label']}>{all}</ul>;
  }
  const [start, end] = range;
  const top = start * rowHeight;
  const bottom = Math.max(0, (items.length - end) * rowHeight);
  const rows = items.slice(start, end).map((it, i) => {
    const el = row(it, start + i);
    return cloneElement(el, { class: `${(el.props as { class?: string }).class ?? ''} window-row`.trim(), style: { height: `${rowHeight}px` } });
  });
  const cls = `${rest.class ?? ''} windowed`.trim();
  if (as === 'tbody') {
    return (
      <tbody ref={ref as never} class={cls} aria-label={rest['aria-label']}>
        {top > 0 && <tr aria-hidden="true" class="window-spacer" style={{ height: `${top}px` }} />}
        {rows}
        {bottom > 0 && <tr aria-hidden="true" class="window-spacer" style={{ height: `${bottom}px` }} />}
      </tbody>
    );
  }
  return (
    <ul ref={ref as never} class={cls} aria-label={rest['aria-label']} style={{ paddingTop: `${top}px`, paddingBottom: `${bottom}px` }}>
      {rows}
    </ul>
  );
}
