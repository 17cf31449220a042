import { ACTIVITY_MODELS, MODEL_MAX_IONIC_STRENGTH, type ActivityModel } from './activity';
import { chargeBalance, type ChargeBalance } from './balance';
import { calculatedConductance } from './conductance';
import { isExtrapolated, logKTable, REACTIONS, type LogKTable, type Reaction } from './equilibrium';
import { InputError, present, requireNonNegative, requireRange, type ChemWarning } from './errors';
import {
  CONDUCTANCE_ESTIMATE_REL_UNCERTAINTY,
  DEFAULT_CONDUCTANCE_FACTOR,
  ionicStrengthFromConductance,
  ionicStrengthFromSalinity,
  ionicStrengthFromTds,
} from './ionic-strength';
import { MG_CACO3_PER_MEQ, MOLAR_MASS, SPECIES, type Ion } from './species';
import { salinityFromSpecificConductance } from './salinity';
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
}

export type IonicStrengthSource = 'composition' | 'conductance' | 'tds' | 'salinity' | 'partial-composition' | 'none';

/** Measurement uncertainties, as ± half-widths: absolute for pH and temperature, relative (fraction) otherwise. */
export interface Uncertainties {
  pH: number;
  tempC: number;
  scRel: number;
  alkalinityRel: number;
  caRel: number;
  /** relative uncertainty of the SC → I estimate itself */
  conductanceFactorRel: number;
}

/**
 * Defaults of common field meters and kits (common practice; manufacturers' specifications for
 * field multiparameter meters are typically pH ±0.05–0.2, temperature ±0.1–0.2 °C, SC ±0.5–3 %;
 * titration and kit results ±5 %). The SC → I factor's own uncertainty is from our real-data test.
 */
export const DEFAULT_UNCERTAINTIES: Uncertainties = {
  pH: 0.05,
  tempC: 0.2,
  scRel: 0.03,
  alkalinityRel: 0.05,
  caRel: 0.05,
  conductanceFactorRel: CONDUCTANCE_ESTIMATE_REL_UNCERTAINTY,
};

export interface AnalyzeOptions {
  activityModel?: ActivityModel | 'auto';
  ionicStrengthFrom?: 'auto' | 'composition' | 'conductance' | 'tds' | 'salinity';
  /** (mol/L)/(µS/cm); default {@link DEFAULT_CONDUCTANCE_FACTOR} */
  conductanceFactor?: number;
  uncertainty?: Partial<Uncertainties>;
}

export type CalciteState = 'undersaturated' | 'near-equilibrium' | 'supersaturated' | 'unknown';

export interface Analysis {
  engineVersion: string;
  tempC: number;
  ionicStrength: {
    /** mol/L; undefined only when nothing allows an estimate */
    value: number | undefined;
    source: IonicStrengthSource;
    /** relative uncertainty of the value as a ± fraction (0 when computed from a full analysis) */
    relUncertainty: number;
    /** the SC-based estimate, when SC is known, for comparison */
    fromConductance?: number;
  };
  /** the activity model applied */
  activityModel: ActivityModel;
  speciation?: { converged: boolean; iterations: number };
  saturationIndex: { calcite?: number; aragonite?: number; dolomite?: number; gypsum?: number };
  /** ± half-width on calcite SI from the measurement uncertainties */
  calciteSiUncertainty?: number;
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
  /** Langelier saturation index (pH − pHs), pHs and Ryznar stability index (2 pHs − pH) */
  langelier?: { pHs: number; lsi: number; rsi: number };
  hardnessMgLCaCO3?: number;
  calciumHardnessMgLCaCO3?: number;
  chargeBalancePercent?: number;
  chargeBalance?: ChargeBalance;
  calculatedScUsPerCm?: number;
  warnings: ChemWarning[];
}

/**
 * Above this SC (µS/cm at 25 °C, about practical salinity 3) the fresh-water SC factor no longer
 * holds and 'auto' estimates ionic strength through PSS-78 salinity instead (our choice).
 */
export const BRACKISH_SC_US_PER_CM = 5000;

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

