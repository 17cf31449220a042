// From a stored sample (raw entries) to the engine's input and results. Computed values are
// always derived here, from the stored inputs plus the engine version; they are never stored as truth.
import {
  analyzeSample,
  dataChecks,
  DEFAULT_PROFILE,
  ENGINE_VERSION,
  InputError,
  MG_CACO3_PER_MEQ,
  pressureToKPa,
  specificConductance,
  stabilization,
  SPECIES,
  titrationAlkalinity,
  unionizedAmmonia,
  type Analysis,
  type AnalyzeOptions,
  type ChemWarning,
  type DataCheck,
  type MethodProfile,
  type SampleEvidence,
  type SampleInput,
  type SiteConductanceFactor,
  type StabilizationResult,
  type TitrationResult,
} from '../chemistry';
import type { KitResult, Sample, Settings, TimedValue } from './schema';
import { labEngineInputs, type EngineField } from './lab-units';

const msOf = (iso: string) => Date.parse(iso);
const READING_WORDS: Record<string, string> = { temperature: 'Water temperature', pH: 'pH', sc: 'Conductance', do: 'Dissolved oxygen' };

/** The value to report from repeated readings: the stabilization median (all values if fewer than N). */
export function reportedValue(values: TimedValue[] | undefined, parameter: 'temperature' | 'pH' | 'sc' | 'do', profile: MethodProfile): { value?: number; stability?: StabilizationResult } {
  if (!values || values.length === 0) return {};
  const st = stabilization(values.map((v) => ({ timeMs: msOf(v.time), value: v.value })), parameter, profile);
  return { value: st.median, stability: st };
}

/** Calcium (mg/L) from a kit result, or undefined. Ca = Ca-hardness (mg/L as CaCO₃) × 0.4004 (40.078/100.086). */
export function calciumMgLFromKits(kits: KitResult[]): number | undefined {
  const k = kits.find((x) => x.analyte === 'calcium' || x.analyte === 'calcium-hardness');
  if (!k) return undefined;
  const caPerCaCO3 = SPECIES.Ca.molarMass / 100.086;
  if (k.analyte === 'calcium-hardness' || k.unit === 'mg/L CaCO3') return k.value * caPerCaCO3;
  if (k.unit === 'mmol/L') return k.value * SPECIES.Ca.molarMass;
  if (k.unit === 'meq/L') return (k.value * SPECIES.Ca.molarMass) / 2;
  return k.value;
}

/** The calcium kit's step converted to mg/L of Ca, like its value (for the uncertainty: step/√12). */
export function calciumKitStepMgL(kits: KitResult[]): number | undefined {
  const k = kits.find((x) => x.analyte === 'calcium' || x.analyte === 'calcium-hardness');
  if (!k || k.step === undefined || !(k.value > 0)) return undefined;
  const ca = calciumMgLFromKits([k]);
  return ca === undefined ? undefined : (k.step * ca) / k.value;
}

/** Magnesium (mg/L) from total hardness minus calcium hardness, when both kits were run. */
export function magnesiumMgLFromKits(kits: KitResult[]): number | undefined {
  const mg = kits.find((x) => x.analyte === 'magnesium');
  if (mg) return mg.unit === 'mmol/L' ? mg.value * SPECIES.Mg.molarMass : mg.unit === 'meq/L' ? (mg.value * SPECIES.Mg.molarMass) / 2 : mg.value;
  const total = kits.find((x) => x.analyte === 'total-hardness');
  const ca = kits.find((x) => x.analyte === 'calcium-hardness');
  if (!total || !ca) return undefined;
  const mgHardness = total.value - ca.value; // mg/L as CaCO3
  return mgHardness >= 0 ? mgHardness * (SPECIES.Mg.molarMass / 100.086) : undefined;
}

