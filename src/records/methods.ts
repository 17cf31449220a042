// The usual method and sample fraction of each field measurement, kit and lab parameter, used when a
// record does not say its own. Identifiers and contexts are written as the WQX method list writes
// them (the `wqx` package's values/AnalyticalMethod and Result Analytical Method Context lists; the
// WQX test checks every one against them).
import type { KitResult, LabResult, MethodRef, SampleFraction } from './schema';

const m = (id: string, context: string): MethodRef => ({ id, context });

/** Meter readings and the field titration. */
export const FIELD_METHODS = {
  temperature: m('170.1', 'USEPA'), // thermometric
  conductance: m('120.1', 'USEPA'), // specific conductance, meter
  pH: m('150.1', 'USEPA'), // electrometric
  do: m('360.1', 'USEPA'), // membrane electrode
  alkalinity: m('2320-B', 'APHA'), // titration (Gran or fixed endpoint)
} as const satisfies Record<string, MethodRef>;

/** Field kits: the method a kit of that type usually follows (EDTA titration for Ca and hardness). */
export const KIT_METHODS: Record<KitResult['analyte'], MethodRef> = {
  calcium: m('3500-CA(B)', 'APHA'), // EDTA titrimetric
  'calcium-hardness': m('2340C', 'APHA'), // EDTA titrimetric
  'total-hardness': m('2340C', 'APHA'),
  magnesium: m('3500-MG(B)', 'APHA'), // by calculation from hardness and Ca
  'ammonia-n': m('10023', 'HACH'), // salicylate
  chloride: m('4500-CL-(B)', 'APHA'), // argentometric
  sulfate: m('4500-SO4(E)', 'APHA'), // turbidimetric
};

/** Extra ions typed in the field (FieldIons keys): the usual field-kit method of each. */
export const ION_METHODS: Record<string, MethodRef> = {
  mgMgL: m('3500-MG(B)', 'APHA'),
  naMgL: m('3500-NA(B)', 'APHA'),
  kMgL: m('3500-K-B', 'APHA'),
  clMgL: m('4500-CL-(B)', 'APHA'),
  so4MgL: m('4500-SO4(E)', 'APHA'),
  no3NMgL: m('8039', 'HACH'), // cadmium reduction
  fMgL: m('4500-F-D', 'APHA'), // SPADNS
  sio2MgL: m('4500-SIO2-C', 'APHA'), // molybdosilicate
  tdsMgL: m('2540-C', 'APHA'),
  nh3nh4NMgL: m('10023', 'HACH'),
};

/** Lab parameters (lower case, as labs write them): the usual method of a water lab. */
const LAB_DEFAULTS: Array<[RegExp, MethodRef]> = [
  [/^(calcium|ca|magnesium|mg|sodium|na|potassium|k|silica|sio2|iron|fe|manganese|mn)$/, m('200.7', 'USEPA')], // ICP-AES
  [/^(chloride|cl|sulfate|so4|fluoride|f|nitrate.*|no3.*|bromide|br)$/, m('300.0', 'USEPA')], // ion chromatography
  [/^alkalinity.*/, m('2320-B', 'APHA')],
  [/^(ammonia.*|nh3.*|nh4.*)$/, m('350.1', 'USEPA')],
  [/^(tds|total dissolved solids)$/, m('2540-C', 'APHA')],
  [/^(specific conductance|sc|conductivity)$/, m('2510B', 'APHA')],
  [/^ph$/, m('4500-H+B', 'APHA')],
];

/** Lab parameters that are analysed on filtered water by common practice (major ions, nutrients, silica). */
const DISSOLVED_BY_DEFAULT = /^(calcium|ca|magnesium|mg|sodium|na|potassium|k|silica|sio2|iron|fe|manganese|mn|chloride|cl|sulfate|sulphate|so4|fluoride|f|bromide|br|nitrate.*|no3.*|ammonia.*|nh3.*|nh4.*)$/;

/** A kit result's fraction: as recorded, else unfiltered ('total'): kits are run on raw water unless said. */
export function kitFraction(k: Pick<KitResult, 'fraction'>): SampleFraction {
  return k.fraction ?? 'total';
}

export function kitMethod(k: Pick<KitResult, 'analyte' | 'method'>): MethodRef {
  return k.method ?? KIT_METHODS[k.analyte];
}

/**
 * A lab result's method: as recorded; else an EPA method number read from the lab's method text
 * ("EPA 300.0", "USEPA 200.8"); else the parameter's usual lab method; undefined if none is known.
 */
export function labMethod(l: Pick<LabResult, 'parameter' | 'method' | 'analyticalMethod'>): MethodRef | undefined {
  if (l.analyticalMethod) return l.analyticalMethod;
  const epa = /\b(?:US\s*)?EPA\s*(?:method\s*)?(\d{3}\.\d{1,2})\b/i.exec(l.method ?? '');
  if (epa) return m(epa[1]!, 'USEPA');
  const p = l.parameter.trim().toLowerCase();
  return LAB_DEFAULTS.find(([re]) => re.test(p))?.[1];
}

/**
 * A lab result's fraction: as recorded; else 'dissolved' for major ions and nutrients (their bottles
 * are field-filtered; common practice); else none (pH, SC, alkalinity, TDS name no fraction).
 */
export function labFraction(l: Pick<LabResult, 'fraction' | 'parameter'>): SampleFraction | undefined {
  return l.fraction ?? (DISSOLVED_BY_DEFAULT.test(l.parameter.trim().toLowerCase()) ? 'dissolved' : undefined);
}