function validate(input: SampleInput): void {
  if (input === null || typeof input !== 'object') throw new InputError('input', 'analyzeSample needs an input object.');
  if (!present('tempC', input.tempC)) throw new InputError('tempC', 'Water temperature (tempC) is required.');
  requireRange('tempC', input.tempC, -2, 100, '°C');
  if (present('pH', input.pH)) requireRange('pH', input.pH, 0, 14, '');
  if (present('salinity', input.salinity)) requireRange('salinity', input.salinity, 0, 45, '');
  const conc: Array<keyof SampleInput> = [
    'scUsPerCm', 'tdsMgL', 'alkalinityMgLCaCO3', 'caMgL', 'mgMgL', 'naMgL', 'kMgL', 'clMgL', 'so4MgL', 'no3NMgL', 'fMgL', 'sio2MgL',
  ];
  for (const f of conc) {
    const v = input[f];
    if (present(f, v)) {
      requireNonNegative(f, v);
      if (v > 500_000) throw new InputError(f, `${f} = ${v} is beyond any natural water (over 500,000).`);
    }
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
  rel: number;
}

function chooseIonicStrength(
  input: SampleInput,
  opts: AnalyzeOptions,
  unc: Uncertainties,
  warnings: ChemWarning[],
): IonicStrengthChoice {
  const from = opts.ionicStrengthFrom ?? 'auto';
  const factor = opts.conductanceFactor ?? DEFAULT_CONDUCTANCE_FACTOR;
  const sc = input.scUsPerCm ?? undefined;
  const need = (field: keyof SampleInput, what: string) => {
    if (input[field] === undefined || input[field] === null) {
      throw new InputError(field, `Ionic strength from ${what} needs ${field}.`);
    }
  };
  const fromSc = (): IonicStrengthChoice => ({
    fixed: ionicStrengthFromConductance(sc!, factor),
    source: 'conductance',
    rel: Math.hypot(unc.conductanceFactorRel, unc.scRel),
  });
  switch (from) {
    case 'composition':
      for (const f of COMPOSITION_FIELDS) need(f, 'composition');
      return { fixed: undefined, source: 'composition', rel: 0 };
    case 'conductance':
      need('scUsPerCm', 'conductance');
      return fromSc();
    case 'tds':
      need('tdsMgL', 'TDS');
      return { fixed: ionicStrengthFromTds(input.tdsMgL!), source: 'tds', rel: 0.3 };
    case 'salinity':
      need('salinity', 'salinity');
      return { fixed: ionicStrengthFromSalinity(input.salinity!), source: 'salinity', rel: 0.05 };
    case 'auto':
      break;
    default:
      throw new InputError('ionicStrengthFrom', `Unknown ionicStrengthFrom '${String(from)}'.`);
  }
  if (hasComposition(input)) return { fixed: undefined, source: 'composition', rel: 0 };
  if (present('salinity', input.salinity) && input.salinity >= 2) {
    return { fixed: ionicStrengthFromSalinity(input.salinity), source: 'salinity', rel: 0.05 };
  }
  if (sc !== undefined && sc !== null && sc >= BRACKISH_SC_US_PER_CM) {
    // Brackish water: practical salinity from SC (PSS-78 at 25 °C), then I for seawater proportions.
    const { salinity } = salinityFromSpecificConductance(sc);
    warnings.push({
      code: 'ionic-strength-estimated',
      message: `SC ${sc} µS/cm is brackish: ionic strength estimated from the practical salinity (${salinity.toFixed(1)}) assuming seawater proportions. Enter the major ions for an exact value.`,
    });
    return { fixed: ionicStrengthFromSalinity(Math.min(salinity, 45)), source: 'salinity', rel: 0.15 };
  }
  if (sc !== undefined && sc !== null) {
    const choice = fromSc();
    warnings.push({
      code: 'ionic-strength-estimated',
      message: `Ionic strength estimated from specific conductance (±${Math.round(choice.rel * 100)} %). Enter the major ions for an exact value.`,
    });
    return choice;
  }
  if (present('tdsMgL', input.tdsMgL)) {
    warnings.push({ code: 'ionic-strength-estimated', message: 'Ionic strength estimated from TDS (±30 %).' });
    return { fixed: ionicStrengthFromTds(input.tdsMgL), source: 'tds', rel: 0.3 };
  }
  warnings.push({
    code: 'ionic-strength-partial',
    message:
      'Ionic strength computed from the few ions entered: a lower bound. Enter specific conductance for a better estimate.',
    field: 'scUsPerCm',
  });
  return { fixed: undefined, source: 'partial-composition', rel: 0.3 };
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
 * monotonically with pH.
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
    x0 = x1; f0 = f1; x1 = x2;
  }
  return undefined;
}

