// The sample form's state (raw strings, exactly as typed: this is what the draft stores) and its
// mapping to and from the stored record. Pure functions: tested without a browser.
import type { Sample } from '../../records/schema';
import type { SampleInputRecord } from '../../store/records';
import { samplingTimeProblem, isoWithOffset } from '../../records/time';
import { parseDecimal, type NumberRule } from './parse';

export interface TimedRaw {
  v: string;
  /** ISO time when the value was first typed */
  t: string;
}

export const ION_FIELDS = [
  { key: 'mgMgL', label: 'Magnesium', unit: 'mg/L' },
  { key: 'naMgL', label: 'Sodium', unit: 'mg/L' },
  { key: 'kMgL', label: 'Potassium', unit: 'mg/L' },
  { key: 'clMgL', label: 'Chloride', unit: 'mg/L' },
  { key: 'so4MgL', label: 'Sulfate', unit: 'mg/L' },
  { key: 'no3NMgL', label: 'Nitrate as N', unit: 'mg/L' },
  { key: 'fMgL', label: 'Fluoride', unit: 'mg/L' },
  { key: 'sio2MgL', label: 'Silica as SiO₂', unit: 'mg/L' },
  { key: 'tdsMgL', label: 'Total dissolved solids', unit: 'mg/L' },
  { key: 'nh3nh4NMgL', label: 'Total ammonia as N', unit: 'mg/L' },
] as const;
export type IonKey = (typeof ION_FIELDS)[number]['key'];

export interface SampleForm {
  id?: string;
  siteId: string;
  time: string;
  crew: string;
  qcType: 'environmental' | 'replicate' | 'blank';
  parentId: string;
  method: 'in-situ' | 'flow-through' | 'grab';
  flow: 'low' | 'normal' | 'high' | 'rising' | 'falling' | 'dry' | 'unknown';
  weather: string;
  temp: TimedRaw[];
  condMode: 'sc' | 'ec';
  condUnit: 'uS/cm' | 'mS/cm';
  cond: TimedRaw[];
  ecTempC: string;
  alpha: string;
  pH: TimedRaw[];
  doUnit: 'mg/L' | '%';
  do: TimedRaw[];
  pressure: string;
  pressureUnit: 'hPa' | 'kPa' | 'mmHg';
  pressureSource: 'station' | 'sea-level' | 'estimated';
  alkMode: 'direct' | 'titration';
  alk: string;
  alkUnit: 'mg/L CaCO3' | 'meq/L' | 'mg/L HCO3';
  titSampleMl: string;
  titNormality: string;
  titCf: string;
  titEquipment: 'buret' | 'digital-titrator';
  titPoints: Array<{ amount: string; pH: string }>;
  kitAnalyte: 'calcium' | 'calcium-hardness';
  kitValue: string;
  kitUnit: 'mg/L' | 'mg/L CaCO3' | 'mmol/L' | 'meq/L';
  /** the kit was run on filtered water (WQX fraction Dissolved; else Total); absent in older drafts */
  kitFiltered?: boolean;
  totalHardness: string;
  ions: Record<IonKey, string>;
  remarks: string;
  qualifiers: Array<'estimated' | 'unstable' | 'outside-calibration' | 'suspect'>;
}

/** What a new sample starts with: the operator as crew, the usual units from Settings. */
export interface FormDefaults {
  crew?: string;
  units?: { alkalinity?: SampleForm['alkUnit']; conductance?: SampleForm['condUnit']; pressure?: SampleForm['pressureUnit']; do?: SampleForm['doUnit'] };
}

