// The site chart's scales, apart from uPlot so they can be tested without a browser.

/** Fixed SI scale, widened to the data (with a margin) only when a value or its band falls outside. */
export const SI_RANGE: [number, number] = [-1, 1.5];
/** log pCO₂ scale: the atmosphere (about −3.4) to a strongly degassing spring (−1). */
export const PCO2_RANGE: [number, number] = [-3.6, -1];

/** The base range, widened in half steps to take lo…hi plus a margin; never narrower. */
export function widen(base: [number, number], lo: number, hi: number, margin: number): [number, number] {
  const low = Number.isFinite(lo) ? Math.floor((lo - margin) * 2) / 2 : base[0];
  const high = Number.isFinite(hi) ? Math.ceil((hi + margin) * 2) / 2 : base[1];
  return [Math.min(base[0], low), Math.max(base[1], high)];
}