/**
 * Analyse one sample: ionic strength, activity model, speciation, saturation indices with an
 * uncertainty band on calcite, CO₂ pressure, Langelier/Ryznar, hardness, charge balance and
 * calculated conductance, plus warnings that say what to check.
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
  const unc: Uncertainties = { ...DEFAULT_UNCERTAINTIES, ...options.uncertainty };
  for (const [k, v] of Object.entries(unc)) {
    if (!Number.isFinite(v) || v < 0) throw new InputError(`uncertainty.${k}`, `Uncertainty ${k} must be a number ≥ 0.`);
  }
  const warnings: ChemWarning[] = [];
  const tempC = input.tempC;
  const t = totalsOf(input);
  const lk = logKTable(tempC);

  rangeWarnings(input, warnings);

  const iChoice = chooseIonicStrength(input, options, unc, warnings);
  const sc = input.scUsPerCm ?? undefined;
  const iFromSc =
    sc !== undefined ? ionicStrengthFromConductance(sc, options.conductanceFactor ?? DEFAULT_CONDUCTANCE_FACTOR) : undefined;

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

  // Speciation needs pH; without it, ionic strength can still be reported.
  const pH = input.pH ?? undefined;
  let spec: Speciation | undefined;
  if (pH !== undefined) {
    const core = runCore(tempC, pH, t, iChoice.fixed, model, lk);
    spec = core.spec;
    result.speciation = { converged: spec.converged, iterations: spec.iterations };
    result.activityModel = spec.model;
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
      if (fin(la.Mg)) result.saturationIndex.dolomite = la.Ca + la.Mg + 2 * la.CO3 - lk.dolomite;
    }
    if (fin(la.Ca) && fin(la.SO4)) result.saturationIndex.gypsum = la.Ca + la.SO4 - lk.gypsum;
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
    if (spec.alkalinityBelowNoncarbonate) {
      warnings.push({
        code: 'alkalinity-noncarbonate',
        message:
          'The alkalinity entered is smaller than the hydroxide/silicate part alone at this pH: carbonate species were set to zero. Check pH and alkalinity.',
        field: 'alkalinityMgLCaCO3',
      });
    } else if (pH > 9 && t.alkEqL !== undefined) {
      warnings.push({
        code: 'alkalinity-noncarbonate',
        message:
          'Above pH 9, borate, silicate and organic bases may carry part of the alkalinity; the carbonate species may be overstated. Enter silica if known.',
        field: 'alkalinityMgLCaCO3',
      });
    }
    if (core.siCalcite !== undefined) {
      const pHs = saturationPh(tempC, pH, core.siCalcite, t, iChoice.fixed, model, lk, spec.state);
      if (pHs !== undefined) result.langelier = { pHs, lsi: pH - pHs, rsi: 2 * pHs - pH };
    }
  } else {
    warnings.push({ code: 'calcite-needs-inputs', message: 'Enter pH to compute saturation indices and CO₂ pressure.', field: 'pH' });
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

  const I = result.ionicStrength.value;
  if (I !== undefined && I > MODEL_MAX_IONIC_STRENGTH[result.activityModel]) {
    warnings.push({
      code: 'activity-model-out-of-range',
      message: `Ionic strength ${I.toPrecision(3)} mol/L is beyond the usual range of the ${modelName(result.activityModel)} (≤ ${MODEL_MAX_IONIC_STRENGTH[result.activityModel]} mol/L): activities and indices are extrapolated. ${I > 2 ? 'A specific-interaction (Pitzer) model is needed for brines.' : 'Choose a model valid at this ionic strength.'}`,
    });
  }

  // Calculated conductance (SM 2510) from the full analysis, and the SC cross-check.
  if (hasComposition(input) && pH !== undefined && spec) {
    const ionsMolL: Partial<Record<Ion, number>> = {
      Ca: t.ca, Mg: t.mg, Na: t.na, K: t.k, Cl: t.cl, SO4: t.so4, NO3: t.no3, F: t.f,
      HCO3: spec.conc.HCO3 + spec.conc.CaHCO3 + spec.conc.MgHCO3 + spec.conc.NaHCO3aq,
      CO3: spec.conc.CO3 + spec.conc.CaCO3aq + spec.conc.MgCO3aq + spec.conc.NaCO3,
      H: spec.conc.H, OH: spec.conc.OH,
    };
    result.calculatedScUsPerCm = calculatedConductance(ionsMolL);
  }
  scCrossCheck(input, t, result, warnings);

  // Uncertainty band on calcite SI and the crew's flag.
  if (result.saturationIndex.calcite !== undefined && pH !== undefined) {
    const si = result.saturationIndex.calcite;
    const u = calciteUncertainty(input, t, pH, si, iChoice, model, lk, unc, spec?.state);
    result.calciteSiUncertainty = u;
    result.calciteState = si - u > 0 ? 'supersaturated' : si + u < 0 ? 'undersaturated' : 'near-equilibrium';
    if (si < -3 || si > 2) {
      warnings.push({
        code: 'si-extreme',
        message: `Calcite SI ${si.toFixed(2)} is outside the usual −3 to +2: check pH calibration, alkalinity and calcium units before trusting it.`,
      });
    }
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

  const used: Reaction[] = ['water', 'carbonic1', 'carbonic2', 'calcite', 'co2Henry', 'dolomite', 'gypsum'];
  const extrap = used.filter((r) => isExtrapolated(r, tempC));
  if (extrap.length > 0 && pH !== undefined) {
    warnings.push({
      code: 'constants-extrapolated',
      message: `At ${tempC} °C the constants for ${extrap.map((r) => REACTIONS[r].equation).join('; ')} are extrapolated beyond their published range.`,
      field: 'tempC',
    });
  }
  return result;
}

function modelName(m: ActivityModel): string {
  return {
    'debye-huckel': 'Debye–Hückel limiting law',
    'extended-debye-huckel': 'extended Debye–Hückel equation',
    davies: 'Davies equation',
    'truesdell-jones': 'Truesdell–Jones equation',
  }[m];
}

function rangeWarnings(input: SampleInput, warnings: ChemWarning[]): void {
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
    warnings.push({
      code: 'ph-unusual',
      message: `pH ${pH} is outside 5–9.5, unusual for streams and springs: re-check against a buffer, then re-measure.`,
      field: 'pH',
    });
  }
  const sc = input.scUsPerCm;
  if (sc !== undefined && sc !== null && sc < 5) {
    warnings.push({
      code: 'sc-unusual',
      message: `Specific conductance ${sc} µS/cm is lower than almost any natural water: was it entered in mS/cm?`,
      field: 'scUsPerCm',
    });
  }
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
    warnings.push({
      code: 'si-will-rise-downstream',
      message: `The water holds ${Math.round(Math.pow(10, logPco2 - ATMOSPHERIC_LOG_PCO2))}× the atmosphere's CO₂: as it degasses downstream, pH${si !== undefined ? ' and calcite SI' : ''} will tend to rise.`,
    });
  }
}

/**
 * ± half-width on calcite SI by first-order propagation: each input is moved by its uncertainty,
 * the SI is recomputed, and the changes are added in quadrature (GUM, JCGM 100:2008, §5.1, with
 * finite differences). Inputs: pH, temperature, alkalinity, calcium and, for SC-based ionic
 * strength, SC and the estimator's own scatter.
 */