export function emptyForm(now = new Date(), defaults: FormDefaults = {}): SampleForm {
  const u = defaults.units ?? {};
  return {
    siteId: '',
    time: isoWithOffset(now),
    crew: defaults.crew ?? '',
    qcType: 'environmental',
    parentId: '',
    method: 'in-situ',
    flow: 'unknown',
    weather: '',
    temp: [{ v: '', t: '' }],
    condMode: 'sc',
    condUnit: u.conductance ?? 'uS/cm',
    cond: [{ v: '', t: '' }],
    ecTempC: '',
    alpha: '0.0191',
    pH: [{ v: '', t: '' }],
    doUnit: u.do ?? 'mg/L',
    do: [{ v: '', t: '' }],
    pressure: '',
    pressureUnit: u.pressure ?? 'hPa',
    pressureSource: 'station',
    alkMode: 'direct',
    alk: '',
    alkUnit: u.alkalinity ?? 'mg/L CaCO3',
    titSampleMl: '100',
    titNormality: '',
    titCf: '1',
    titEquipment: 'buret',
    titPoints: [{ amount: '0', pH: '' }],
    kitAnalyte: 'calcium',
    kitValue: '',
    kitUnit: 'mg/L',
    kitFiltered: false,
    totalHardness: '',
    ions: Object.fromEntries(ION_FIELDS.map((f) => [f.key, ''])) as Record<IonKey, string>,
    remarks: '',
    qualifiers: [],
  };
}

export const RULES = {
  temp: { label: 'water temperature', unit: '°C', min: -2, max: 100 },
  cond: { label: 'conductance', min: 0, max: 500000 },
  ecTempC: { label: 'the EC reading’s temperature', unit: '°C', min: -2, max: 100 },
  alpha: { label: 'α', unit: '/°C', min: 0, max: 0.05 },
  pH: { label: 'pH', min: 0, max: 14 },
  do: { label: 'dissolved oxygen', min: 0, max: 500 },
  pressure: { label: 'barometric pressure', positive: true },
  alk: { label: 'alkalinity', min: 0, max: 100000 },
  titSampleMl: { label: 'sample volume', unit: 'mL', positive: true, max: 1000 },
  titNormality: { label: 'titrant normality', unit: 'N', positive: true, max: 10 },
  titCf: { label: 'correction factor', min: 0.5, max: 1.5 },
  titAmount: { label: 'titrant added', min: 0 },
  kitValue: { label: 'the kit result', min: 0, max: 100000 },
  ion: { label: 'concentration', unit: 'mg/L', min: 0, max: 500000 },
} satisfies Record<string, NumberRule>;

export type FormErrors = Record<string, string>;

export interface FormResult {
  /** the record as far as it is valid (fields in error left out), for live results and saving */
  record: SampleInputRecord;
  errors: FormErrors;
  /** required fields missing for a save (not shown as errors while typing) */
  missing: string[];
}

function readings(rows: TimedRaw[], key: string, rule: NumberRule, errors: FormErrors, scale = 1, fallbackTime: string) {
  const values: Array<{ time: string; value: number }> = [];
  rows.forEach((r, i) => {
    const p = parseDecimal(r.v, rule);
    if (!p.ok) errors[`${key}.${i}`] = p.error;
    else if (p.value !== undefined) values.push({ time: r.t || fallbackTime, value: p.value * scale });
  });
  return values;
}