export interface Derived {
  input: SampleInput;
  analysis?: Analysis;
  /** set when the stored entries are impossible for the engine */
  error?: { field: string; message: string };
  titration?: TitrationResult;
  stability: Partial<Record<'temperature' | 'pH' | 'sc' | 'do', StabilizationResult>>;
  doMgL?: number;
  doPercent?: number;
  pressureKPa?: number;
  nh3?: { fraction: number; nh3NMgL: number };
  checks: DataCheck[];
  warnings: ChemWarning[];
  engineVersion: string;
  /** engine inputs taken from lab results (the field did not measure them) */
  labInputs?: EngineField[];
}

/**
 * What this sample's own entries say about its uncertainty: the readings of each stabilization
 * window and the calcium kit's step (the engine turns them into standard uncertainties).
 */
export function sampleEvidence(f: Sample['field'], stability: Derived['stability'], input: SampleInput): SampleEvidence {
  const ev: SampleEvidence = {};
  if (stability.pH && stability.pH.window.length > 1) ev.pHReadings = stability.pH.window;
  if (stability.temperature && stability.temperature.window.length > 1) ev.tempReadings = stability.temperature.window;
  const scw = stability.sc?.window;
  if (scw && scw.length > 1 && input.scUsPerCm && stability.sc!.median) {
    // raw EC readings scaled to SC at 25 °C (the compensation is one factor for the window)
    const k = input.scUsPerCm / stability.sc!.median;
    ev.scReadings = scw.map((v) => v * k);
  }
  const step = calciumKitStepMgL(f.kits);
  if (step !== undefined) ev.caKitStepMgL = step;
  return ev;
}

/** Settings that shape a derivation: the engine choices, and each site's own conductance factor where it has one. */
export type DeriveSettings = Pick<Settings, 'activityModel' | 'conductanceFactor'> & {
  /** by site id: factors from the site's full analyses (records/site-factor.ts) */
  siteFactors?: Readonly<Record<string, SiteConductanceFactor>> | undefined;
};

export function analyzeOptions(settings: DeriveSettings, siteId?: string): AnalyzeOptions {
  const site = siteId !== undefined ? settings.siteFactors?.[siteId] : undefined;
  return { activityModel: settings.activityModel, conductanceFactor: settings.conductanceFactor, ...(site ? { siteConductanceFactor: site } : {}) };
}

/**
 * Derive everything the crew and the office see from one sample's stored entries.
 * Never throws for bad entries: an engine InputError comes back as `error` with its field.
 */
