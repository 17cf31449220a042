import { InputError, present, requireRange, type ChemWarning } from './errors';
import { ionicStrengthFromConductance } from './ionic-strength';
import { DEFAULT_PROFILE, profileRef, type MethodProfile, type ProfileRef } from './profiles';
import { MG_CACO3_PER_MEQ, SPECIES } from './species';
import { speciate } from './speciation';

/**
 * Field alkalinity (or ANC) from an incremental acid titration.
 *
 * Alkalinity (meq/L) = V_e · N · CF · 1000 / V_s, mg/L as CaCO₃ = meq/L × 50.04
 * (USGS National Field Manual A6.6; stoichiometry), with V_e the endpoint volume of titrant (mL),
 * N its normality, CF the cartridge correction factor and V_s the sample volume (mL). A digital
 * titrator's counts convert at 800 counts per mL unless the instrument says otherwise (NFM 6.6).
 *
 * Endpoint by:
 * - inflection point: the largest ΔpH/ΔV between successive points in the total-alkalinity region
 *   (pH 3.8–5.8), refined by a parabola through the neighbouring slopes (NFM 6.6.4.B);
 * - Gran function (Gran 1952, Analyst 77:661): past the endpoint F₁ = (V_s + V)·10^−pH is linear in V
 *   and reaches zero at V_e; a least-squares line through the points at pH 2.5–4.2 gives V_e and R²;
 * - fixed endpoint pH 4.5 by linear interpolation: only with a warning, since the true endpoint
 *   runs from about pH 5.4 to 4.3 with the water's carbonate content (Barnes 1964, USGS WSP 1535-H).
 * The inflection point is not appropriate below pH 7, for alkalinity < 0.4 meq/L, for SC < 100 µS/cm
 * or with organic acids: use Gran (NFM 6.6.4; read).
 *
 * Bicarbonate, carbonate and hydroxide are then split by the engine's carbonate equilibria at the
 * sample's initial pH and temperature (rather than the stoichiometric hand method, valid only to pH 9.2).
 */
export interface TitrationPoint {
  /** cumulative titrant added, mL (buret) */
  titrantMl?: number;
  /** cumulative digital-titrator counts */
  counts?: number;
  pH: number;
}

export interface TitrationInput {
  sampleVolumeMl: number;
  /** titrant normality, eq/L (e.g. 0.1600 or 1.600 H₂SO₄ cartridges) */
  titrantNormality: number;
  /** cartridge correction factor (1 if none) */
  correctionFactor?: number;
  /** digital titrator counts per mL of titrant; default 800 */
  countsPerMl?: number;
  tempC?: number;
  scUsPerCm?: number;
  points: TitrationPoint[];
  profile?: MethodProfile;
  /** override the automatic choice of reported method */
  preferMethod?: 'auto' | 'gran' | 'inflection' | 'fixed-endpoint';
}

export type TitrationMethod = 'gran' | 'inflection' | 'fixed-endpoint' | 'none';

export interface GranFit {
  endpointMl: number;
  alkalinityMeqL: number;
  r2: number;
  pointsUsed: number;
  /** fitted slope / (N·CF): the activity coefficient of H⁺ the line implies (≈ 0.8–1.0) */
  slopeRatio: number;
}

export interface InflectionResult {
  endpointMl: number;
  endpointPH: number;
  alkalinityMeqL: number;
  /** largest ΔpH/ΔV found, pH per mL */
  maxSlope: number;
}

export interface TitrationResult {
  alkalinityMeqL: number | undefined;
  alkalinityMgLCaCO3: number | undefined;
  method: TitrationMethod;
  byMethod: {
    gran?: GranFit;
    inflection?: InflectionResult;
    fixedEndpoint?: { endpointMl: number; alkalinityMeqL: number };
  };
  initialPH: number;
  bicarbonateMgL?: number;
  carbonateMgL?: number;
  hydroxideMgL?: number;
  /** points after sorting and unit conversion, for the endpoint plot */
  curve: Array<{ titrantMl: number; pH: number }>;
  warnings: ChemWarning[];
  profile: ProfileRef;
}