/** From the form's raw strings to a record plus the errors to show next to each field. */
export function formToSample(form: SampleForm): FormResult {
  const errors: FormErrors = {};
  const missing: string[] = [];
  const num = (key: string, raw: string, rule: NumberRule) => {
    const p = parseDecimal(raw, rule);
    if (!p.ok) {
      errors[key] = p.error;
      return undefined;
    }
    return p.value;
  };
  // The same rule as the store, restore and the importers (records/time.ts samplingTimeProblem).
  const timeProblem = samplingTimeProblem(form.time.trim());
  const time = timeProblem ? undefined : form.time.trim();
  if (timeProblem) errors.time = /^Impossible/.test(timeProblem) ? `${timeProblem}. Correct the sampling time.` : 'Enter the sampling time with its UTC offset, e.g. 2026-06-14T09:30-06:00.';
  const t0 = time ?? isoWithOffset();
  if (!form.siteId) missing.push('site');

  const field: NonNullable<SampleInputRecord['field']> = { kits: [], ions: {} };
  const temp = readings(form.temp, 'temp', RULES.temp, errors, 1, t0);
  if (temp.length) field.tempC = { values: temp };
  else missing.push('water temperature');
  const condScale = form.condUnit === 'mS/cm' ? 1000 : 1;
  const cond = readings(form.cond, 'cond', { ...RULES.cond, unit: form.condUnit === 'mS/cm' ? 'mS/cm' : 'µS/cm' }, errors, condScale, t0);
  if (cond.length) {
    const alpha = num('alpha', form.alpha, RULES.alpha) ?? 0.0191;
    const ecT = form.condMode === 'ec' ? num('ecTempC', form.ecTempC, RULES.ecTempC) : undefined;
    field.conductance = { mode: form.condMode, unit: 'uS/cm', values: cond, alpha, ...(ecT !== undefined ? { tempC: ecT } : {}) };
  }
  const ph = readings(form.pH, 'pH', RULES.pH, errors, 1, t0);
  if (ph.length) field.pH = { values: ph };
  const dox = readings(form.do, 'do', { ...RULES.do, unit: form.doUnit }, errors, 1, t0);
  if (dox.length) field.do = { values: dox, unit: form.doUnit };

  if (form.alkMode === 'direct') {
    const a = num('alk', form.alk, { ...RULES.alk, unit: form.alkUnit });
    if (a !== undefined) field.alkalinity = { kind: 'direct', value: a, unit: form.alkUnit };
  } else {
    const vs = num('titSampleMl', form.titSampleMl, RULES.titSampleMl);
    const n = num('titNormality', form.titNormality, RULES.titNormality);
    const cf = num('titCf', form.titCf, RULES.titCf) ?? 1;
    const points: Array<{ amount: number; pH: number }> = [];
    form.titPoints.forEach((p, i) => {
      const am = parseDecimal(p.amount, { ...RULES.titAmount, unit: form.titEquipment === 'buret' ? 'mL' : 'counts' });
      const pp = parseDecimal(p.pH, RULES.pH);
      if (!am.ok) errors[`titPoints.${i}.amount`] = am.error;
      if (!pp.ok) errors[`titPoints.${i}.pH`] = pp.error;
      if (am.ok && pp.ok && am.value !== undefined && pp.value !== undefined) points.push({ amount: am.value, pH: pp.value });
    });
    if (vs !== undefined && n !== undefined && points.length >= 2) {
      field.alkalinity = {
        kind: 'titration',
        titration: { sampleVolumeMl: vs, titrantNormality: n, correctionFactor: cf, equipment: form.titEquipment, countsPerMl: 800, filtered: true, points },
      };
    }
  }
  const kit = num('kitValue', form.kitValue, { ...RULES.kitValue, unit: form.kitUnit });
  if (kit !== undefined) {
    const analyte = form.kitAnalyte === 'calcium' && form.kitUnit === 'mg/L CaCO3' ? 'calcium-hardness' : form.kitAnalyte;
    field.kits!.push({ analyte, value: kit, unit: form.kitUnit, fraction: form.kitFiltered ? 'dissolved' : 'total' });
  }
  const th = num('totalHardness', form.totalHardness, { ...RULES.kitValue, label: 'total hardness', unit: 'mg/L as CaCO₃' });
  if (th !== undefined) field.kits!.push({ analyte: 'total-hardness', value: th, unit: 'mg/L CaCO3', fraction: form.kitFiltered ? 'dissolved' : 'total' });
  for (const f of ION_FIELDS) {
    const v = num(`ions.${f.key}`, form.ions[f.key] ?? '', { ...RULES.ion, label: f.label.toLowerCase() });
    if (v !== undefined) (field.ions as Record<string, number>)[f.key] = v;
  }

  const pr = num('pressure', form.pressure, { ...RULES.pressure, unit: form.pressureUnit });
  const record: SampleInputRecord = {
    ...(form.id ? { id: form.id } : {}),
    siteId: form.siteId,
    time: t0,
    crew: form.crew.split(/[,;]/).map((s) => s.trim()).filter(Boolean),
    method: form.method,
    flow: form.flow,
    weather: form.weather,
    qc: { type: form.qcType, ...(form.qcType !== 'environmental' && form.parentId ? { parentId: form.parentId } : {}) },
    field,
    remarks: form.remarks,
    qualifiers: form.qualifiers,
    ...(pr !== undefined ? { pressure: { value: pr, unit: form.pressureUnit, source: form.pressureSource } } : {}),
  };
  if (form.qcType === 'replicate' && !form.parentId) missing.push('the environmental sample this replicates');
  return { record, errors, missing };
}

