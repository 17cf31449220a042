import { ACTIVITY_MODELS, activityModelDoubt, autoTjWeight, debyeHuckelTerms, MODEL_MAX_IONIC_STRENGTH, type ActivityModel } from './activity';
import { chargeBalance, type ChargeBalance } from './balance';
import { calculatedConductance } from './conductance';
import { isExtrapolated, logKTable, REACTIONS, type LogKTable, type Reaction } from './equilibrium';
import { InputError, present, requireNonNegative, requireRange, type ChemWarning } from './errors';
import {
  DEFAULT_CONDUCTANCE_FACTOR,
  ionicStrengthFromConductance,
  ionicStrengthFromSalinity,
  ionicStrengthFromSpecificConductance,
  ionicStrengthFromTds,
  PSS78_MAX_SC_US_PER_CM,
  SALINITY_ESTIMATE_REL_UNCERTAINTY,
  salinityFromScExtended,
} from './ionic-strength';
import { oxygenSaturationMgL, STANDARD_PRESSURE_KPA } from './oxygen';
import {
  COVERAGE_FACTOR,
  DEFAULT_UNCERTAINTIES,
  LOG_K_UNCERTAINTY,
  makeBudget,
  SC_ABS_U_US_PER_CM,
  uncertaintiesFromEvidence,
  type BudgetEntry,
  type SampleEvidence,
  type Uncertainties,
  type UncertaintyBasis,
  type UncertaintySource,
} from './uncertainty';
import { MG_CACO3_PER_MEQ, MOLAR_MASS, SPECIES, type Ion } from './species';
import { speciate, type Speciation, type SpeciationState } from './speciation';
import { ATMOSPHERIC_LOG_PCO2, ENGINE_VERSION } from './version';

/** What the crew measured. Units are in the names; everything but tempC is optional. */
export interface SampleInput {
  tempC: number;
  pH?: number | null;
  /** specific conductance at 25 °C, µS/cm */
  scUsPerCm?: number | null;
  tdsMgL?: number | null;
  /** practical salinity (PSS-78, unitless) */
  salinity?: number | null;
  alkalinityMgLCaCO3?: number | null;
  caMgL?: number | null;
  mgMgL?: number | null;
  naMgL?: number | null;
  kMgL?: number | null;
  clMgL?: number | null;
  so4MgL?: number | null;
  /** nitrate as N, mg/L */
  no3NMgL?: number | null;
  fMgL?: number | null;
  sio2MgL?: number | null;
  /** dissolved oxygen, mg/L */
  doMgL?: number | null;
  /** dissolved oxygen as % saturation (used when doMgL is absent) */
  doPercent?: number | null;
  /** true (station) barometric pressure, kPa; sea-level standard 101.325 kPa when absent */
  pressureKPa?: number | null;
}

export type IonicStrengthSource = 'composition' | 'conductance' | 'tds' | 'salinity' | 'partial-composition' | 'none';

/** Where the SC → I factor came from: the generic default, a factor set in the options, or the site's own analyses. */
export type ConductanceFactorSource = 'generic' | 'given' | 'site';

export { DEFAULT_UNCERTAINTIES, type Uncertainties } from './uncertainty';

/** A site's own SC → I factor from its full analyses ({@link conductanceFactorFromAnalyses}). */
export interface SiteConductanceFactor {
  /** (mol/L)/(µS/cm) */
  factor: number;
  /** relative standard uncertainty of I for one new sample of this site */
  relUncertainty: number;
  /** analyses it rests on */
  n: number;
}

export interface AnalyzeOptions {
  activityModel?: ActivityModel | 'auto';
  ionicStrengthFrom?: 'auto' | 'composition' | 'conductance' | 'tds' | 'salinity';
  /** (mol/L)/(µS/cm); default {@link DEFAULT_CONDUCTANCE_FACTOR} */
  conductanceFactor?: number;
  /** the site's own factor; replaces `conductanceFactor` and its uncertainty when given */
  siteConductanceFactor?: SiteConductanceFactor;
  /** standard uncertainties (1σ) that replace the defaults and the evidence */
  uncertainty?: Partial<Uncertainties>;
  /** the sample's own evidence about its uncertainties (readings, check buffer, kit steps) */
  evidence?: SampleEvidence;
}

export type CalciteState = 'undersaturated' | 'near-equilibrium' | 'supersaturated' | 'unknown';

export interface Analysis {
  engineVersion: string;
  tempC: number;
  ionicStrength: {
    /** mol/L; undefined only when nothing allows an estimate */
    value: number | undefined;
    source: IonicStrengthSource;
    /** relative standard uncertainty (1σ) of the value, a fraction (0 when computed from a full analysis) */
    relUncertainty: number;
    /** the SC-based estimate, when SC is known, for comparison */
    fromConductance?: number;
    /** for SC-based estimates: the factor used and where it came from */
    conductanceFactor?: { value: number; source: ConductanceFactorSource; n?: number };
    /** for SC-based estimates: weight of the seawater relation (0 fresh … 1 seawater proportions) */
    seawaterWeight?: number;
  };
  /** the activity model applied (under 'auto', the one with most weight) */
  activityModel: ActivityModel;
  /** under 'auto' between I = 0.05 and 0.1: the weight of Truesdell–Jones in the blend with extended Debye–Hückel */
  activityModelBlend?: { truesdellJonesWeight: number };
  /** major ions implied by seawater proportions for ion pairing (field-only brackish water), mg/L */
  impliedSeawaterIonsMgL?: { naMgL: number; mgMgL: number; kMgL: number; clMgL: number; so4MgL: number };
  speciation?: { converged: boolean; iterations: number };
  saturationIndex: { calcite?: number; aragonite?: number; dolomite?: number; gypsum?: number };
  /**
   * Expanded uncertainty of calcite SI at about 95 % (k = 2, GUM): SI ± this is the band. It
   * includes the measurements, the ionic-strength estimate, the constants and the activity model.
   */
  calciteSiUncertainty?: number;
  /** combined standard uncertainty (1σ) of calcite SI */
  calciteSiStandardUncertainty?: number;
  /** the coverage factor of calciteSiUncertainty (2) */
  calciteSiCoverageFactor?: number;
  /** each source's share of the band and what would narrow it, largest first */
  calciteSiBudget?: BudgetEntry[];
  calciteState: CalciteState;
  /** log10 of CO₂ partial pressure, atm */
  logPco2?: number;
  carbonate?: {
    dicMmolL: number;
    co2AqMmolL: number;
    hco3MmolL: number;
    co3MmolL: number;
    /** free HCO₃⁻ and CO₃²⁻ as mg/L of the ion */
    hco3MgL: number;
    co3MgL: number;
  };
  /**
   * Langelier saturation index (pH − pHs), pHs and Ryznar stability index (2 pHs − pH).
   * method 'speciation': pHs solved with the full speciation; 'sm-2330-formula': the Standard
   * Methods 2330 B formula, used where no pH below 14 saturates the water (very soft water).
   */
  langelier?: { pHs: number; lsi: number; rsi: number; method: 'speciation' | 'sm-2330-formula' };
  /** dissolved-oxygen saturation at the sample's temperature, salinity and pressure (Benson & Krause) */
  oxygen?: { saturationMgL: number; percentSaturation: number; doMgL: number; salinity: number; pressureKPa: number };
  hardnessMgLCaCO3?: number;
  calciumHardnessMgLCaCO3?: number;
  chargeBalancePercent?: number;
  chargeBalance?: ChargeBalance;
  calculatedScUsPerCm?: number;
  warnings: ChemWarning[];
}

