import { analyzeSample, type SampleInput, type SiteConductanceFactor } from './analyze';
import { InputError } from './errors';

/** Fewest full analyses from which a site's own factor replaces the generic one (issue 12). */
export const SITE_FACTOR_MIN_ANALYSES = 3;

/** Student's t at 97.5 % for ν degrees of freedom (standard tables), for the small-sample widening. */
const T975: Array<[number, number]> = [[1, 12.706], [2, 4.303], [3, 3.182], [4, 2.776], [5, 2.571], [6, 2.447], [7, 2.365], [8, 2.306], [9, 2.262], [10, 2.228], [15, 2.131], [20, 2.086], [30, 2.042], [60, 2.0]];
function t975(nu: number): number {
  for (const [n, t] of T975) if (nu <= n) return t;
  return 1.96;
}

function median(v: number[]): number {
  const s = [...v].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/**
 * A site's own SC → I factor from its full analyses (SC, pH and the major ions: Ca, Mg, Na, Cl,
 * SO₄, alkalinity), for use as `siteConductanceFactor` in {@link analyzeSample}:
 * - factor = median of I/SC over the analyses, I from the full speciation of each;
 * - relUncertainty = the relative standard uncertainty of I for one new sample of the site:
 *   robust σ of the ratios (1.4826 × median absolute deviation, relative to the median), widened
 *   for the median's own uncertainty (× √(1 + π/(2n))) and for a small sample (× t₉₇.₅(n−1)/1.96,
 *   so 2σ keeps about 95 % coverage with few analyses), never below 5 % (an SC reading and a lab
 *   ion sum each carry about 3 %, common practice).
 * Analyses without SC > 0, pH or a major ion are skipped; a median-based factor shrugs off a single
 * unit slip. Returns undefined with fewer than {@link SITE_FACTOR_MIN_ANALYSES} usable analyses.
 * Sources: median and MAD scaling (Hampel 1974, from memory); Student's t (standard tables).
 */
export function conductanceFactorFromAnalyses(inputs: readonly SampleInput[]): SiteConductanceFactor | undefined {
  if (!Array.isArray(inputs)) throw new InputError('inputs', 'conductanceFactorFromAnalyses needs an array of analyses.');
  const ratios: number[] = [];
  for (const input of inputs) {
    const sc = input.scUsPerCm;
    if (sc === undefined || sc === null || !(sc > 0) || input.pH === undefined || input.pH === null) continue;
    const a = analyzeSample(input, { ionicStrengthFrom: 'auto' });
    if (a.ionicStrength.source !== 'composition' || a.ionicStrength.value === undefined) continue;
    ratios.push(a.ionicStrength.value / sc);
  }
  const n = ratios.length;
  if (n < SITE_FACTOR_MIN_ANALYSES) return undefined;
  const factor = median(ratios);
  const mad = median(ratios.map((r) => Math.abs(r - factor)));
  const sigma = (1.4826 * mad) / factor;
  const rel = Math.max(0.05, sigma * Math.sqrt(1 + Math.PI / (2 * n)) * (t975(n - 1) / 1.96));
  return { factor, relUncertainty: rel, n };
}