const timed = (vals: Array<{ time: string; value: number }> | undefined, scale = 1): TimedRaw[] =>
  vals && vals.length ? vals.map((x) => ({ v: String(x.value / scale), t: x.time })) : [{ v: '', t: '' }];

/** Open a stored sample for editing. */
export function formFromSample(s: Sample): SampleForm {
  const f = emptyForm();
  const fld = s.field;
  const alk = fld.alkalinity;
  const kit = fld.kits.find((k) => k.analyte === 'calcium' || k.analyte === 'calcium-hardness');
  const th = fld.kits.find((k) => k.analyte === 'total-hardness');
  return {
    ...f,
    id: s.id,
    siteId: s.siteId,
    time: s.time,
    crew: s.crew.join(', '),
    qcType: s.qc.type,
    parentId: s.qc.parentId ?? '',
    method: s.method,
    flow: s.flow,
    weather: s.weather,
    temp: timed(fld.tempC?.values),
    condMode: fld.conductance?.mode ?? 'sc',
    condUnit: 'uS/cm',
    cond: timed(fld.conductance?.values),
    ecTempC: fld.conductance?.tempC !== undefined ? String(fld.conductance.tempC) : '',
    alpha: String(fld.conductance?.alpha ?? 0.0191),
    pH: timed(fld.pH?.values),
    doUnit: fld.do?.unit ?? 'mg/L',
    do: timed(fld.do?.values),
    pressure: s.pressure ? String(s.pressure.value) : '',
    pressureUnit: s.pressure?.unit ?? 'hPa',
    pressureSource: s.pressure?.source ?? 'station',
    alkMode: alk?.kind === 'titration' ? 'titration' : 'direct',
    alk: alk?.kind === 'direct' ? String(alk.value) : '',
    alkUnit: alk?.kind === 'direct' ? alk.unit : 'mg/L CaCO3',
    titSampleMl: alk?.kind === 'titration' ? String(alk.titration.sampleVolumeMl) : f.titSampleMl,
    titNormality: alk?.kind === 'titration' ? String(alk.titration.titrantNormality) : '',
    titCf: alk?.kind === 'titration' ? String(alk.titration.correctionFactor) : '1',
    titEquipment: alk?.kind === 'titration' ? alk.titration.equipment : 'buret',
    titPoints: alk?.kind === 'titration' ? alk.titration.points.map((p) => ({ amount: String(p.amount), pH: String(p.pH) })) : f.titPoints,
    kitAnalyte: kit?.analyte === 'calcium-hardness' ? 'calcium-hardness' : 'calcium',
    kitValue: kit ? String(kit.value) : '',
    kitUnit: kit ? kit.unit : 'mg/L',
    kitFiltered: (kit ?? th)?.fraction === 'dissolved',
    totalHardness: th ? String(th.value) : '',
    ions: Object.fromEntries(ION_FIELDS.map((x) => [x.key, fld.ions[x.key] !== undefined ? String(fld.ions[x.key]) : ''])) as Record<IonKey, string>,
    remarks: s.remarks,
    qualifiers: s.qualifiers,
  };
}

/**
 * Put what the form edits onto the stored record, keeping every stored field the form does not
 * show (field day, appearance, reading override reasons, kit steps, other kits, titration counts
 * per mL and filtering, created-by, lab values, profile version, demo mark …). Without this an edit
 * would silently drop them.
 */