const DEFAULT_COUNTS_PER_ML = 800;

function validate(input: TitrationInput): void {
  if (!present('sampleVolumeMl', input.sampleVolumeMl)) throw new InputError('sampleVolumeMl', 'Enter the sample volume (mL).');
  requireRange('sampleVolumeMl', input.sampleVolumeMl, 1, 1000, 'mL');
  if (!present('titrantNormality', input.titrantNormality)) throw new InputError('titrantNormality', 'Enter the titrant normality.');
  requireRange('titrantNormality', input.titrantNormality, 0.0001, 10, 'N');
  if (present('correctionFactor', input.correctionFactor)) requireRange('correctionFactor', input.correctionFactor, 0.5, 1.5, '');
  if (present('countsPerMl', input.countsPerMl)) requireRange('countsPerMl', input.countsPerMl, 1, 100000, '');
  if (present('tempC', input.tempC)) requireRange('tempC', input.tempC, -2, 100, '°C');
  if (present('scUsPerCm', input.scUsPerCm)) requireRange('scUsPerCm', input.scUsPerCm, 0, 500000, 'µS/cm');
  if (!Array.isArray(input.points) || input.points.length < 2) {
    throw new InputError('points', 'A titration needs at least two (titrant, pH) points.');
  }
  const byCounts = input.points.some((p) => p.counts !== undefined && p.counts !== null);
  const byMl = input.points.some((p) => p.titrantMl !== undefined && p.titrantMl !== null);
  if (byCounts && byMl) throw new InputError('points', 'Give every point in mL or every point in counts, not a mix.');
  input.points.forEach((p, i) => {
    const v = byCounts ? p.counts : p.titrantMl;
    const f = byCounts ? `points[${i}].counts` : `points[${i}].titrantMl`;
    if (!present(f, v)) throw new InputError(f, `Point ${i + 1} has no titrant amount.`);
    if (v < 0) throw new InputError(f, `Point ${i + 1}: titrant cannot be negative.`);
    if (!present(`points[${i}].pH`, p.pH)) throw new InputError(`points[${i}].pH`, `Point ${i + 1} has no pH.`);
    requireRange(`points[${i}].pH`, p.pH, 0, 14, '');
  });
}

/** Least-squares line y = a·x + b with R². */
function fitLine(xs: number[], ys: number[]): { a: number; b: number; r2: number } {
  const n = xs.length;
  let sx = 0, sy = 0;
  for (let i = 0; i < n; i++) { sx += xs[i]!; sy += ys[i]!; }
  const mx = sx / n, my = sy / n;
  let sxx = 0, sxy = 0, syy = 0;
  for (let i = 0; i < n; i++) {
    const dx = xs[i]! - mx, dy = ys[i]! - my;
    sxx += dx * dx; sxy += dx * dy; syy += dy * dy;
  }
  const a = sxx > 0 ? sxy / sxx : 0;
  const b = my - a * mx;
  const r2 = sxx > 0 && syy > 0 ? (sxy * sxy) / (sxx * syy) : 0;
  return { a, b, r2 };
}

