import type { StabilizationResult } from '../../chemistry';
import type { TimedRaw } from '../forms/sample-form';
import { isoWithOffset } from '../../records/time';
import { TextField } from './Field';

interface Props {
  id: string;
  label: string;
  unit: string;
  rows: TimedRaw[];
  errors: Record<string, string>;
  errorKey: string;
  stability?: StabilizationResult | undefined;
  onChange: (rows: TimedRaw[]) => void;
}

/** Repeated readings of one parameter: each value keeps the time it was typed; the verdict says when to stop. */
export function RepeatedReadings(p: Props) {
  const set = (i: number, v: string) => {
    const rows = p.rows.map((r, k) => (k === i ? { v, t: r.t || (v.trim() ? isoWithOffset() : '') } : r));
    p.onChange(rows);
  };
  const st = p.stability;
  const multi = p.rows.length > 1;
  return (
    <div class="readings">
      {p.rows.map((r, i) => (
        <TextField
          key={i}
          id={`${p.id}-${i}`}
          label={multi ? `${p.label} (reading ${i + 1})` : p.label}
          unit={p.unit}
          numeric
          value={r.v}
          error={p.errors[`${p.errorKey}.${i}`]}
          onInput={(v) => set(i, v)}
        />
      ))}
      <div class="readings-foot">
        <button type="button" class="btn btn-small" onClick={() => p.onChange([...p.rows, { v: '', t: '' }])}>
          + Add reading
        </button>
        {st && st.window.length > 1 && (
          <p class={st.stable ? 'stable yes' : 'stable no'} data-testid={`${p.id}-stability`}>
            {st.stable ? `✓ Stable: report ${st.median}` : `… ${st.reason}`}
          </p>
        )}
      </div>
    </div>
  );
}