/** Fields that must be present for ionic strength "from composition". */
const COMPOSITION_FIELDS = ['caMgL', 'mgMgL', 'naMgL', 'clMgL', 'so4MgL', 'alkalinityMgLCaCO3'] as const;

interface Totals {
  ca?: number; mg?: number; na?: number; k?: number; cl?: number; so4?: number; no3?: number; f?: number; si?: number;
  alkEqL?: number;
}

const MG_PER_MOL = {
  ca: SPECIES.Ca.molarMass * 1000,
  mg: SPECIES.Mg.molarMass * 1000,
  na: SPECIES.Na.molarMass * 1000,
  k: SPECIES.K.molarMass * 1000,
  cl: SPECIES.Cl.molarMass * 1000,
  so4: SPECIES.SO4.molarMass * 1000,
  no3: MOLAR_MASS.N * 1000,
  f: SPECIES.F.molarMass * 1000,
  si: MOLAR_MASS.SiO2 * 1000,
};

/**
 * Major ions of seawater at practical salinity 35, mol/kg: Millero et al. (2008) reference
 * composition, Deep-Sea Res. I 55:50 (from memory). Used to imply the ion pairing of brackish
 * water entered as field readings only, scaled by S/35.
 */
export const SEAWATER_IONS_MOL_KG_S35 = { na: 0.4690, mg: 0.05282, k: 0.01021, cl: 0.5459, so4: 0.02824 } as const;

/**
 * Below this pH the carbonate alkalinity is zero by definition (the titration endpoint is about
 * pH 4.5; Standard Methods 2320 B, from memory): an alkalinity above zero is inconsistent.
 */
export const ALKALINITY_ENDPOINT_PH = 4.5;

function validate(input: SampleInput): void {
  if (input === null || typeof input !== 'object') throw new InputError('input', 'analyzeSample needs an input object.');
  if (!present('tempC', input.tempC)) throw new InputError('tempC', 'Water temperature (tempC) is required.');
  requireRange('tempC', input.tempC, -2, 100, '°C');
  if (present('pH', input.pH)) requireRange('pH', input.pH, 0, 14, '');
  if (present('salinity', input.salinity)) requireRange('salinity', input.salinity, 0, 45, '');
  if (present('pressureKPa', input.pressureKPa)) requireRange('pressureKPa', input.pressureKPa, 30, 120, 'kPa');
  if (present('doPercent', input.doPercent)) requireRange('doPercent', input.doPercent, 0, 500, '%');
  const conc: Array<keyof SampleInput> = [
    'scUsPerCm', 'tdsMgL', 'alkalinityMgLCaCO3', 'caMgL', 'mgMgL', 'naMgL', 'kMgL', 'clMgL', 'so4MgL', 'no3NMgL', 'fMgL', 'sio2MgL', 'doMgL',
  ];
  for (const f of conc) {
    const v = input[f];
    if (present(f, v)) {
      requireNonNegative(f, v);
      if (v > 500_000) throw new InputError(f, `${f} = ${v} is beyond any natural water (over 500,000).`);
    }
  }
  if (present('doMgL', input.doMgL) && input.doMgL > 60) {
    throw new InputError('doMgL', `doMgL = ${input.doMgL} mg/L is beyond what water can hold (about 60 mg/L even under pure oxygen at 0 °C).`);
  }
}

function totalsOf(input: SampleInput): Totals {
  const t: Totals = {};
  const put = (key: keyof typeof MG_PER_MOL, v: number | null | undefined) => {
    if (v !== undefined && v !== null) t[key] = v / MG_PER_MOL[key];
  };
  put('ca', input.caMgL); put('mg', input.mgMgL); put('na', input.naMgL); put('k', input.kMgL); put('cl', input.clMgL);
  put('so4', input.so4MgL); put('no3', input.no3NMgL); put('f', input.fMgL); put('si', input.sio2MgL);
  if (input.alkalinityMgLCaCO3 !== undefined && input.alkalinityMgLCaCO3 !== null) {
    t.alkEqL = input.alkalinityMgLCaCO3 / (MG_CACO3_PER_MEQ * 1000);
  }
  return t;
}

function hasComposition(input: SampleInput): boolean {
  return COMPOSITION_FIELDS.every((f) => input[f] !== undefined && input[f] !== null);
}

function ionsForBalance(t: Totals): { cat: number; an: number } {
  const cat = 2 * (t.ca ?? 0) + 2 * (t.mg ?? 0) + (t.na ?? 0) + (t.k ?? 0);
  const an = (t.alkEqL ?? 0) + (t.cl ?? 0) + 2 * (t.so4 ?? 0) + (t.no3 ?? 0) + (t.f ?? 0);
  return { cat: cat * 1000, an: an * 1000 };
}

interface IonicStrengthChoice {
  fixed: number | undefined;
  source: IonicStrengthSource;
  /** relative standard uncertainty of the estimate itself (factor, TDS relation, partial sum) */
  rel: number;
  /** for SC-based estimates, SC's own relative standard uncertainty (it moves I too) */
  scRel: number;
  factor?: { value: number; source: ConductanceFactorSource; n?: number };
  seawaterWeight?: number;
  salinity?: number;
}