export function titrationAlkalinity(input: TitrationInput): TitrationResult {
  validate(input);
  const profile = input.profile ?? DEFAULT_PROFILE;
  const warnings: ChemWarning[] = [];
  const cf = input.correctionFactor ?? 1;
  const N = input.titrantNormality * cf;
  const Vs = input.sampleVolumeMl;
  const byCounts = input.points.some((p) => p.counts !== undefined && p.counts !== null);
  const cpm = input.countsPerMl ?? DEFAULT_COUNTS_PER_ML;
  const toMeqL = (vMl: number) => (vMl * N * 1000) / Vs;

  const raw = input.points.map((p, i) => ({ i, titrantMl: byCounts ? p.counts! / cpm : p.titrantMl!, pH: p.pH }));
  const sorted = [...raw].sort((a, b) => a.titrantMl - b.titrantMl || a.i - b.i);
  if (sorted.some((p, k) => p.i !== k)) {
    warnings.push({ code: 'points-reordered', message: 'The points were not in order of titrant added; they were sorted. Check the entries.', field: 'points' });
  }
  const curve = sorted.map(({ titrantMl, pH }) => ({ titrantMl, pH }));
  for (let k = 1; k < curve.length; k++) {
    if (curve[k]!.pH > curve[k - 1]!.pH + 0.05) {
      warnings.push({
        code: 'non-monotonic',
        message: `pH rose from ${curve[k - 1]!.pH} to ${curve[k]!.pH} as acid was added (point ${k + 1}): stir, let the reading settle, or check the entry.`,
        field: 'points',
      });
      break;
    }
  }
  const initialPH = curve[0]!.pH;
  const result: TitrationResult = {
    alkalinityMeqL: undefined,
    alkalinityMgLCaCO3: undefined,
    method: 'none',
    byMethod: {},
    initialPH,
    curve,
    warnings,
    profile: profileRef(profile),
  };

  // Fixed endpoint pH 4.5: first crossing, linear interpolation.
  for (let k = 1; k < curve.length; k++) {
    const a = curve[k - 1]!, b = curve[k]!;
    if (a.pH >= 4.5 && b.pH <= 4.5 && a.pH !== b.pH) {
      const v = a.titrantMl + ((a.pH - 4.5) / (a.pH - b.pH)) * (b.titrantMl - a.titrantMl);
      result.byMethod.fixedEndpoint = { endpointMl: v, alkalinityMeqL: toMeqL(v) };
      break;
    }
  }
  if (initialPH <= 4.5) {
    result.byMethod.fixedEndpoint = { endpointMl: 0, alkalinityMeqL: 0 };
    warnings.push({ code: 'no-alkalinity', message: `The sample starts at pH ${initialPH}, at or below 4.5: it has no carbonate alkalinity.` });
  }

  // Inflection point: largest ΔpH/ΔV in the total-alkalinity region.
  const slopes: Array<{ v: number; s: number; pH: number }> = [];
  for (let k = 1; k < curve.length; k++) {
    const a = curve[k - 1]!, b = curve[k]!;
    const dv = b.titrantMl - a.titrantMl;
    if (dv <= 0) continue;
    slopes.push({ v: (a.titrantMl + b.titrantMl) / 2, s: (a.pH - b.pH) / dv, pH: (a.pH + b.pH) / 2 });
  }
  let best = -1;
  for (let k = 0; k < slopes.length; k++) {
    const sl = slopes[k]!;
    if (sl.pH < 3.8 || sl.pH > 5.8) continue;
    if (best < 0 || sl.s > slopes[best]!.s) best = k;
  }
  if (best >= 0 && slopes[best]!.s > 0) {
    let v = slopes[best]!.v;
    const prev = slopes[best - 1], next = slopes[best + 1];
    if (prev && next) {
      // vertex of the parabola through three (volume, slope) points
      const x1 = prev.v, x2 = slopes[best]!.v, x3 = next.v;
      const y1 = prev.s, y2 = slopes[best]!.s, y3 = next.s;
      const den = (x1 - x2) * (x1 - x3) * (x2 - x3);
      const A = (x3 * (y2 - y1) + x2 * (y1 - y3) + x1 * (y3 - y2)) / den;
      const B = (x3 * x3 * (y1 - y2) + x2 * x2 * (y3 - y1) + x1 * x1 * (y2 - y3)) / den;
      if (A < 0 && Number.isFinite(A) && Number.isFinite(B)) v = Math.min(x3, Math.max(x1, -B / (2 * A)));
    } else {
      warnings.push({
        code: 'inflection-at-edge',
        message: 'The steepest pH change is at the edge of the data: add smaller increments around the endpoint (pH 5.5 to 4.0).',
        field: 'points',
      });
    }
    // pH at the endpoint volume, linear between the bracketing points
    let endpointPH = slopes[best]!.pH;
    for (let k = 1; k < curve.length; k++) {
      const a = curve[k - 1]!, b = curve[k]!;
      if (a.titrantMl <= v && b.titrantMl >= v && b.titrantMl > a.titrantMl) {
        endpointPH = a.pH + ((v - a.titrantMl) / (b.titrantMl - a.titrantMl)) * (b.pH - a.pH);
        break;
      }
    }
    result.byMethod.inflection = { endpointMl: v, endpointPH, alkalinityMeqL: toMeqL(v), maxSlope: slopes[best]!.s };
  }

  // Gran function on the acid branch.
  const acid = curve.filter((p) => p.pH >= 2.5 && p.pH <= 4.2);
  if (acid.length >= 2) {
    const xs = acid.map((p) => p.titrantMl);
    const ys = acid.map((p) => (Vs + p.titrantMl) * Math.pow(10, -p.pH));
    const { a, b, r2 } = fitLine(xs, ys);
    if (a > 0) {
      const ve = Math.max(0, -b / a);
      result.byMethod.gran = { endpointMl: ve, alkalinityMeqL: toMeqL(ve), r2, pointsUsed: acid.length, slopeRatio: a / N };
      if (a / N < 0.7 || a / N > 1.15) {
        warnings.push({
          code: 'gran-slope',
          message: `The Gran line's slope is ${(a / N).toFixed(2)}× the titrant strength (expected about 0.8–1.0): check the titrant normality, the correction factor and the pH calibration.`,
          field: 'titrantNormality',
        });
      }
    }
  }
  const lastPH = curve[curve.length - 1]!.pH;
  if (acid.length < profile.titration.minGranPoints) {
    warnings.push({
      code: 'too-few-points-past-endpoint',
      message: `${acid.length === 0 ? 'No point' : acid.length === 1 ? 'Only one point' : `Only ${acid.length} points`} below pH 4.2 yet: keep adding acid to about pH 3.5, with at least ${profile.titration.minGranPoints} points past the endpoint, for a Gran endpoint.`,
      field: 'points',
    });
  }
  if (lastPH > 4.5 && initialPH > 4.5) {
    warnings.push({
      code: 'endpoint-not-reached',
      message: `The titration stopped at pH ${lastPH}: the endpoint (about pH 5.4–4.3) was not reached. Keep adding acid.`,
      field: 'points',
    });
  }

  // Applicability of the inflection-point method (NFM 6.6.4).
  const approxAlk = result.byMethod.gran?.alkalinityMeqL ?? result.byMethod.inflection?.alkalinityMeqL ?? result.byMethod.fixedEndpoint?.alkalinityMeqL;
  const inflectionUnsuitable: string[] = [];
  if (initialPH < 7) inflectionUnsuitable.push(`the sample pH ${initialPH} is below 7`);
  if (approxAlk !== undefined && approxAlk < 0.4) inflectionUnsuitable.push(`alkalinity ${approxAlk.toFixed(2)} meq/L is below 0.4`);
  if (input.scUsPerCm !== undefined && input.scUsPerCm < 100) inflectionUnsuitable.push(`SC ${input.scUsPerCm} µS/cm is below 100`);

  const granOk =
    result.byMethod.gran !== undefined &&
    result.byMethod.gran.pointsUsed >= profile.titration.minGranPoints &&
    result.byMethod.gran.r2 >= profile.titration.minGranR2;
  if (result.byMethod.gran && !granOk && result.byMethod.gran.pointsUsed >= profile.titration.minGranPoints) {
    warnings.push({
      code: 'gran-poor-fit',
      message: `The Gran line fits poorly (R² ${result.byMethod.gran.r2.toFixed(4)} < ${profile.titration.minGranR2}): look for a mis-typed point past the endpoint.`,
      field: 'points',
    });
  }

  const prefer = input.preferMethod ?? 'auto';
  let method: TitrationMethod = 'none';
  if (initialPH <= 4.5) method = 'fixed-endpoint';
  else if (prefer === 'gran' && result.byMethod.gran) method = 'gran';
  else if (prefer === 'inflection' && result.byMethod.inflection) method = 'inflection';
  else if (prefer === 'fixed-endpoint' && result.byMethod.fixedEndpoint) method = 'fixed-endpoint';
  else if (granOk) method = 'gran';
  else if (result.byMethod.inflection) method = 'inflection';
  else if (result.byMethod.fixedEndpoint) method = 'fixed-endpoint';
  result.method = method;

  if (method === 'inflection' && inflectionUnsuitable.length > 0) {
    warnings.push({
      code: 'inflection-not-appropriate',
      message: `The inflection-point method is not appropriate here (${inflectionUnsuitable.join('; ')}): add points past the endpoint for a Gran endpoint (USGS NFM 6.6.4).`,
    });
  }
  if (method === 'fixed-endpoint' && initialPH > 4.5) {
    warnings.push({
      code: 'fixed-endpoint',
      message: 'Alkalinity by the fixed pH 4.5 endpoint: the true endpoint lies between about pH 5.4 and 4.3 with the water’s carbonate content, so this can be biased. Record the full curve for an inflection or Gran endpoint.',
    });
  }
  const g = result.byMethod.gran, inf = result.byMethod.inflection;
  if (granOk && g && inf) {
    const diff = Math.abs(g.alkalinityMeqL - inf.alkalinityMeqL);
    const tol = Math.max(profile.titration.agreementAbsMeqL, profile.titration.agreementRel * g.alkalinityMeqL);
    if (diff > tol) {
      warnings.push({
        code: 'methods-disagree',
        message: `Gran (${g.alkalinityMeqL.toFixed(3)} meq/L) and inflection point (${inf.alkalinityMeqL.toFixed(3)} meq/L) differ by more than ${tol.toFixed(3)} meq/L: check points near the endpoint, or titrate a second aliquot.`,
      });
    }
  }

  const alk =
    method === 'gran' ? g!.alkalinityMeqL
      : method === 'inflection' ? inf!.alkalinityMeqL
        : method === 'fixed-endpoint' ? result.byMethod.fixedEndpoint!.alkalinityMeqL
          : undefined;
  if (alk !== undefined) {
    result.alkalinityMeqL = alk;
    result.alkalinityMgLCaCO3 = alk * MG_CACO3_PER_MEQ;
    splitCarbonate(result, alk, initialPH, input, warnings);
  }
  return result;
}