export function deriveSample(sample: Pick<Sample, 'field' | 'pressure' | 'lab'> & { siteId?: string }, settings: DeriveSettings, profile: MethodProfile = DEFAULT_PROFILE): Derived {
  const f = sample.field;
  const stability: Derived['stability'] = {};
  const warnings: ChemWarning[] = [];
  const out: Derived = { input: { tempC: Number.NaN }, stability, checks: [], warnings, engineVersion: ENGINE_VERSION };
  try {
    const t = reportedValue(f.tempC?.values, 'temperature', profile);
    if (t.stability) stability.temperature = t.stability;
    const ph = reportedValue(f.pH?.values, 'pH', profile);
    if (ph.stability) stability.pH = ph.stability;
    const input: SampleInput = { tempC: t.value ?? Number.NaN };
    if (ph.value !== undefined) input.pH = ph.value;

    const c = f.conductance;
    if (c) {
      const raw = reportedValue(c.values, 'sc', profile);
      if (raw.stability) stability.sc = raw.stability;
      if (raw.value !== undefined) {
        if (c.mode === 'sc') input.scUsPerCm = raw.value;
        else {
          const ecTemp = c.tempC ?? t.value;
          if (ecTemp === undefined) throw new InputError('conductance.tempC', 'Raw EC needs the temperature it was read at.');
          input.scUsPerCm = specificConductance(raw.value, ecTemp, c.alpha);
        }
      }
    }

    const alk = f.alkalinity;
    if (alk?.kind === 'direct') {
      input.alkalinityMgLCaCO3 =
        alk.unit === 'mg/L CaCO3' ? alk.value : alk.unit === 'meq/L' ? alk.value * MG_CACO3_PER_MEQ : (alk.value / SPECIES.HCO3.molarMass) * MG_CACO3_PER_MEQ;
    } else if (alk?.kind === 'titration') {
      const tr = alk.titration;
      const result = titrationAlkalinity({
        sampleVolumeMl: tr.sampleVolumeMl,
        titrantNormality: tr.titrantNormality,
        correctionFactor: tr.correctionFactor,
        countsPerMl: tr.countsPerMl,
        tempC: input.tempC,
        scUsPerCm: input.scUsPerCm ?? undefined,
        points: tr.points.map((p) => (tr.equipment === 'digital-titrator' ? { counts: p.amount, pH: p.pH } : { titrantMl: p.amount, pH: p.pH })),
        profile,
      });
      out.titration = result;
      if (result.alkalinityMgLCaCO3 !== undefined) input.alkalinityMgLCaCO3 = result.alkalinityMgLCaCO3;
    }

    const ca = calciumMgLFromKits(f.kits);
    if (ca !== undefined) input.caMgL = ca;
    const mgKit = magnesiumMgLFromKits(f.kits);
    const ions = f.ions;
    const mg = ions.mgMgL ?? mgKit;
    if (mg !== undefined) input.mgMgL = mg;
    for (const key of ['naMgL', 'kMgL', 'clMgL', 'so4MgL', 'no3NMgL', 'fMgL', 'sio2MgL', 'tdsMgL'] as const) {
      const v = ions[key];
      if (v !== undefined) input[key] = v;
    }
    // lab results fill what the field did not measure (ionic strength from the composition, charge
    // balance); a field value is never replaced
    for (const [key, v] of Object.entries(labEngineInputs(sample.lab ?? [])) as Array<[EngineField, number]>) {
      if (input[key] === undefined) {
        input[key] = v;
        (out.labInputs ??= []).push(key);
      }
    }
    out.input = input;
    if (!Number.isFinite(input.tempC)) {
      warnings.push({ code: 'needs-temperature', message: 'Enter the water temperature to compute anything.', field: 'tempC' });
      return out;
    }

    if (sample.pressure) out.pressureKPa = pressureToKPa(sample.pressure.value, sample.pressure.unit);
    if (out.pressureKPa !== undefined) input.pressureKPa = out.pressureKPa;
    const dox = f.do ? reportedValue(f.do.values, 'do', profile) : {};
    if (dox.stability) stability.do = dox.stability;
    if (dox.value !== undefined) {
      // the engine corrects saturation for this sample's salinity (from SC) and pressure
      if (f.do!.unit === 'mg/L') input.doMgL = dox.value;
      else input.doPercent = dox.value;
    }
    if (ions.nh3nh4NMgL !== undefined && input.pH !== undefined && input.pH !== null) {
      const n = unionizedAmmonia(ions.nh3nh4NMgL, input.pH, input.tempC);
      out.nh3 = { fraction: n.fraction, nh3NMgL: n.nh3NMgL };
    }

    out.analysis = analyzeSample(input, { ...analyzeOptions(settings, sample.siteId), evidence: sampleEvidence(f, stability, input) });
    if (out.analysis.oxygen) {
      out.doMgL = out.analysis.oxygen.doMgL;
      out.doPercent = out.analysis.oxygen.percentSaturation;
    }
    out.checks = dataChecks(input, out.analysis, profile, { doMgL: out.doMgL ?? null, pressureKPa: out.pressureKPa ?? null });
    warnings.push(...out.analysis.warnings);
    if (out.titration) warnings.push(...out.titration.warnings);
    for (const [param, st] of Object.entries(stability)) {
      if (st && !st.stable && st.window.length > 1) warnings.push({ code: 'not-stable', message: `${READING_WORDS[param] ?? param}: ${st.reason}`, field: param });
    }
  } catch (e) {
    if (e instanceof InputError) out.error = { field: e.field, message: e.message };
    else throw e;
  }
  return out;
}
