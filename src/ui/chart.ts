// The site chart, in its own chunk: uPlot (a small, well-kept time-series library) loads only
// when a site's history is opened, so the first screen stays light.
// Two panels on one time axis, readable on a phone: calcite SI with its band around a drawn SI = 0
// line on a fixed scale (−1…+1.5, widened only when a value needs it), and log pCO₂ below on its own
// scale. No hover is needed: the legend is drawn as plain HTML beside the chart.
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import { PCO2_RANGE, SI_RANGE, widen } from './chart-scale';

export interface ChartPoint {
  t: number;
  si: number;
  band: number;
  logPco2: number | null;
}

const dayFmt = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short' });
const yearFmt = new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', year: 'numeric' });

function timeAxis(show: boolean): uPlot.Axis {
  return {
    show,
    size: show ? 40 : 0,
    values: (_u, splits) => splits.map((s, i) => (i === 0 ? yearFmt : dayFmt).format(new Date(s * 1000))),
    stroke: '#3b4a52',
    grid: { stroke: '#e6e1d4' },
  };
}

export function siteChart(el: HTMLElement, pts: ChartPoint[], width: number): { destroy(): void } {
  const sorted = [...pts].sort((a, b) => a.t - b.t);
  const t = sorted.map((p) => p.t);
  const hi = sorted.map((p) => p.si + p.band);
  const lo = sorted.map((p) => p.si - p.band);
  const siRange = widen(SI_RANGE, Math.min(...lo), Math.max(...hi), 0.1);
  const co2 = sorted.map((p) => p.logPco2);
  const co2Vals = co2.filter((v): v is number => v !== null);
  const co2Range = widen(PCO2_RANGE, Math.min(...co2Vals), Math.max(...co2Vals), 0.1);
  // pad the time axis so one or two samples do not sit on the edges
  const span = Math.max(86400, (t[t.length - 1]! - t[0]!) * 0.05);
  const xRange: [number, number] = [t[0]! - span, t[t.length - 1]! + span];
  const sync = uPlot.sync(`site-${Math.random()}`);
  const common = { width, cursor: { sync: { key: sync.key }, drag: { x: false, y: false } }, legend: { show: false } };
  const siPlot = new uPlot(
    {
      ...common,
      height: 220,
      scales: { x: { time: true, range: xRange }, si: { range: siRange } },
      series: [
        {},
        { label: 'SI + band', scale: 'si', stroke: '#1f7f90', width: 1 },
        { label: 'SI − band', scale: 'si', stroke: '#1f7f90', width: 1 },
        { label: 'Calcite SI', scale: 'si', stroke: '#0b3d4f', width: 2.5, points: { show: true, size: 9, fill: '#0b3d4f' } },
        { label: 'SI = 0', scale: 'si', stroke: '#101a1f', width: 1.5, dash: [6, 4], points: { show: false } },
      ],
      bands: [{ series: [1, 2], fill: '#1f7f9040' }],
      axes: [timeAxis(false), { scale: 'si', label: 'Calcite SI', size: 52, stroke: '#3b4a52', grid: { stroke: '#e6e1d4' } }],
    },
    [t, hi, lo, sorted.map((p) => p.si), t.map(() => 0)],
    el,
  );
  const co2Plot = new uPlot(
    {
      ...common,
      height: 170,
      scales: { x: { time: true, range: xRange }, co2: { range: co2Range } },
      series: [{}, { label: 'log pCO₂', scale: 'co2', stroke: '#7a4b00', width: 2, dash: [10, 4], points: { show: true, size: 8, fill: '#7a4b00' } }],
      axes: [timeAxis(true), { scale: 'co2', label: 'log pCO₂', size: 52, stroke: '#3b4a52', grid: { stroke: '#e6e1d4' } }],
    },
    [t, co2],
    el,
  );
  return {
    destroy: () => {
      siPlot.destroy();
      co2Plot.destroy();
    },
  };
}