function calciteUncertainty(
  input: SampleInput,
  t: Totals,
  pH: number,
  si: number,
  iChoice: IonicStrengthChoice,
  model: ActivityModel | 'auto',
  lk: LogKTable,
  unc: Uncertainties,
  start?: SpeciationState,
): number {
  const tempC = input.tempC;
  let sum = 0;
  const add = (v: number | undefined) => {
    if (v !== undefined && Number.isFinite(v)) sum += (v - si) * (v - si);
  };
  const pHp = Math.min(14, pH + unc.pH);
  add(runCore(tempC, pHp, t, iChoice.fixed, model, lk, start).siCalcite);
  if (unc.tempC > 0) {
    const tp = Math.min(100, tempC + unc.tempC);
    add(runCore(tp, pH, t, iChoice.fixed, model, logKTable(tp), start).siCalcite);
  }
  if (t.alkEqL !== undefined && unc.alkalinityRel > 0) {
    add(runCore(tempC, pH, { ...t, alkEqL: t.alkEqL * (1 + unc.alkalinityRel) }, iChoice.fixed, model, lk, start).siCalcite);
  }
  if (t.ca !== undefined && unc.caRel > 0) {
    add(runCore(tempC, pH, { ...t, ca: t.ca * (1 + unc.caRel) }, iChoice.fixed, model, lk, start).siCalcite);
  }
  if (iChoice.fixed !== undefined && iChoice.rel > 0) {
    add(runCore(tempC, pH, t, iChoice.fixed * (1 + iChoice.rel), model, lk, start).siCalcite);
  }
  return Math.sqrt(sum);
}