function chooseIonicStrength(
  input: SampleInput,
  opts: AnalyzeOptions,
  unc: Uncertainties,
  warnings: ChemWarning[],
): IonicStrengthChoice {
  const from = opts.ionicStrengthFrom ?? 'auto';
  const site = opts.siteConductanceFactor;
  const factor = site?.factor ?? opts.conductanceFactor ?? DEFAULT_CONDUCTANCE_FACTOR;
  const factorRel = site ? site.relUncertainty : unc.conductanceFactorRel;
  const factorSource: ConductanceFactorSource = site ? 'site' : opts.conductanceFactor !== undefined && opts.conductanceFactor !== DEFAULT_CONDUCTANCE_FACTOR ? 'given' : 'generic';
  const sc = input.scUsPerCm ?? undefined;
  const need = (field: keyof SampleInput, what: string) => {
    if (input[field] === undefined || input[field] === null) {
      throw new InputError(field, `Ionic strength from ${what} needs ${field}.`);
    }
  };
  const fromSc = (): IonicStrengthChoice => {
    const e = ionicStrengthFromSpecificConductance(sc!, factor, factorRel, site !== undefined);
    // below 100 µS/cm the absolute ±5 µS/cm rules; capped at 100 % for blanks near zero
    const scRel = sc! > 0 ? Math.min(1, Math.max(unc.scRel, SC_ABS_U_US_PER_CM / sc!)) : unc.scRel;
    if (e.beyondPss78) {
      warnings.push({
        code: 'sc-beyond-salinity-scale',
        message: `SC ${sc} µS/cm is beyond the practical salinity scale (S > 42, above about ${Math.round(PSS78_MAX_SC_US_PER_CM / 1000)},000 µS/cm): a brine. Ionic strength is extrapolated; enter the major ions, or check the SC unit.`,
        field: 'scUsPerCm',
      });
    }
    return {
      fixed: e.value, source: 'conductance', rel: e.relUncertainty, scRel,
      factor: { value: factor, source: factorSource, ...(site ? { n: site.n } : {}) },
      seawaterWeight: e.seawaterWeight, salinity: e.salinity,
    };
  };
  switch (from) {
    case 'composition':
      for (const f of COMPOSITION_FIELDS) need(f, 'composition');
      return { fixed: undefined, source: 'composition', rel: 0, scRel: 0 };
    case 'conductance':
      need('scUsPerCm', 'conductance');
      return fromSc();
    case 'tds':
      need('tdsMgL', 'TDS');
      return { fixed: ionicStrengthFromTds(input.tdsMgL!), source: 'tds', rel: 0.2, scRel: 0 };
    case 'salinity':
      need('salinity', 'salinity');
      return { fixed: ionicStrengthFromSalinity(input.salinity!), source: 'salinity', rel: SALINITY_ESTIMATE_REL_UNCERTAINTY, scRel: 0, salinity: input.salinity!, seawaterWeight: 1 };
    case 'auto':
      break;
    default:
      throw new InputError('ionicStrengthFrom', `Unknown ionicStrengthFrom '${String(from)}'.`);
  }
  if (hasComposition(input)) return { fixed: undefined, source: 'composition', rel: 0, scRel: 0 };
  if (present('salinity', input.salinity) && input.salinity >= 2) {
    return { fixed: ionicStrengthFromSalinity(input.salinity), source: 'salinity', rel: SALINITY_ESTIMATE_REL_UNCERTAINTY, scRel: 0, salinity: input.salinity, seawaterWeight: 1 };
  }
  if (sc !== undefined && sc !== null) {
    const choice = fromSc();
    const w = choice.seawaterWeight ?? 0;
    const how =
      choice.factor?.source === 'site'
        ? `this site's own conductance factor (${choice.factor.n} full analyses)`
        : w >= 0.99
          ? `the practical salinity (${choice.salinity!.toFixed(1)}) in seawater proportions`
          : w > 0
            ? `specific conductance, blending the fresh-water factor with seawater proportions (salinity ${choice.salinity!.toFixed(1)})`
            : 'specific conductance';
    warnings.push({
      code: 'ionic-strength-estimated',
      message: `Ionic strength estimated from ${how} (±${Math.round(COVERAGE_FACTOR * choice.rel * 100)} %, 95 %). Enter the major ions for an exact value.`,
    });
    return choice;
  }
  if (present('tdsMgL', input.tdsMgL)) {
    warnings.push({ code: 'ionic-strength-estimated', message: 'Ionic strength estimated from TDS (±40 %, 95 %).' });
    return { fixed: ionicStrengthFromTds(input.tdsMgL), source: 'tds', rel: 0.2, scRel: 0 };
  }
  warnings.push({
    code: 'ionic-strength-partial',
    message:
      'Ionic strength computed from the few ions entered: a lower bound. Enter specific conductance for a better estimate.',
    field: 'scUsPerCm',
  });
  return { fixed: undefined, source: 'partial-composition', rel: 0.3, scRel: 0 };
}

/**
 * Fill in the major ions of a brackish water entered as field readings, in seawater proportions
 * ({@link SEAWATER_IONS_MOL_KG_S35} × S/35 × the seawater weight of the SC estimate), so that
 * speciation sees their ion pairs (MgCO₃°, NaCO₃⁻, CaSO₄° …). Ions the crew entered are kept.
 */
function impliedSeawaterIons(t: Totals, iChoice: IonicStrengthChoice): Totals | undefined {
  const w = iChoice.seawaterWeight ?? 0;
  if (w <= 0 || iChoice.salinity === undefined || iChoice.source === 'composition') return undefined;
  const scale = (w * Math.min(iChoice.salinity, 45)) / 35;
  const sw = SEAWATER_IONS_MOL_KG_S35;
  const out: Totals = { ...t };
  let added = false;
  for (const key of ['na', 'mg', 'k', 'cl', 'so4'] as const) {
    if (out[key] === undefined) {
      out[key] = sw[key] * scale;
      added = true;
    }
  }
  return added ? out : undefined;
}

interface CoreResult {
  spec: Speciation;
  siCalcite: number | undefined;
}

/** The calcite SI for given totals, pH, temperature: the quantity whose uncertainty we propagate. */
function calciteSi(spec: Speciation, lk: LogKTable): number | undefined {
  const { Ca, CO3 } = spec.logActivity;
  if (!Number.isFinite(Ca) || !Number.isFinite(CO3)) return undefined;
  return Ca + CO3 - lk.calcite;
}

function runCore(
  tempC: number,
  pH: number,
  t: Totals,
  fixedI: number | undefined,
  model: ActivityModel | 'auto',
  lk: LogKTable,
  start?: SpeciationState,
): CoreResult {
  const spec = speciate({ tempC, pH, ...t, fixedIonicStrength: fixedI, model, logK: lk, start });
  return { spec, siCalcite: calciteSi(spec, lk) };
}

/**
 * pHs: the pH at which this water, with its calcium and alkalinity held fixed, would be exactly
 * saturated with calcite (the Langelier definition, Standard Methods 2330 B, solved with the full
 * speciation instead of the simplified formula). Secant iteration on SI(pH), which rises
 * monotonically with pH up to the pH where hydroxide takes over the alkalinity. Undefined when
 * no pH up to 14 saturates the water (the caller then uses {@link langelierFormulaPhs}).
 */
function saturationPh(
  tempC: number,
  pH: number,
  si0: number,
  t: Totals,
  fixedI: number | undefined,
  model: ActivityModel | 'auto',
  lk: LogKTable,
  start?: SpeciationState,
): number | undefined {
  let x0 = pH, f0 = si0;
  let x1 = Math.min(13.5, Math.max(2, pH - si0));
  for (let i = 0; i < 30; i++) {
    const f1 = runCore(tempC, x1, t, fixedI, model, lk, start).siCalcite;
    if (f1 === undefined) return undefined;
    if (Math.abs(f1) < 1e-7) return x1;
    const slope = (f1 - f0) / (x1 - x0);
    if (!Number.isFinite(slope) || slope <= 0) return undefined;
    const x2 = Math.min(13.5, Math.max(2, x1 - f1 / slope));
    if (x2 === x1) return undefined;
    x0 = x1; f0 = f1; x1 = x2;
  }
  return undefined;
}

/**
 * pHs by the Standard Methods 2330 B formula (from memory):
 *   pHs = pK₂ − pKs + p[Ca²⁺] + p[HCO₃⁻] + 5 pfm,
 * K₂ and Ks at the water's temperature (Plummer & Busenberg 1982), [Ca²⁺] the total calcium and
 * [HCO₃⁻] the alkalinity (mol/L, eq/L), pfm = A (√I/(1 + √I) − 0.3 I) the monovalent activity
 * term (Davies). It has a number for every water with calcium and alkalinity above zero, so it
 * serves very soft water, whose pHs lies above what the full speciation can reach (hydroxide
 * takes over the alkalinity first). Valid as the classic index: a guide, not an absolute.
 */
