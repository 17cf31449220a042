// Lab results as labs write them: units in their common spellings ("mg/l as N", "uS/cm @25C",
// "std units", "mg/L CaCO3", "NTU") read into a UCUM code with its basis, censored values ("<0.05",
// "ND", a U or < qualifier) read as "not detected" with their detection limit, and major-ion results
// converted to the engine's inputs (mg/L of the ion; nitrate as N; alkalinity as CaCO3).
// This is the phone's small mapping; the office command also accepts any UCUM unit through the
// full UCUM library (src/exchange/ucum.ts), which stays out of the phone bundle.
import { MG_CACO3_PER_MEQ, MOLAR_MASS, SPECIES } from '../chemistry';
import { parseDecimalLoose } from './numbers';

/** The engine inputs a lab result may fill (all mg/L; nitrate as N; alkalinity as CaCO3). */
export type EngineField = 'caMgL' | 'mgMgL' | 'naMgL' | 'kMgL' | 'clMgL' | 'so4MgL' | 'no3NMgL' | 'fMgL' | 'sio2MgL' | 'tdsMgL' | 'alkalinityMgLCaCO3';

export type Basis = 'N' | 'NO3' | 'CaCO3' | 'HCO3' | 'SiO2' | 'Si';

export interface LabUnit {
  /** UCUM code; a basis is carried as an annotation (mg{N}/L, mg{CaCO3}/L), turbidity as {NTU} */
  ucum: string;
  kind: 'mass' | 'amount' | 'equivalents' | 'conductance' | 'pH' | 'turbidity' | 'temperature' | 'percent' | 'other';
  /** multiply by this to get mg/L, mmol/L, meq/L or µS/cm (by kind) */
  factor: number;
  basis?: Basis;
  /** the lab states the conductance at 25 °C (specific conductance) */
  at25C?: boolean;
}

const BASES: Record<string, Basis> = { n: 'N', no3: 'NO3', caco3: 'CaCO3', hco3: 'HCO3', sio2: 'SiO2', si: 'Si' };
const CONC: Record<string, { kind: 'mass' | 'amount' | 'equivalents'; factor: number }> = {
  ng: { kind: 'mass', factor: 1e-6 }, ug: { kind: 'mass', factor: 1e-3 }, mg: { kind: 'mass', factor: 1 }, g: { kind: 'mass', factor: 1e3 },
  umol: { kind: 'amount', factor: 1e-3 }, mmol: { kind: 'amount', factor: 1 }, mol: { kind: 'amount', factor: 1e3 },
  ueq: { kind: 'equivalents', factor: 1e-3 }, meq: { kind: 'equivalents', factor: 1 }, eq: { kind: 'equivalents', factor: 1e3 },
};
const PARTS: Record<string, string> = { ppm: 'mg', ppb: 'ug' };

/**
 * Read a lab's unit text. Returns undefined for a spelling this mapping does not know (the office
 * command then asks the UCUM library; the phone refuses the row and names it).
 * ppm and ppb are read as mg/L and µg/L (dilute water; common practice).
 */
export function parseLabUnit(raw: string): LabUnit | undefined {
  let s = raw.trim().toLowerCase().replace(/[µμ]/g, 'u').replace(/\s+/g, ' ').replace(/°/g, '');
  if (!s) return undefined;
  if (/^(std\.? ?units?|standard units?|s\.? ?u\.?|ph units?|ph|\[ph\])$/.test(s)) return { ucum: '[pH]', kind: 'pH', factor: 1 };
  if (/^(ntu|\{ntu\}|fnu|\{fnu\}|fnru|ntru)$/.test(s)) return { ucum: s.includes('f') ? '{FNU}' : '{NTU}', kind: 'turbidity', factor: 1 };
  if (/^(deg ?c|c|cel|degrees c)$/.test(s)) return { ucum: 'Cel', kind: 'temperature', factor: 1 };
  if (/^(%|percent|pct)$/.test(s)) return { ucum: '%', kind: 'percent', factor: 1 };
  const sc = /^(u|m)(?:s|mhos?)\/cm(?: ?(?:@|at)? ?25 ?c)?$/.exec(s);
  if (sc) return { ucum: sc[1] === 'm' ? 'mS/cm' : 'uS/cm', kind: 'conductance', factor: sc[1] === 'm' ? 1000 : 1, ...(/25 ?c$/.test(s) ? { at25C: true } : {}) };

  // concentrations: mg/L with a basis written in any of the usual places
  let basis: Basis | undefined;
  const take = (re: RegExp) => {
    const m = re.exec(s);
    if (!m) return;
    basis = BASES[m[1]!];
    s = s.replace(re, '').trim();
  };
  const b = '(caco3|no3|hco3|sio2|si|n)';
  take(new RegExp(`\\{${b}\\}`)); // UCUM annotation mg{N}/L
  if (!basis) take(new RegExp(`[ -]?\\(?(?:as )?${b}\\)?$`)); // mg/L as N, mg/L-N, mg/L CaCO3, mg/L (as N)
  if (!basis) take(new RegExp(`[ -]${b}(?=/)`)); // mg N/L, mg-N/L
  s = s.replace(/\s+/g, '').replace(/^(ppm|ppb)$/, (p) => `${PARTS[p]}/l`);
  const m = /^(ng|ug|mg|g|umol|mmol|mol|ueq|meq|eq)\/l$/.exec(s);
  if (!m) return undefined;
  const c = CONC[m[1]!]!;
  return { ucum: `${m[1]}${basis ? `{${basis}}` : ''}/L`, kind: c.kind, factor: c.factor, ...(basis ? { basis } : {}) };
}