/** Bicarbonate, carbonate and hydroxide (mg/L of the ion) from alkalinity at the initial pH. */
function splitCarbonate(result: TitrationResult, alkMeqL: number, pH: number, input: TitrationInput, warnings: ChemWarning[]): void {
  const tempC = input.tempC ?? 25;
  if (input.tempC === undefined) {
    warnings.push({ code: 'temperature-assumed', message: 'No sample temperature: 25 °C assumed for the bicarbonate/carbonate split.', field: 'tempC' });
  }
  const I = input.scUsPerCm !== undefined ? ionicStrengthFromConductance(input.scUsPerCm) : undefined;
  const spec = speciate({ tempC, pH, alkEqL: alkMeqL / 1000, fixedIonicStrength: I, model: 'auto' });
  result.bicarbonateMgL = spec.conc.HCO3 * SPECIES.HCO3.molarMass * 1000;
  result.carbonateMgL = spec.conc.CO3 * SPECIES.CO3.molarMass * 1000;
  result.hydroxideMgL = spec.conc.OH * SPECIES.OH.molarMass * 1000;
  if (pH > 9.2) {
    warnings.push({
      code: 'alkalinity-noncarbonate',
      message: 'Above pH 9.2, silicate, borate and organic bases may carry part of the alkalinity: the bicarbonate/carbonate split is approximate.',
    });
  }
}