export function langelierFormulaPhs(tempC: number, caMolL: number, alkEqL: number, ionicStrength: number): number | undefined {
  if (!(caMolL > 0) || !(alkEqL > 0)) return undefined;
  const lk = logKTable(tempC);
  const A = debyeHuckelTerms(tempC).A;
  const sqrtI = Math.sqrt(Math.max(0, ionicStrength));
  const pfm = A * (sqrtI / (1 + sqrtI) - 0.3 * Math.max(0, ionicStrength));
  return -lk.carbonic2 + lk.calcite - Math.log10(caMolL) - Math.log10(alkEqL) + 5 * pfm;
}

/** Salinity (practical) of the sample for oxygen: entered, else from SC (PSS-78 at 25 °C). */
function sampleSalinity(input: SampleInput): number {
  if (input.salinity !== undefined && input.salinity !== null) return input.salinity;
  const sc = input.scUsPerCm;
  if (sc !== undefined && sc !== null && sc > 0) return salinityFromScExtended(sc);
  return 0;
}

/**
 * Analyse one sample: ionic strength, activity model, speciation, saturation indices with an
 * uncertainty band (95 %) and its budget on calcite, CO₂ pressure, Langelier/Ryznar, hardness,
 * charge balance, calculated conductance and dissolved-oxygen saturation, plus warnings that say
 * what to check (`kind: 'action'`) or simply inform (`kind: 'notice'`).
 *
 * Throws {@link InputError} for impossible input; everything else gives warnings. Works with
 * partial input: temperature, pH, alkalinity and calcium (with SC for ionic strength) are the
 * usual field minimum for calcite.
 */