/** Lab parameter names, lower case with spaces, as labs commonly write them → engine field and a basis the name states. */
const PARAMETERS: Array<[RegExp, EngineField, Basis?]> = [
  [/^(calcium|ca)( dissolved| total)?$/, 'caMgL'],
  [/^(magnesium|mg)( dissolved| total)?$/, 'mgMgL'],
  [/^(sodium|na)( dissolved| total)?$/, 'naMgL'],
  [/^(potassium|k)( dissolved| total)?$/, 'kMgL'],
  [/^(chloride|cl)$/, 'clMgL'],
  [/^(sulfate|sulphate|so4)$/, 'so4MgL'],
  [/^(nitrate ?(as )?n|nitrate-n|no3 ?(as )?n|no3-n|nitrate nitrogen)$/, 'no3NMgL', 'N'],
  [/^(nitrate|no3)$/, 'no3NMgL'],
  [/^(fluoride|f)$/, 'fMgL'],
  [/^(silica|sio2)$/, 'sio2MgL', 'SiO2'],
  [/^(silicon|si)$/, 'sio2MgL', 'Si'],
  [/^(tds|total dissolved solids|dissolved solids)$/, 'tdsMgL'],
  [/^(alkalinity|total alkalinity|alkalinity total|alkalinity as caco3|alkalinity, total|alkalinity ?\(as caco3\))$/, 'alkalinityMgLCaCO3', 'CaCO3'],
];

/** The engine field a lab parameter name fills, if any (with the basis its name states). */
export function engineFieldOf(parameter: string): { field: EngineField; basis?: Basis } | undefined {
  const p = parameter.trim().toLowerCase().replace(/[,_]/g, ' ').replace(/\s+/g, ' ');
  for (const [re, field, basis] of PARAMETERS) if (re.test(p)) return basis ? { field, basis } : { field };
  return undefined;
}

/** Molar mass (g/mol) and charge of what each field counts. */
const WHAT: Record<EngineField, { molarMass: number; charge: number } | undefined> = {
  caMgL: SPECIES.Ca, mgMgL: SPECIES.Mg, naMgL: SPECIES.Na, kMgL: SPECIES.K, clMgL: SPECIES.Cl, so4MgL: SPECIES.SO4,
  no3NMgL: { molarMass: MOLAR_MASS.N, charge: -1 }, fMgL: SPECIES.F, sio2MgL: { molarMass: MOLAR_MASS.SiO2, charge: 0 },
  tdsMgL: undefined, alkalinityMgLCaCO3: { molarMass: MOLAR_MASS.CaCO3, charge: 2 },
};

/**
 * A lab value in the engine's unit for its field, or the reason it cannot be converted.
 * mg/L × factor; mmol/L × molar mass; meq/L × molar mass / |charge|; "as CaCO3" calcium and
 * magnesium × M/100.086; nitrate as NO3 × 14.007/62.004; alkalinity as HCO3 × 50.043/61.017.
 */
