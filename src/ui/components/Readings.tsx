import type { StabilizationResult } from '../../chemistry';
import type { TimedRaw } from '../forms/sample-form';
import { isoWithOffset } from '../../records/time';
import { TextField } from './Field';
import { Icon } from './Icon';

interface Props {
  id: string;
  label: string;
  unit: string;
  rows: TimedRaw[];
  errors: Record<string, string>;
  errorKey: string;
  stability?: StabilizationResult | undefined;
  onChange: (rows: TimedRaw[]) => void;
  /** the first reading is typed elsewhere (the core row of the sample screen) */
  fromSecond?: boolean;
}

/** Repeated readings of one parameter: each value keeps the time it was typed; the verdict says when to stop. */
export function RepeatedReadings(p: Props) {
  const set = (i: number, v: string) => {
    const rows = p.rows.map((r, k) => (k === i ? { v, t: r.t || (v.trim() ? isoWithOffset() : '') } : r));
    p.onChange(rows);
  };
  const st = p.stability;
  const multi = p.rows.length > 1;
  const first = p.fromSecond ? 1 : 0;
  return (
    <div class="readings">
      <h3 class="readings-title">{p.label}</h3>
      {p.rows.map((r, i) =>
        i < first ? null : (
          <TextField
            key={i}
            id={`${p.id}-${i}`}
            label={multi || p.fromSecond ? `${p.label} (reading ${i + 1})` : p.label}
            unit={p.unit}
            numeric
            value={r.v}
            error={p.errors[`${p.errorKey}.${i}`]}
            onInput={(v) => set(i, v)}
          />
        ),
      )}
      <div class="readings-foot">
        <button type="button" class="btn btn-small" onClick={() => p.onChange([...p.rows, { v: '', t: '' }])}>
          <Icon name="plus" /> Add reading<span class="sr-only"> of {p.label}</span>
        </button>
        {st && st.window.length > 1 && (
          <p class={st.stable ? 'stable yes' : 'stable no'} data-testid={`${p.id}-stability`}>
            <Icon name={st.stable ? 'check' : 'waiting'} size={20} /> {st.stable ? `Stable: report ${st.median}` : st.reason}
          </p>
        )}
      </div>
    </div>
  );
}