export function analyzeSample(input: SampleInput, options: AnalyzeOptions = {}): Analysis {
  validate(input);
  const model = options.activityModel ?? 'auto';
  if (model !== 'auto' && !ACTIVITY_MODELS.includes(model)) {
    throw new InputError('activityModel', `Unknown activity model '${String(model)}'.`);
  }
  const site = options.siteConductanceFactor;
  if (site !== undefined) {
    if (!(site.factor > 0 && site.factor <= 1e-4)) throw new InputError('siteConductanceFactor', 'A site conductance factor must be between 0 and 1e-4 (mol/L per µS/cm).');
    if (!(site.relUncertainty >= 0 && Number.isFinite(site.relUncertainty))) throw new InputError('siteConductanceFactor', 'A site conductance factor needs a relative uncertainty ≥ 0.');
  }
  const ev = options.evidence
    ? uncertaintiesFromEvidence(options.evidence, {
        caMgL: input.caMgL ?? undefined, alkalinityMgLCaCO3: input.alkalinityMgLCaCO3 ?? undefined, scUsPerCm: input.scUsPerCm ?? undefined,
      })
    : { uncertainty: {}, basis: {} };
  const unc: Uncertainties = { ...DEFAULT_UNCERTAINTIES, ...ev.uncertainty, ...options.uncertainty };
  for (const [k, v] of Object.entries(unc)) {
    if (!Number.isFinite(v) || v < 0) throw new InputError(`uncertainty.${k}`, `Uncertainty ${k} must be a number ≥ 0.`);
  }
  const basis: Partial<Record<UncertaintySource, UncertaintyBasis>> = { ...ev.basis };
  const given: Partial<Record<keyof Uncertainties, UncertaintySource>> = { pH: 'pH', tempC: 'temperature', scRel: 'sc', alkalinityRel: 'alkalinity', caRel: 'calcium', conductanceFactorRel: 'ionic-strength' };
  for (const k of Object.keys(options.uncertainty ?? {}) as Array<keyof Uncertainties>) basis[given[k]!] = 'given';

  const warnings: ChemWarning[] = [];
  const tempC = input.tempC;
  const t = totalsOf(input);
  const lk = logKTable(tempC);

  rangeWarnings(input, t, warnings);

  const iChoice = chooseIonicStrength(input, options, unc, warnings);
  const sc = input.scUsPerCm ?? undefined;
  const iFromSc =
    sc !== undefined ? (iChoice.source === 'conductance' ? iChoice.fixed : ionicStrengthFromSpecificConductance(sc, site?.factor ?? options.conductanceFactor ?? DEFAULT_CONDUCTANCE_FACTOR, unc.conductanceFactorRel, site !== undefined).value) : undefined;

  const result: Analysis = {
    engineVersion: ENGINE_VERSION,
    tempC,
    ionicStrength: { value: iChoice.fixed, source: iChoice.source, relUncertainty: iChoice.rel },
    activityModel: model === 'auto' ? 'extended-debye-huckel' : model,
    saturationIndex: {},
    calciteState: 'unknown',
    warnings,
  };
  if (iFromSc !== undefined) result.ionicStrength.fromConductance = iFromSc;
  if (iChoice.factor) result.ionicStrength.conductanceFactor = iChoice.factor;
  if (iChoice.seawaterWeight !== undefined && iChoice.source === 'conductance') result.ionicStrength.seawaterWeight = iChoice.seawaterWeight;

  // Hardness (Standard Methods 2340 B): mg/L as CaCO3 = 2.497 Ca + 4.118 Mg.
  if (present('caMgL', input.caMgL)) {
    result.calciumHardnessMgLCaCO3 = 2.497 * input.caMgL;
    if (present('mgMgL', input.mgMgL)) result.hardnessMgLCaCO3 = 2.497 * input.caMgL + 4.118 * input.mgMgL;
  }

  // Charge balance and calculated SC need the full set of major ions.
  if (hasComposition(input)) {
    const { cat, an } = ionsForBalance(t);
    const cb = chargeBalance(cat, an);
    result.chargeBalance = cb;
    result.chargeBalancePercent = cb.percent;
    if (!cb.acceptable) {
      warnings.push({
        code: 'charge-balance',
        message: `Anion–cation balance ${cb.percent.toFixed(1)} % fails Standard Methods 1030 E (${cb.criterion}). Check the ion results and their units, or a missing ion.`,
      });
    }
  }

  // Brackish water from field readings: the major ions implied by seawater proportions pair with Ca and CO3.
  const implied = impliedSeawaterIons(t, iChoice);
  const ts = implied ?? t;
  if (implied) {
    result.impliedSeawaterIonsMgL = {
      naMgL: (implied.na ?? 0) * MG_PER_MOL.na, mgMgL: (implied.mg ?? 0) * MG_PER_MOL.mg, kMgL: (implied.k ?? 0) * MG_PER_MOL.k,
      clMgL: (implied.cl ?? 0) * MG_PER_MOL.cl, so4MgL: (implied.so4 ?? 0) * MG_PER_MOL.so4,
    };
    warnings.push({
      code: 'seawater-ions-implied',
      message: `Brackish water: the major ions not entered were taken in seawater proportions (salinity ${iChoice.salinity!.toFixed(1)}) for ion pairing. Enter the lab's major ions for an exact result.`,
    });
  }

  // Speciation needs pH; without it, ionic strength can still be reported.
  const pH = input.pH ?? undefined;
  let spec: Speciation | undefined;
  if (pH !== undefined) {
    const core = runCore(tempC, pH, ts, iChoice.fixed, model, lk);
    spec = core.spec;
    result.speciation = { converged: spec.converged, iterations: spec.iterations };
    result.activityModel = spec.model;
    if (model === 'auto' && spec.tjWeight > 0 && spec.tjWeight < 1) result.activityModelBlend = { truesdellJonesWeight: spec.tjWeight };
    result.ionicStrength.value = spec.ionicStrength;
    if (!spec.converged) {
      warnings.push({
        code: 'speciation-not-converged',
        message: `Speciation did not converge in ${spec.iterations} passes: treat the indices as rough. Check for a unit slip in the ions.`,
      });
    }
    const la = spec.logActivity;
    const fin = (x: number) => Number.isFinite(x);
    if (core.siCalcite !== undefined) {
      result.saturationIndex.calcite = core.siCalcite;
      result.saturationIndex.aragonite = la.Ca + la.CO3 - lk.aragonite;
      if (fin(la.Mg) && t.mg !== undefined) result.saturationIndex.dolomite = la.Ca + la.Mg + 2 * la.CO3 - lk.dolomite;
    }
    if (fin(la.Ca) && fin(la.SO4) && t.so4 !== undefined) result.saturationIndex.gypsum = la.Ca + la.SO4 - lk.gypsum;
    if (t.alkEqL !== undefined && fin(la.H2CO3)) {
      result.logPco2 = la.H2CO3 - lk.co2Henry;
      const c = spec.conc;
      result.carbonate = {
        dicMmolL: spec.dicMolL * 1000,
        co2AqMmolL: c.H2CO3 * 1000,
        hco3MmolL: c.HCO3 * 1000,
        co3MmolL: c.CO3 * 1000,
        hco3MgL: c.HCO3 * SPECIES.HCO3.molarMass * 1000,
        co3MgL: c.CO3 * SPECIES.CO3.molarMass * 1000,
      };
    }
    if (t.alkEqL !== undefined && t.alkEqL > 0 && pH < ALKALINITY_ENDPOINT_PH) {
      warnings.push({
        code: 'alkalinity-inconsistent-with-ph',
        message: `Alkalinity ${input.alkalinityMgLCaCO3} mg/L as CaCO₃ is inconsistent with pH ${pH}: below pH ${ALKALINITY_ENDPOINT_PH} water has no carbonate alkalinity, so the carbonate results rest on noise. Re-check the pH (calibration) or enter alkalinity 0.`,
        field: 'alkalinityMgLCaCO3',
      });
    } else if (spec.alkalinityBelowNoncarbonate) {
      warnings.push({
        code: 'alkalinity-noncarbonate',
        message:
          'The alkalinity entered is smaller than the hydroxide/silicate part alone at this pH: carbonate species were set to zero. Check pH and alkalinity.',
        field: 'alkalinityMgLCaCO3',
      });
    } else if (pH > 9 && t.alkEqL !== undefined) {
      warnings.push({
        code: 'alkalinity-noncarbonate',
        kind: 'notice',
        message:
          'Above pH 9, borate, silicate and organic bases may carry part of the alkalinity; the carbonate species may be overstated. Enter silica if known.',
        field: 'alkalinityMgLCaCO3',
      });
    }
    if (core.siCalcite !== undefined) {
      const pHs = saturationPh(tempC, pH, core.siCalcite, ts, iChoice.fixed, model, lk, spec.state);
      if (pHs !== undefined) result.langelier = { pHs, lsi: pH - pHs, rsi: 2 * pHs - pH, method: 'speciation' };
    }
    if (!result.langelier && t.ca !== undefined && t.alkEqL !== undefined) {
      const pHs = langelierFormulaPhs(tempC, t.ca, t.alkEqL, spec.ionicStrength);
      if (pHs !== undefined) {
        result.langelier = { pHs, lsi: pH - pHs, rsi: 2 * pHs - pH, method: 'sm-2330-formula' };
        warnings.push({
          code: 'langelier-formula',
          kind: 'notice',
          message: `No pH below 14 saturates this water with calcite (too little calcium or alkalinity): the Langelier index uses the Standard Methods 2330 formula, pHs ${pHs.toFixed(1)}.`,
        });
      } else {
        warnings.push({ code: 'langelier-needs-inputs', kind: 'notice', message: 'No Langelier index: it needs calcium and alkalinity above zero.' });
      }
    }
  } else {
    // Gypsum needs no pH: Ca²⁺ and SO₄²⁻ activities barely depend on it (HSO₄⁻ and CaOH⁺ are negligible at pH 5–9).
    if (t.ca !== undefined && t.so4 !== undefined) {
      const g = speciate({ tempC, pH: 7, ...ts, alkEqL: undefined, fixedIonicStrength: iChoice.fixed, model, logK: lk });
      const la = g.logActivity;
      if (Number.isFinite(la.Ca) && Number.isFinite(la.SO4)) {
        result.saturationIndex.gypsum = la.Ca + la.SO4 - lk.gypsum;
        result.activityModel = g.model;
        if (result.ionicStrength.value === undefined) result.ionicStrength.value = g.ionicStrength;
        warnings.push({ code: 'gypsum-without-ph', kind: 'notice', message: 'Gypsum SI computed without pH (it changes by less than 0.01 between pH 5 and 9, carbonate pairs left out).' });
      }
    }
    warnings.push({ code: 'calcite-needs-inputs', message: 'Enter pH to compute the calcite state and CO₂ pressure.', field: 'pH' });
  }

  // ionic strength without speciation (no pH): fixed estimate or partial sum of totals
  if (result.ionicStrength.value === undefined) {
    const { cat, an } = ionsForBalance(t);
    const partial =
      0.5 * (4 * (t.ca ?? 0) + 4 * (t.mg ?? 0) + (t.na ?? 0) + (t.k ?? 0) + (t.cl ?? 0) + 4 * (t.so4 ?? 0) + (t.no3 ?? 0) + (t.f ?? 0) + (t.alkEqL ?? 0));
    if (cat + an > 0) result.ionicStrength.value = partial;
    else {
      result.ionicStrength.source = 'none';
      warnings.push({
        code: 'ionic-strength-unknown',
        message: 'No ionic strength: enter specific conductance or the major ions.',
        field: 'scUsPerCm',
      });
    }
  }

  modelRangeWarning(result, t, model, warnings);

  // Calculated conductance from the speciated full analysis, and the SC cross-check.
  if (hasComposition(input) && pH !== undefined && spec) {
    const c = spec.conc;
    const charged: Partial<Record<Ion, number>> = {};
    for (const ion of Object.keys(SPECIES) as Ion[]) if (c[ion] !== undefined) charged[ion] = c[ion];
    result.calculatedScUsPerCm = calculatedConductance(charged);
  }
  scCrossCheck(input, t, result, warnings);
  unitSlipWarnings(input, t, warnings);

  // Uncertainty band on calcite SI, its budget, and the crew's flag.
  if (result.saturationIndex.calcite !== undefined && pH !== undefined && spec) {
    const si = result.saturationIndex.calcite;
    const budget = calciteBudget(input, ts, pH, si, spec, iChoice, model, lk, unc, basis);
    const uc = Math.sqrt(budget.reduce((s, b) => s + b.u * b.u, 0));
    const U = COVERAGE_FACTOR * uc;
    result.calciteSiUncertainty = U;
    result.calciteSiStandardUncertainty = uc;
    result.calciteSiCoverageFactor = COVERAGE_FACTOR;
    result.calciteSiBudget = budget;
    result.calciteState = si - U > 0 ? 'supersaturated' : si + U < 0 ? 'undersaturated' : 'near-equilibrium';
    siExtremeWarning(si, input, warnings);
  } else {
    const missing = [
      pH === undefined ? 'pH' : null,
      t.alkEqL === undefined ? 'alkalinity' : null,
      t.ca === undefined ? 'calcium' : null,
    ].filter(Boolean);
    if (missing.length > 0 && pH !== undefined) {
      warnings.push({ code: 'calcite-needs-inputs', message: `For the calcite state, enter ${missing.join(' and ')}.` });
    }
  }

  if (result.logPco2 !== undefined) pco2Warnings(result.logPco2, result.saturationIndex.calcite, warnings);

  oxygen(input, result, warnings);

  const used: Reaction[] = ['water', 'carbonic1', 'carbonic2', 'calcite', 'co2Henry', 'dolomite', 'gypsum'];
  const extrap = used.filter((r) => isExtrapolated(r, tempC));
  if (extrap.length > 0 && pH !== undefined) {
    warnings.push({
      code: 'constants-extrapolated',
      message: `At ${tempC} °C the constants for ${extrap.map((r) => REACTIONS[r].equation).join('; ')} are extrapolated beyond their published range.`,
      field: 'tempC',
    });
  }
  for (const w of warnings) w.kind ??= NOTICE_CODES.has(w.code) ? 'notice' : 'action';
  return result;
}

