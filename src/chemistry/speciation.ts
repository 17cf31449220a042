import { autoLogGamma, autoTjWeight, chooseActivityModel, debyeHuckelTerms, logGammaFor, type ActivityModel } from './activity';
import { logKTable, type LogKTable } from './equilibrium';
import { SPECIES, type Ion } from './species';

/**
 * Ion-association speciation of a fresh to brackish water at a measured pH.
 *
 * Unknowns: the free concentrations of Ca²⁺, Mg²⁺, Na⁺, K⁺, SO₄²⁻ and HCO₃⁻ (mol/L). Knowns:
 * totals of Ca, Mg, Na, K, SO₄, Cl, NO₃, F, Si, the carbonate alkalinity (eq/L) and pH (so the
 * activity of H⁺ is fixed). Mass-action for the pairs CaHCO₃⁺, CaCO₃°, CaSO₄°, CaOH⁺, MgHCO₃⁺,
 * MgCO₃°, MgSO₄°, MgOH⁺, NaCO₃⁻, NaHCO₃°, NaSO₄⁻, KSO₄⁻, HSO₄⁻ and H₃SiO₄⁻ with the
 * constants of {@link logKTable}; mass balances on each total; the alkalinity balance
 *   Alk = [HCO₃⁻] + 2[CO₃²⁻] + [CaHCO₃⁺] + [MgHCO₃⁺] + [NaHCO₃°] + 2([CaCO₃°] + [MgCO₃°] + [NaCO₃⁻])
 *         + [OH⁻] + [CaOH⁺] + [MgOH⁺] + [H₃SiO₄⁻] − [H⁺] − [HSO₄⁻]
 * (the usual definition of alkalinity against the CO₂ reference level; Stumm & Morgan, Aquatic
 * Chemistry, ch. 4). The free-ion values are found by successive substitution (the
 * "ion-association" method of Garrels & Thompson 1962, Am. J. Sci. 260:57), with ionic strength
 * recomputed from all charged species every pass unless it is given (estimated from SC).
 *
 * Concentrations are mol/L and treated as mol/kg (error below 1 % under 10 g/L dissolved solids).
 */
export interface SpeciationInput {
  tempC: number;
  pH: number;
  /** carbonate + hydroxide alkalinity, eq/L; undefined = unknown (no carbonate species) */
  alkEqL?: number | undefined;
  /** totals, mol/L */
  ca?: number | undefined;
  mg?: number | undefined;
  na?: number | undefined;
  k?: number | undefined;
  cl?: number | undefined;
  so4?: number | undefined;
  no3?: number | undefined;
  f?: number | undefined;
  si?: number | undefined;
  /** A fixed ionic strength (mol/L), e.g. estimated from SC; otherwise computed from the species. */
  fixedIonicStrength?: number | undefined;
  model: ActivityModel | 'auto';
  /** log K values at tempC, when the caller already has them */
  logK?: LogKTable;
  /** free concentrations and I from a nearby solution, to start from (fewer passes) */
  start?: SpeciationState;
}

/** The iteration's unknowns: enough to warm-start a nearby speciation. */
export interface SpeciationState {
  ca: number; mg: number; na: number; k: number; so4: number; hco3: number; I: number;
}

export type SpeciesKey = Ion | 'CaCO3aq' | 'MgCO3aq' | 'CaSO4aq' | 'MgSO4aq' | 'NaHCO3aq' | 'H2CO3' | 'H4SiO4';

export interface Speciation {
  ionicStrength: number;
  /** the model applied (under 'auto', the one with most weight) */
  model: ActivityModel;
  /** under 'auto', the weight of Truesdell–Jones in the blend (0–1); 0 or 1 for a chosen model */
  tjWeight: number;
  iterations: number;
  converged: boolean;
  /** free concentrations, mol/L */
  conc: Record<SpeciesKey, number>;
  /** log10 activity of the species the indices need */
  logActivity: { H: number; OH: number; Ca: number; Mg: number; Na: number; SO4: number; HCO3: number; CO3: number; H2CO3: number };
  /** log10 γ for every charged species */
  logGamma: Record<Ion, number>;
  /** dissolved inorganic carbon, mol/L (0 when alkalinity is unknown) */
  dicMolL: number;
  /** true when the alkalinity given is smaller than its non-carbonate part at this pH */
  alkalinityBelowNoncarbonate: boolean;
  state: SpeciationState;
}

