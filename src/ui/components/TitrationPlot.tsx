import type { TitrationResult } from '../../chemistry';

/** The titration curve with its endpoint(s): the crew sees at once whether the endpoint was bracketed. */
export function TitrationPlot({ t, unit }: { t: TitrationResult; unit: string }) {
  const pts = t.curve;
  if (pts.length < 2) return null;
  const W = 320, H = 200, L = 36, B = 28, R = 10, T = 10;
  const maxV = Math.max(...pts.map((p) => p.titrantMl)) || 1;
  const x = (v: number) => L + (v / maxV) * (W - L - R);
  const y = (ph: number) => T + ((10 - Math.max(2, Math.min(10, ph))) / 8) * (H - T - B);
  const path = pts.map((p, i) => `${i ? 'L' : 'M'}${x(p.titrantMl).toFixed(1)} ${y(p.pH).toFixed(1)}`).join(' ');
  const ends: Array<{ v: number; label: string; dash: string }> = [];
  if (t.byMethod.gran) ends.push({ v: t.byMethod.gran.endpointMl, label: 'Gran', dash: '' });
  if (t.byMethod.inflection) ends.push({ v: t.byMethod.inflection.endpointMl, label: 'inflection', dash: '4 3' });
  const scale = unit === 'counts' ? 800 : 1;
  return (
    <figure class="plot">
      <svg viewBox={`0 0 ${W} ${H}`} role="img" aria-label={`Titration curve, ${pts.length} points; endpoint by ${t.method}`}>
        <rect x={L} y={T} width={W - L - R} height={H - T - B} fill="#fff" stroke="#6b665a" />
        {[2, 4, 6, 8, 10].map((ph) => (
          <g key={ph}>
            <line x1={L} x2={W - R} y1={y(ph)} y2={y(ph)} stroke="#e8e3d6" />
            <text x={L - 6} y={y(ph) + 4} text-anchor="end" font-size="11">{ph}</text>
          </g>
        ))}
        <line x1={L} x2={W - R} y1={y(4.5)} y2={y(4.5)} stroke="#7a4b00" stroke-dasharray="2 3" />
        {ends.map((e) => (
          <g key={e.label}>
            <line x1={x(e.v)} x2={x(e.v)} y1={T} y2={H - B} stroke="#0b3d4f" stroke-width="2" stroke-dasharray={e.dash} />
            <text x={x(e.v) + 3} y={T + 12 + (e.dash ? 14 : 0)} font-size="11">{e.label}</text>
          </g>
        ))}
        <path d={path} fill="none" stroke="#101a1f" stroke-width="2" />
        {pts.map((p, i) => <circle key={i} cx={x(p.titrantMl)} cy={y(p.pH)} r="3" fill="#101a1f" />)}
        <text x={(W + L) / 2} y={H - 6} text-anchor="middle" font-size="11">titrant ({unit}), max {(maxV * scale).toFixed(unit === 'counts' ? 0 : 2)}</text>
      </svg>
      <figcaption>
        {t.alkalinityMgLCaCO3 !== undefined
          ? `Endpoint by ${t.method === 'gran' ? 'Gran function' : t.method === 'inflection' ? 'inflection point' : 'fixed pH 4.5'}: ${t.alkalinityMgLCaCO3.toFixed(1)} mg/L as CaCO₃`
          : 'No endpoint yet: keep titrating past pH 4.5, to about pH 3.5.'}
      </figcaption>
    </figure>
  );
}