/** Standing notices: information, nothing to do at the bank. Everything else asks for an action. */
const NOTICE_CODES = new Set<string>([
  'ionic-strength-estimated', 'ionic-strength-partial', 'si-will-rise-downstream', 'constants-extrapolated', 'seawater-ions-implied',
  'calcite-needs-inputs', 'oxygen-pressure-assumed', 'langelier-formula', 'gypsum-without-ph',
]);

function modelName(m: ActivityModel): string {
  return {
    'debye-huckel': 'Debye–Hückel limiting law',
    'extended-debye-huckel': 'extended Debye–Hückel equation',
    davies: 'Davies equation',
    'truesdell-jones': 'Truesdell–Jones equation',
  }[m];
}

/**
 * Truesdell–Jones fits NaCl-type water to about 2 mol/L but sulfate-rich water much less far:
 * its Na₂SO₄ and MgSO₄ mean activity coefficients drift from the tables (Robinson & Stokes 1959,
 * from memory) by more than 10 % above I ≈ 0.5 (our reading). Sulfate-rich: sulfate carries
 * over a quarter of the anion equivalents (our threshold).
 */
export const SULFATE_RICH_MAX_IONIC_STRENGTH = 0.5;

function modelRangeWarning(result: Analysis, t: Totals, requested: ActivityModel | 'auto', warnings: ChemWarning[]): void {
  const I = result.ionicStrength.value;
  if (I === undefined) return;
  const m = result.activityModel;
  let limit = MODEL_MAX_IONIC_STRENGTH[m];
  const anEq = (t.alkEqL ?? 0) + (t.cl ?? 0) + 2 * (t.so4 ?? 0) + (t.no3 ?? 0) + (t.f ?? 0);
  const sulfateRich = t.so4 !== undefined && anEq > 0 && (2 * t.so4) / anEq > 0.25;
  if (sulfateRich && (m === 'truesdell-jones' || (requested === 'auto' && autoTjWeight(I) > 0))) limit = Math.min(limit, SULFATE_RICH_MAX_IONIC_STRENGTH);
  if (I > limit) {
    warnings.push({
      code: 'activity-model-out-of-range',
      message: `Ionic strength ${I.toPrecision(3)} mol/L is beyond the range of the ${modelName(m)} (≤ ${limit} mol/L${sulfateRich && limit === SULFATE_RICH_MAX_IONIC_STRENGTH ? ' in sulfate-rich water' : ''}): activities and indices are extrapolated and the band includes only part of that doubt. ${I > 2 || sulfateRich ? 'A specific-interaction (Pitzer) model is needed for this water.' : 'Choose a model valid at this ionic strength.'}`,
    });
  }
}

function rangeWarnings(input: SampleInput, t: Totals, warnings: ChemWarning[]): void {
  // Range checks for natural waters (common practice; ../references/field-practice.md §6).
  if (input.tempC < -0.5 || input.tempC > 40) {
    warnings.push({
      code: 'temperature-unusual',
      message: `Water temperature ${input.tempC} °C is outside −0.5 to 40 °C: a hot spring, or a probe reading air? Check the sensor.`,
      field: 'tempC',
    });
  }
  const pH = input.pH;
  if (pH !== undefined && pH !== null && (pH < 5 || pH > 9.5)) {
    const natural = pH >= 3.5 && pH < 5 && (t.alkEqL === undefined || t.alkEqL * 50043 < 5);
    warnings.push({
      code: 'ph-unusual',
      kind: natural ? 'notice' : 'action',
      message: natural
        ? `pH ${pH}: acidic, as in peat and bog water or acid drainage.`
        : `pH ${pH} is outside 5–9.5, unusual for streams and springs: re-check against a buffer, then re-measure.`,
      field: 'pH',
    });
  }
  const sc = input.scUsPerCm;
  if (sc !== undefined && sc !== null && sc < 5) {
    // Very low SC is natural for a field blank, deionised water or snowmelt: only the ions entered
    // can show a unit slip (scCrossCheck), so this is a notice, not a unit alarm.
    warnings.push({
      code: 'sc-unusual',
      kind: 'notice',
      message: `Specific conductance ${sc} µS/cm is as low as deionised water or a field blank.`,
      field: 'scUsPerCm',
    });
  }
}

function siExtremeWarning(si: number, input: SampleInput, warnings: ChemWarning[]): void {
  if (si >= -3 && si <= 2) return;
  // Far below saturation is natural for soft or acidic water (peat streams, rain-fed uplands):
  // no unit alarm when calcium or alkalinity is low or the pH is acid (common practice).
  const soft = (input.caMgL ?? 0) < 10 || (input.alkalinityMgLCaCO3 ?? 0) < 20 || (input.pH ?? 7) < 6;
  if (si < -3 && soft) {
    warnings.push({
      code: 'si-extreme',
      kind: 'notice',
      message: `Calcite SI ${si.toFixed(2)}: far below saturation, as soft or acidic water is. The water dissolves carbonate readily.`,
    });
    return;
  }
  warnings.push({
    code: 'si-extreme',
    message: `Calcite SI ${si.toFixed(2)} is outside the usual −3 to +2: check pH calibration, alkalinity and calcium units before trusting it.`,
  });
}

