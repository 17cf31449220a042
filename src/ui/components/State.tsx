import type { CalciteState } from '../../chemistry';

/** The calcite state as a word and a shape, never colour alone. */
export const STATE_TEXT: Record<CalciteState, { word: string; symbol: string; cls: string; hint: string }> = {
  supersaturated: { word: 'Supersaturated', symbol: '▲', cls: 'st-super', hint: 'calcite tends to precipitate' },
  'near-equilibrium': { word: 'Near equilibrium', symbol: '◆', cls: 'st-eq', hint: 'within the measurement band of 0' },
  undersaturated: { word: 'Undersaturated', symbol: '▼', cls: 'st-under', hint: 'water can dissolve calcite' },
  unknown: { word: 'Not enough data', symbol: '?', cls: 'st-unknown', hint: 'needs T, pH, alkalinity and calcium' },
};

export function StateBadge({ state, large }: { state: CalciteState; large?: boolean }) {
  const s = STATE_TEXT[state];
  return (
    <span class={`state ${s.cls}${large ? ' state-large' : ''}`} data-state={state}>
      <span aria-hidden="true">{s.symbol}</span> {s.word}
    </span>
  );
}

/** Horizontal gauge of calcite SI from −2 to +2 with the uncertainty band. */
export function SiGauge({ si, band }: { si: number; band: number }) {
  const W = 300, H = 56, lo = -2, hi = 2;
  const x = (v: number) => 10 + ((Math.max(lo, Math.min(hi, v)) - lo) / (hi - lo)) * (W - 20);
  return (
    <svg class="gauge" viewBox={`0 0 ${W} ${H}`} role="img" aria-label={`Calcite saturation index ${si.toFixed(2)} plus or minus ${band.toFixed(2)}`}>
      <rect x="10" y="18" width={W - 20} height="14" rx="7" fill="#e8e3d6" stroke="#6b665a" />
      <rect x={x(si - band)} y="14" width={Math.max(2, x(si + band) - x(si - band))} height="22" fill="#1f7f9055" stroke="#0b3d4f" />
      <line x1={x(0)} x2={x(0)} y1="10" y2="40" stroke="#101a1f" stroke-width="2" stroke-dasharray="3 2" />
      <path d={`M${x(si)} 12 l-7 -10 h14 z`} fill="#101a1f" />
      {[-2, -1, 0, 1, 2].map((t) => (
        <text key={t} x={x(t)} y="52" text-anchor="middle" font-size="12" fill="#3b4a52">{t > 0 ? `+${t}` : t}</text>
      ))}
    </svg>
  );
}