export function applyFormToSample(stored: Sample, rec: SampleInputRecord): SampleInputRecord {
  const sf = stored.field;
  const rf = rec.field ?? { kits: [], ions: {} };
  const withOverride = <R extends { values: unknown[] }>(next: R | undefined, before: { override?: string | undefined } | undefined): R | undefined =>
    next && before?.override !== undefined ? { ...next, override: before.override } : next;
  const FORM_KITS = new Set(['calcium', 'calcium-hardness', 'total-hardness']);
  // Kits keep their stored order and steps; the form's calcium and hardness kits replace their stored ones.
  const fromForm = (rf.kits ?? []).map((k) => {
    const before = sf.kits.find((b) => b.analyte === k.analyte || (FORM_KITS.has(b.analyte) && b.analyte !== 'total-hardness' && k.analyte !== 'total-hardness'));
    const withStep = before?.step !== undefined && k.step === undefined ? { ...k, step: before.step } : k;
    // a stored kit without a fraction stays without one unless the crew ticked "filtered"
    if (before && before.fraction === undefined && withStep.fraction === 'total') {
      const { fraction: _f, ...rest } = withStep;
      return rest;
    }
    return withStep;
  });
  const slot = (a: string) => (a === 'total-hardness' ? 'th' : FORM_KITS.has(a) ? 'ca' : a);
  const kits: typeof fromForm = [];
  for (const k of sf.kits) {
    if (!FORM_KITS.has(k.analyte)) kits.push(k);
    else {
      const mine = fromForm.find((f) => slot(f.analyte) === slot(k.analyte));
      if (mine && !kits.includes(mine)) kits.push(mine);
    }
  }
  for (const f of fromForm) if (!kits.includes(f)) kits.push(f);
  let alkalinity = rf.alkalinity;
  if (alkalinity?.kind === 'titration' && sf.alkalinity?.kind === 'titration') {
    const b = sf.alkalinity.titration;
    alkalinity = { kind: 'titration', titration: { ...alkalinity.titration, countsPerMl: b.countsPerMl, filtered: b.filtered } };
  }
  const field: NonNullable<SampleInputRecord['field']> = {
    ...sf,
    ...rf,
    kits,
    ions: { ...rf.ions },
  };
  const tempC = withOverride(rf.tempC, sf.tempC);
  const pH = withOverride(rf.pH, sf.pH);
  const dox = withOverride(rf.do, sf.do);
  if (tempC) field.tempC = tempC; else delete field.tempC;
  if (pH) field.pH = pH; else delete field.pH;
  if (dox) field.do = dox; else delete field.do;
  if (rf.conductance) {
    // SC mode has no temperature field on the form: a stored one stays.
    const keepT = rf.conductance.mode === 'sc' && sf.conductance?.mode === 'sc' && sf.conductance.tempC !== undefined;
    field.conductance = keepT ? { ...rf.conductance, tempC: sf.conductance!.tempC } : rf.conductance;
  } else delete field.conductance;
  if (alkalinity) field.alkalinity = alkalinity; else delete field.alkalinity;
  // The crew list is shown as text: an unedited list keeps its stored entries exactly.
  const crew = rec.crew && rec.crew.join(', ') === stored.crew.map((c) => c.trim()).filter(Boolean).join(', ') ? stored.crew : rec.crew;
  const qc = rec.qc && rec.qc.type === stored.qc.type && (rec.qc.parentId ?? '') === (stored.qc.type === 'environmental' ? '' : stored.qc.parentId ?? '') ? stored.qc : rec.qc;
  const next: SampleInputRecord = { ...stored, ...rec, id: stored.id, crew, field };
  next.localDate = (rec.time ?? stored.time).slice(0, 10);
  if (qc) next.qc = qc;
  if (rec.pressure) next.pressure = rec.pressure;
  else delete next.pressure;
  return next;
}