function scCrossCheck(input: SampleInput, t: Totals, result: Analysis, warnings: ChemWarning[]): void {
  const sc = input.scUsPerCm;
  if (sc === undefined || sc === null) return;
  const calc = result.calculatedScUsPerCm;
  if (calc !== undefined && sc > 0) {
    const ratio = calc / sc;
    if (ratio > 20 || ratio < 0.05) {
      warnings.push({
        code: 'possible-unit-slip',
        message: `Measured SC (${sc} µS/cm) and the ions (≈ ${Math.round(calc)} µS/cm) differ ${ratio > 1 ? Math.round(ratio) : Math.round(1 / ratio)}-fold: a unit slip (mS/cm for µS/cm, or mmol/L for mg/L) is likely.`,
        field: 'scUsPerCm',
      });
    } else if (ratio < 0.8 || ratio > 1.25) {
      warnings.push({
        code: 'sc-ion-mismatch',
        message: `Calculated SC from the ions is ${Math.round(ratio * 100)} % of the measured SC (Standard Methods 1030 E expects 90–110 %): check the ions, a missing ion, or the SC calibration.`,
        field: 'scUsPerCm',
      });
    }
    return;
  }
  // Partial ions: the cation sum cannot exceed what SC allows (≈ SC/100 meq/L; common practice).
  const { cat, an } = ionsForBalance(t);
  const allowed = sc / 100;
  const worst = Math.max(cat, an);
  if (worst > 0 && allowed >= 0) {
    if (worst > 20 * Math.max(allowed, 0.01)) {
      warnings.push({
        code: 'possible-unit-slip',
        message: `The ions entered add up to ${worst.toFixed(2)} meq/L, far more than an SC of ${sc} µS/cm allows (about ${allowed.toFixed(2)} meq/L): check for mS/cm entered as µS/cm, or mmol/L vs mg/L.`,
        field: 'scUsPerCm',
      });
    } else if (worst > 1.5 * allowed) {
      warnings.push({
        code: 'sc-ion-mismatch',
        message: `The ions entered (${worst.toFixed(2)} meq/L) exceed what SC ${sc} µS/cm allows (about ${allowed.toFixed(2)} meq/L): re-check the SC reading and the ion units.`,
        field: 'scUsPerCm',
      });
    }
  }
}

/**
 * The two commonest unit slips at the bank, caught against SC (≈ SC/100 meq/L of cations and of
 * anions; Standard Methods 1030 E, common practice):
 * - calcium typed in mmol/L (or meq/L) into a mg/L field: calcium carries under 5 % of the
 *   cations SC allows while the same number read as mmol/L would carry 15–110 % of them and
 *   0.3–2× the alkalinity's equivalents (calcium–bicarbonate water, where the slip matters),
 *   and neither sodium nor magnesium was entered to carry the rest (sodium waters stay quiet);
 * - alkalinity typed in meq/L into a mg/L-as-CaCO₃ field: at pH ≥ 7 (where bicarbonate is the
 *   main anion) it carries under 5 % of the anions SC allows, while read as meq/L it would carry
 *   15–110 % (and 0.3–3× the calcium's equivalents when calcium is entered), and neither chloride
 *   nor sulfate was entered to carry the rest.
 * Waters with SC below 30 µS/cm are left alone (blanks, snowmelt: too little to judge).
 */
function unitSlipWarnings(input: SampleInput, t: Totals, warnings: ChemWarning[]): void {
  const sc = input.scUsPerCm;
  if (sc === undefined || sc === null || sc < 30) return;
  const meq = sc / 100;
  const ca = input.caMgL;
  if (ca !== undefined && ca !== null && ca > 0 && t.na === undefined && t.mg === undefined) {
    const asMg = (2 * ca) / SPECIES.Ca.molarMass; // meq/L if mg/L
    const asMmol = 2 * ca; // meq/L if mmol/L
    // and read as mmol/L it pairs with the alkalinity as in calcium–bicarbonate water (0.3–2×)
    const alkMeq = t.alkEqL !== undefined ? t.alkEqL * 1000 : undefined;
    const pairs = alkMeq !== undefined && asMmol >= 0.3 * alkMeq && asMmol <= 2 * alkMeq;
    if (pairs && asMg < 0.05 * meq && asMmol >= 0.15 * meq && asMmol <= 1.1 * meq) {
      warnings.push({
        code: 'unit-slip-calcium',
        message: `Calcium ${ca} mg/L is far too little for SC ${sc} µS/cm, but ${ca} mmol/L (${Math.round(ca * SPECIES.Ca.molarMass)} mg/L) or ${ca} meq/L (${Math.round((ca * SPECIES.Ca.molarMass) / 2)} mg/L) would fit: was it entered in mmol/L or meq/L? Enter calcium in mg/L.`,
        field: 'caMgL',
      });
    }
  }
  const alk = input.alkalinityMgLCaCO3;
  const pH = input.pH;
  if (alk !== undefined && alk !== null && alk > 0 && pH !== undefined && pH !== null && pH >= 7 && t.cl === undefined && t.so4 === undefined) {
    const asMg = alk / MG_CACO3_PER_MEQ; // meq/L if mg/L as CaCO3
    // with calcium entered, read as meq/L it must pair with it as in calcium–bicarbonate water (0.3–3×)
    const caMeq = t.ca !== undefined ? 2000 * t.ca : undefined;
    const pairs = caMeq === undefined || (alk >= 0.3 * caMeq && alk <= 3 * caMeq);
    if (pairs && asMg < 0.05 * meq && alk >= 0.15 * meq && alk <= 1.1 * meq) {
      warnings.push({
        code: 'unit-slip-alkalinity',
        message: `Alkalinity ${alk} mg/L as CaCO₃ is far too little for SC ${sc} µS/cm at pH ${pH}, but ${alk} meq/L (${Math.round(alk * MG_CACO3_PER_MEQ)} mg/L as CaCO₃) would fit: was it entered in meq/L? Enter alkalinity in mg/L as CaCO₃.`,
        field: 'alkalinityMgLCaCO3',
      });
    }
  }
}

function pco2Warnings(logPco2: number, si: number | undefined, warnings: ChemWarning[]): void {
  if (logPco2 < ATMOSPHERIC_LOG_PCO2 - 0.1) {
    warnings.push({
      code: 'pco2-below-atmosphere',
      message: `log pCO₂ ${logPco2.toFixed(2)} is below the atmosphere's (${ATMOSPHERIC_LOG_PCO2.toFixed(2)}): photosynthesis in a sunny pool, or a pH reading too high. Re-check pH if the water is not plant-rich.`,
    });
  } else if (logPco2 > -1.5) {
    warnings.push({
      code: 'pco2-high',
      message: `log pCO₂ ${logPco2.toFixed(2)} is above −1.5, very high for surface water: check pH and alkalinity (possible for some springs and wells).`,
    });
  }
  if (logPco2 > ATMOSPHERIC_LOG_PCO2 + 0.5) {
    const times = Math.pow(10, logPco2 - ATMOSPHERIC_LOG_PCO2);
    warnings.push({
      code: 'si-will-rise-downstream',
      message: `The water holds ${times < 1e6 ? Math.round(times) : times.toExponential(0)}× the atmosphere's CO₂: as it degasses downstream, pH${si !== undefined ? ' and calcite SI' : ''} will tend to rise.`,
    });
  }
}