/** 10^logK for a table, computed once per table object (a table is made once per temperature). */
const kCache = new WeakMap<LogKTable, Record<keyof LogKTable, number>>();
function kValues(lk: LogKTable): Record<keyof LogKTable, number> {
  let k = kCache.get(lk);
  if (!k) {
    k = {} as Record<keyof LogKTable, number>;
    for (const key of Object.keys(lk) as Array<keyof LogKTable>) k[key] = Math.pow(10, lk[key]);
    kCache.set(lk, k);
  }
  return k;
}

const CHARGED: Ion[] = Object.keys(SPECIES) as Ion[];

const MAX_ITER = 300;
const TOL = 1e-10;

export function speciate(input: SpeciationInput): Speciation {
  const lk = input.logK ?? logKTable(input.tempC);
  const kv = kValues(lk);
  const K = (r: keyof LogKTable) => kv[r];
  const terms = debyeHuckelTerms(input.tempC);
  const aH = Math.pow(10, -input.pH);
  const Kw = K('water'), K1 = K('carbonic1'), K2 = K('carbonic2');
  const kCaHCO3 = K('CaHCO3'), kCaCO3 = K('CaCO3aq'), kCaSO4 = K('CaSO4aq'), kCaOH = K('CaOH');
  const kMgHCO3 = K('MgHCO3'), kMgCO3 = K('MgCO3aq'), kMgSO4 = K('MgSO4aq'), kMgOH = K('MgOH');
  const kNaCO3 = K('NaCO3'), kNaHCO3 = K('NaHCO3aq'), kNaSO4 = K('NaSO4'), kKSO4 = K('KSO4');
  const kHSO4 = K('HSO4'), kSi = K('H4SiO4');

  const T = {
    ca: input.ca ?? 0, mg: input.mg ?? 0, na: input.na ?? 0, k: input.k ?? 0, cl: input.cl ?? 0,
    so4: input.so4 ?? 0, no3: input.no3 ?? 0, f: input.f ?? 0, si: input.si ?? 0,
  };
  const alk = input.alkEqL;

  // free concentrations, first guess = totals (or a nearby solution's, scaled to these totals)
  const st = input.start;
  const scaled = (free: number | undefined, total: number) => (st && free !== undefined && total > 0 ? Math.min(free, total) : total);
  let ca = scaled(st?.ca, T.ca), mg = scaled(st?.mg, T.mg), na = scaled(st?.na, T.na), kk = scaled(st?.k, T.k), so4 = scaled(st?.so4, T.so4);
  let hco3 = alk !== undefined ? (st ? st.hco3 : Math.max(alk, 0)) : 0;
  let I =
    input.fixedIonicStrength ??
    st?.I ??
    0.5 * (4 * T.ca + 4 * T.mg + T.na + T.k + T.cl + 4 * T.so4 + T.no3 + T.f + (alk ?? 0) + aH);
  let lastI = Number.NaN;
  let lastModel: ActivityModel | 'auto' | null = null;

  const lg = {} as Record<Ion, number>;
  const g = {} as Record<Ion, number>;
  let model: ActivityModel = input.model === 'auto' ? chooseActivityModel(I) : input.model;
  let converged = false;
  let belowNoncarb = false;
  let iter = 0;
  let c: Record<SpeciesKey, number> = {} as Record<SpeciesKey, number>;

  for (iter = 1; iter <= MAX_ITER; iter++) {
    model = input.model === 'auto' ? chooseActivityModel(I) : input.model;
    // γ depends only on I and the model: with a fixed (estimated) I it is computed once.
    // 'auto' blends two models across AUTO_BLEND (activity.ts), so it is passed on as 'auto'.
    if (I !== lastI || input.model !== lastModel) {
      for (const ion of CHARGED) {
        lg[ion] = input.model === 'auto' ? autoLogGamma(ion, I, terms) : logGammaFor(ion, I, terms, input.model);
        g[ion] = Math.pow(10, lg[ion]);
      }
      lastI = I;
      lastModel = input.model;
    }
    const aCa = g.Ca * ca, aMg = g.Mg * mg, aNa = g.Na * na, aK = g.K * kk, aSO4 = g.SO4 * so4;
    const cH = aH / g.H;
    const cOH = Kw / aH / g.OH;
    const cCaOH = (kCaOH * aCa) / aH / g.CaOH;
    const cMgOH = (kMgOH * aMg) / aH / g.MgOH;
    const siRatio = kSi / aH / g.H3SiO4; // [H3SiO4-]/[H4SiO4]
    const cH3SiO4 = (T.si * siRatio) / (1 + siRatio);
    const cHSO4 = (kHSO4 * aSO4 * aH) / g.HSO4;

    // carbonate: everything is proportional to the free HCO3- concentration x
    let x = 0;
    let rCO3 = 0;
    if (alk !== undefined) {
      rCO3 = (K2 * g.HCO3) / (aH * g.CO3); // [CO3-2]/[HCO3-]
      const perX =
        1 +
        (kCaHCO3 * aCa * g.HCO3) / g.CaHCO3 +
        (kMgHCO3 * aMg * g.HCO3) / g.MgHCO3 +
        kNaHCO3 * aNa * g.HCO3 +
        2 * rCO3 * (1 + kCaCO3 * aCa * g.CO3 + kMgCO3 * aMg * g.CO3 + (kNaCO3 * aNa * g.CO3) / g.NaCO3);
      const noncarb = cOH + cCaOH + cMgOH + cH3SiO4 - cH - cHSO4;
      x = (alk - noncarb) / perX;
      belowNoncarb = x <= 0;
      if (x <= 0) x = 0;
    }
    const aHCO3 = g.HCO3 * x;
    const cCO3 = rCO3 * x;
    const aCO3 = g.CO3 * cCO3;

    const caF = T.ca / (1 + (kCaHCO3 * g.Ca * aHCO3) / g.CaHCO3 + kCaCO3 * g.Ca * aCO3 + kCaSO4 * g.Ca * aSO4 + (kCaOH * g.Ca) / (aH * g.CaOH));
    const mgF = T.mg / (1 + (kMgHCO3 * g.Mg * aHCO3) / g.MgHCO3 + kMgCO3 * g.Mg * aCO3 + kMgSO4 * g.Mg * aSO4 + (kMgOH * g.Mg) / (aH * g.MgOH));
    const naF = T.na / (1 + (kNaCO3 * g.Na * aCO3) / g.NaCO3 + kNaHCO3 * g.Na * aHCO3 + (kNaSO4 * g.Na * aSO4) / g.NaSO4);
    const kF = T.k / (1 + (kKSO4 * g.K * aSO4) / g.KSO4);
    const so4F = T.so4 / (1 + kCaSO4 * aCa * g.SO4 + kMgSO4 * aMg * g.SO4 + (kNaSO4 * aNa * g.SO4) / g.NaSO4 + (kKSO4 * aK * g.SO4) / g.KSO4 + (kHSO4 * aH * g.SO4) / g.HSO4);

    // damp in log space after a while, in case of oscillation in concentrated water
    const damp = iter > 40 ? 0.5 : 1;
    const mix = (old: number, nu: number) => (damp === 1 || old <= 0 || nu <= 0 ? nu : Math.sqrt(old * nu));
    const nCa = mix(ca, caF), nMg = mix(mg, mgF), nNa = mix(na, naF), nK = mix(kk, kF), nSO4 = mix(so4, so4F);

    c = {
      H: cH, OH: cOH, Ca: nCa, Mg: nMg, Na: nNa, K: nK, NH4: 0, Cl: T.cl, SO4: nSO4, HCO3: x, CO3: cCO3,
      NO3: T.no3, F: T.f, HSO4: cHSO4, H3SiO4: cH3SiO4,
      CaHCO3: (kCaHCO3 * aCa * aHCO3) / g.CaHCO3,
      MgHCO3: (kMgHCO3 * aMg * aHCO3) / g.MgHCO3,
      NaCO3: (kNaCO3 * aNa * aCO3) / g.NaCO3,
      NaSO4: (kNaSO4 * aNa * aSO4) / g.NaSO4,
      KSO4: (kKSO4 * aK * aSO4) / g.KSO4,
      CaOH: cCaOH, MgOH: cMgOH,
      CaCO3aq: kCaCO3 * aCa * aCO3,
      MgCO3aq: kMgCO3 * aMg * aCO3,
      CaSO4aq: kCaSO4 * aCa * aSO4,
      MgSO4aq: kMgSO4 * aMg * aSO4,
      NaHCO3aq: kNaHCO3 * aNa * aHCO3,
      H2CO3: (aH * aHCO3) / K1,
      H4SiO4: T.si - cH3SiO4,
    };

    let nI = I;
    if (input.fixedIonicStrength === undefined) {
      // I = ½ Σ cᵢ zᵢ² over every charged species, written out (this is the hot loop)
      nI =
        0.5 *
        (c.H + c.OH + c.Na + c.K + c.Cl + c.HCO3 + c.NO3 + c.F + c.HSO4 + c.H3SiO4 + c.CaHCO3 + c.MgHCO3 +
          c.NaCO3 + c.NaSO4 + c.KSO4 + c.CaOH + c.MgOH + 4 * (c.Ca + c.Mg + c.SO4 + c.CO3));
    }
    // Beyond any natural water (pH 14 with no buffer: I ≈ 1 from OH⁻ alone) the activity models
    // can run away: I is held within 0–10 mol/L and a non-finite pass keeps the last I (unconverged).
    if (!Number.isFinite(nI)) nI = I;
    nI = Math.min(10, Math.max(0, nI));
    const change = Math.max(
      rel(ca, nCa), rel(mg, nMg), rel(na, nNa), rel(kk, nK), rel(so4, nSO4), rel(hco3, x), rel(I, nI),
    );
    ca = nCa; mg = nMg; na = nNa; kk = nK; so4 = nSO4; hco3 = x; I = nI;
    if (change < TOL) {
      converged = true;
      break;
    }
  }
  if (iter > MAX_ITER) iter = MAX_ITER;

  // final activities with the final I (γ from the last pass is within TOL when converged)
  const la = (ion: Ion, conc: number) => (conc > 0 ? Math.log10(conc) + (lg[ion] ?? 0) : -Infinity);
  const dic = c.H2CO3 + c.HCO3 + c.CO3 + c.CaHCO3 + c.MgHCO3 + c.NaCO3 + c.CaCO3aq + c.MgCO3aq + c.NaHCO3aq;
  return {
    ionicStrength: I,
    model,
    tjWeight: input.model === 'auto' ? autoTjWeight(I) : input.model === 'truesdell-jones' ? 1 : 0,
    iterations: iter,
    converged,
    conc: c,
    logActivity: {
      H: -input.pH,
      OH: la('OH', c.OH),
      Ca: la('Ca', c.Ca),
      Mg: la('Mg', c.Mg),
      Na: la('Na', c.Na),
      SO4: la('SO4', c.SO4),
      HCO3: la('HCO3', c.HCO3),
      CO3: la('CO3', c.CO3),
      H2CO3: c.H2CO3 > 0 ? Math.log10(c.H2CO3) : -Infinity,
    },
    logGamma: { ...lg },
    dicMolL: dic,
    alkalinityBelowNoncarbonate: belowNoncarb,
    state: { ca, mg, na, k: kk, so4, hco3, I },
  };
}

function rel(a: number, b: number): number {
  const d = Math.abs(a - b);
  const m = Math.max(Math.abs(a), Math.abs(b));
  return m === 0 ? 0 : d / m;
}