export function toEngineValue(field: EngineField, value: number, unit: LabUnit, parameterBasis?: Basis): { value: number } | { error: string } {
  const what = WHAT[field];
  const basis = unit.basis ?? parameterBasis;
  if (unit.kind === 'equivalents' || unit.kind === 'amount') {
    if (!what || what.charge === 0 && unit.kind === 'equivalents') return { error: `${unit.ucum} cannot be converted for this parameter` };
    if (field === 'alkalinityMgLCaCO3') return { value: value * unit.factor * (unit.kind === 'equivalents' ? MG_CACO3_PER_MEQ : MOLAR_MASS.CaCO3) };
    const perUnit = unit.kind === 'amount' ? what.molarMass : what.molarMass / Math.abs(what.charge);
    return { value: value * unit.factor * perUnit };
  }
  if (unit.kind !== 'mass') return { error: `a ${unit.kind} unit (${unit.ucum}) cannot be a concentration` };
  const mgL = value * unit.factor;
  switch (field) {
    case 'alkalinityMgLCaCO3':
      if (unit.basis === 'HCO3') return { value: (mgL / SPECIES.HCO3.molarMass) * MG_CACO3_PER_MEQ };
      if (!unit.basis || unit.basis === 'CaCO3') return { value: mgL }; // labs report alkalinity as CaCO3 (common practice)
      break;
    case 'no3NMgL':
      if (basis === 'N') return { value: mgL };
      if (basis === 'NO3') return { value: (mgL * MOLAR_MASS.N) / SPECIES.NO3.molarMass };
      return { error: 'say whether nitrate is “as N” or “as NO3” (in the unit or the parameter name)' };
    case 'sio2MgL':
      if (basis === 'Si') return { value: (mgL * MOLAR_MASS.SiO2) / MOLAR_MASS.Si };
      if (!basis || basis === 'SiO2') return { value: mgL };
      break;
    case 'caMgL':
    case 'mgMgL':
      if (unit.basis === 'CaCO3') return { value: (mgL * what!.molarMass) / MOLAR_MASS.CaCO3 };
      if (!unit.basis) return { value: mgL };
      break;
    default:
      if (!unit.basis) return { value: mgL };
  }
  return { error: `${unit.ucum} does not fit this parameter (basis ${unit.basis})` };
}

/** A lab value as written: a number, or censored (not detected) with its detection limit. */
export type LabValue = { value: number } | { censored: true; limit?: number };

/**
 * Read a lab's value cell (and qualifier): "12.1" → value; "<0.05" → censored at 0.05; "ND" (also
 * "n.d.", "not detected", "BDL") → censored, limit from `limitCell` when given; a number with a U,
 * UJ or < qualifier → censored at that number (EPA data qualifier convention: U = analysed for but
 * not detected above the stated limit). Returns an error text for anything else.
 */
export function parseLabValue(raw: string, qualifier = '', limitCell = ''): LabValue | { error: string } {
  const s = raw.trim();
  const q = qualifier.trim().toUpperCase();
  const limit = limitCell.trim() ? parseDecimalLoose(limitCell) : undefined;
  if (limitCell.trim() && limit === undefined) return { error: `detection limit “${limitCell.trim()}” is not a number` };
  if (/^(nd|n\.d\.?|not detected|bdl|<\s*(mdl|rl|dl|lod|loq|pql|mrl))$/i.test(s) || (!s && /^(U|ND)$/.test(q))) {
    return limit !== undefined ? { censored: true, limit } : { censored: true };
  }
  const lt = /^<\s*=?\s*(.+)$/.exec(s);
  if (lt) {
    const v = parseDecimalLoose(lt[1]!);
    return v === undefined || v < 0 ? { error: `value “${s}” is not a detection limit` } : { censored: true, limit: v };
  }
  if (/^>/.test(s)) return { error: `value “${s}” is above the lab's range: ask the lab for the diluted result` };
  const v = parseDecimalLoose(s);
  if (v === undefined) return { error: s ? `value “${s}” is not a number` : 'no value' };
  if (/^(U|UJ|<|ND)$/.test(q)) return { censored: true, limit: limit ?? v };
  return { value: v };
}

/** What a stored lab result needs for the engine (structurally the stored LabResult). */
interface StoredLab {
  parameter: string;
  value?: number | undefined;
  unit: string;
  unitUcum?: string | undefined;
  censored?: boolean | undefined;
}

/**
 * Engine inputs from a sample's lab results: each major ion, TDS or alkalinity measured above its
 * detection limit, in the engine's unit (a later import of the same parameter wins). Censored
 * values and units that cannot be converted are left out, never guessed.
 */
export function labEngineInputs(lab: readonly StoredLab[]): Partial<Record<EngineField, number>> {
  const out: Partial<Record<EngineField, number>> = {};
  for (const l of lab) {
    if (l.censored || l.value === undefined) continue;
    const target = engineFieldOf(l.parameter);
    const unit = parseLabUnit(l.unitUcum ?? l.unit) ?? parseLabUnit(l.unit);
    if (!target || !unit) continue;
    const r = toEngineValue(target.field, l.value, unit, target.basis);
    if ('value' in r) out[target.field] = r.value;
  }
  return out;
}