/**
 * Dissolved-oxygen saturation for the sample's own temperature, salinity (entered, else PSS-78
 * from SC) and pressure (entered, else the sea-level standard with a notice), by Benson & Krause
 * ({@link oxygenSaturationMgL}). Outside 0–40 °C or 50.7–111.5 kPa, no result and a warning.
 */
function oxygen(input: SampleInput, result: Analysis, warnings: ChemWarning[]): void {
  const hasMgL = input.doMgL !== undefined && input.doMgL !== null;
  const hasPct = input.doPercent !== undefined && input.doPercent !== null;
  if (!hasMgL && !hasPct) return;
  const tempC = input.tempC;
  const pressureKPa = input.pressureKPa ?? STANDARD_PRESSURE_KPA;
  if (tempC < 0 || tempC > 40 || pressureKPa < 50.7 || pressureKPa > 111.5) {
    warnings.push({
      code: 'oxygen-out-of-range',
      message: `No oxygen saturation: Benson & Krause hold for 0–40 °C and 50.7–111.5 kPa (here ${tempC} °C, ${pressureKPa} kPa).`,
      field: tempC < 0 || tempC > 40 ? 'tempC' : 'pressureKPa',
    });
    return;
  }
  const salinity = Math.min(sampleSalinity(input), 40);
  const saturationMgL = oxygenSaturationMgL(tempC, pressureKPa, salinity);
  const doMgL = hasMgL ? input.doMgL! : (input.doPercent! / 100) * saturationMgL;
  result.oxygen = { saturationMgL, percentSaturation: (100 * doMgL) / saturationMgL, doMgL, salinity, pressureKPa };
  if (input.pressureKPa === undefined || input.pressureKPa === null) {
    warnings.push({
      code: 'oxygen-pressure-assumed',
      message: 'Oxygen saturation at sea-level pressure (101.3 kPa): enter the barometric pressure for the site’s own.',
      field: 'pressureKPa',
    });
  }
}

/**
 * Budget of the calcite SI band: each source's standard-uncertainty contribution by finite
 * differences (GUM, JCGM 100:2008 §5.1.3), from the base solution (warm start):
 * pH, temperature, alkalinity, calcium; for an estimated ionic strength the SI's sensitivity to
 * ln I times SC's and the estimate's own relative uncertainties; log K of calcite (direct),
 * K₂ and the CaHCO₃⁺/CaCO₃° pairs (one perturbation each, {@link LOG_K_UNCERTAINTY}); and the
 * activity model's doubt at the final I ({@link activityModelDoubt}).
 */
function calciteBudget(
  input: SampleInput,
  t: Totals,
  pH: number,
  si: number,
  spec: Speciation,
  iChoice: IonicStrengthChoice,
  model: ActivityModel | 'auto',
  lk: LogKTable,
  unc: Uncertainties,
  basis: Partial<Record<UncertaintySource, UncertaintyBasis>>,
): BudgetEntry[] {
  const tempC = input.tempC;
  const start = spec.state;
  const d = (v: number | undefined) => (v !== undefined && Number.isFinite(v) ? Math.abs(v - si) : 0);
  const out: Array<{ source: UncertaintySource; u: number; basis: UncertaintyBasis }> = [];
  const b = (s: UncertaintySource): UncertaintyBasis => basis[s] ?? 'default';

  const pHp = pH + unc.pH <= 14 ? pH + unc.pH : pH - unc.pH;
  out.push({ source: 'pH', u: d(runCore(tempC, pHp, t, iChoice.fixed, model, lk, start).siCalcite), basis: b('pH') });
  if (unc.tempC > 0) {
    const tp = tempC + unc.tempC <= 100 ? tempC + unc.tempC : tempC - unc.tempC;
    out.push({ source: 'temperature', u: d(runCore(tp, pH, t, iChoice.fixed, model, logKTable(tp), start).siCalcite), basis: b('temperature') });
  }
  if (t.alkEqL !== undefined && unc.alkalinityRel > 0) {
    out.push({ source: 'alkalinity', u: d(runCore(tempC, pH, { ...t, alkEqL: t.alkEqL * (1 + unc.alkalinityRel) }, iChoice.fixed, model, lk, start).siCalcite), basis: b('alkalinity') });
  }
  if (t.ca !== undefined && unc.caRel > 0) {
    out.push({ source: 'calcium', u: d(runCore(tempC, pH, { ...t, ca: t.ca * (1 + unc.caRel) }, iChoice.fixed, model, lk, start).siCalcite), basis: b('calcium') });
  }
  // Estimated ionic strength: one perturbation gives dSI/d ln I; SC and the estimate share it.
  const iBase = iChoice.fixed ?? (iChoice.source === 'partial-composition' ? spec.ionicStrength : undefined);
  if (iBase !== undefined && iBase > 0 && (iChoice.rel > 0 || iChoice.scRel > 0)) {
    const step = 0.1;
    const slope = d(runCore(tempC, pH, t, iBase * (1 + step), model, lk, start).siCalcite) / Math.log(1 + step);
    if (iChoice.scRel > 0) out.push({ source: 'sc', u: slope * iChoice.scRel, basis: b('sc') });
    if (iChoice.rel > 0) {
      const ib: UncertaintyBasis = iChoice.factor?.source === 'site' ? 'site-factor' : basis['ionic-strength'] ?? 'estimate';
      out.push({ source: 'ionic-strength', u: slope * iChoice.rel, basis: ib });
    }
  }
  // Constants: calcite directly; K2 and the calcium carbonate pairs through the speciation.
  const shifted = (changes: Partial<Record<keyof LogKTable, number>>): LogKTable => {
    const copy = { ...lk };
    for (const [k, v] of Object.entries(changes) as Array<[keyof LogKTable, number]>) copy[k] += v;
    return copy;
  };
  const U = LOG_K_UNCERTAINTY;
  const k2 = runCore(tempC, pH, t, iChoice.fixed, model, shifted({ carbonic2: U.carbonic2 }), start);
  const pairs = runCore(tempC, pH, t, iChoice.fixed, model, shifted({ CaHCO3: U.CaHCO3, CaCO3aq: U.CaCO3aq }), start);
  const k2Si = k2.spec.logActivity.Ca + k2.spec.logActivity.CO3 - lk.calcite;
  const pairSi = pairs.spec.logActivity.Ca + pairs.spec.logActivity.CO3 - lk.calcite;
  out.push({ source: 'log-k', u: Math.hypot(U.calcite, d(k2Si), d(pairSi)), basis: 'default' });
  const doubt = activityModelDoubt([['Ca', 1], ['CO3', 1]], spec.ionicStrength, debyeHuckelTerms(tempC), model);
  out.push({ source: 'activity-model', u: doubt, basis: 'default' });
  return makeBudget(out);
}
