// The site chart, in its own chunk: uPlot (a small, well-kept time-series library) loads only
// when a site's history is opened, so the first screen stays light.
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';

export interface ChartPoint {
  t: number;
  si: number;
  band: number;
  logPco2: number | null;
}

export function siteChart(el: HTMLElement, pts: ChartPoint[], width: number): uPlot {
  const sorted = [...pts].sort((a, b) => a.t - b.t);
  const data: uPlot.AlignedData = [
    sorted.map((p) => p.t),
    sorted.map((p) => p.si),
    sorted.map((p) => p.si + p.band),
    sorted.map((p) => p.si - p.band),
    sorted.map((p) => p.logPco2),
  ];
  return new uPlot(
    {
      width,
      height: 260,
      scales: { x: { time: true }, si: { auto: true }, co2: { auto: true } },
      series: [
        {},
        { label: 'Calcite SI', scale: 'si', stroke: '#0b3d4f', width: 2, points: { show: true, size: 8 } },
        { label: 'SI + band', scale: 'si', stroke: '#1f7f90', dash: [4, 4], width: 1 },
        { label: 'SI − band', scale: 'si', stroke: '#1f7f90', dash: [4, 4], width: 1 },
        { label: 'log pCO₂', scale: 'co2', stroke: '#7a4b00', width: 2, dash: [10, 4], points: { show: true, size: 7 } },
      ],
      axes: [{}, { scale: 'si', label: 'SI' }, { scale: 'co2', side: 1, label: 'log pCO₂', grid: { show: false } }],
    },
    data,
    el,
  );
}
