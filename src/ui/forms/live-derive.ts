// The live result under a half-typed sample: when the engine refuses one entry (an InputError
// naming its field), that entry is marked beside its own box and left out, and everything that
// does not depend on it is derived and shown as usual. One slip never blanks the whole screen.
import { deriveSample, type Derived } from '../../records/derive';
import type { MethodProfile } from '../../chemistry';
import type { Sample, Settings } from '../../records/schema';
import type { SampleInputRecord } from '../../store/records';
import type { FormErrors, SampleForm } from './sample-form';
import { warningKind } from '../warning-kinds';

type Field = Sample['field'];
type Part = { field: Field; pressure: Sample['pressure'] | undefined };

interface Drop {
  formKey: (form: SampleForm) => string;
  label: string;
  /** the value as typed and its unit, to say the allowed range in the crew's own unit */
  typed: (form: SampleForm) => { value: string; unit: string };
  remove: (p: Part) => Part;
}

const without = <K extends keyof Field>(f: Field, k: K): Field => {
  const c = { ...f };
  delete c[k];
  return c;
};

const PRESSURE: Drop = {
  formKey: () => 'pressure',
  label: 'Barometric pressure',
  typed: (f) => ({ value: f.pressure, unit: f.pressureUnit }),
  remove: (p) => ({ field: p.field, pressure: undefined }),
};
const COND: Drop = {
  formKey: () => 'cond.0',
  label: 'Conductance',
  typed: (f) => ({ value: f.cond[0]?.v ?? '', unit: f.condUnit === 'mS/cm' ? 'mS/cm' : 'µS/cm' }),
  remove: (p) => ({ ...p, field: without(p.field, 'conductance') }),
};
const ALK: Drop = {
  formKey: (f) => (f.alkMode === 'direct' ? 'alk' : 'titNormality'),
  label: 'Alkalinity',
  typed: (f) => ({ value: f.alkMode === 'direct' ? f.alk : '', unit: f.alkUnit }),
  remove: (p) => ({ ...p, field: without(p.field, 'alkalinity') }),
};
const ion = (key: string, label: string): Drop => ({
  formKey: () => `ions.${key}`,
  label,
  typed: (f) => ({ value: (f.ions as Record<string, string>)[key] ?? '', unit: 'mg/L' }),
  remove: (p) => ({ ...p, field: { ...p.field, ions: Object.fromEntries(Object.entries(p.field.ions).filter(([k]) => k !== key)) } }),
});

/** Engine field names (InputError.field) to the form box they come from. */
const DROPS: Record<string, Drop> = {
  pressure: PRESSURE,
  pressureKPa: PRESSURE,
  scUsPerCm: COND,
  ecUsPerCm: COND,
  conductivityUsPerCm: COND,
  conductivityRatio: COND,
  salinity: COND,
  alpha: { ...COND, formKey: () => 'alpha', label: 'Compensation coefficient α', typed: (f) => ({ value: f.alpha, unit: '/°C' }) },
  'conductance.tempC': { ...COND, formKey: () => 'ecTempC', label: 'Temperature of the EC reading', typed: (f) => ({ value: f.ecTempC, unit: '°C' }) },
  pH: { formKey: () => 'pH.0', label: 'pH', typed: (f) => ({ value: f.pH[0]?.v ?? '', unit: '' }), remove: (p) => ({ ...p, field: without(p.field, 'pH') }) },
  doMgL: { formKey: () => 'do.0', label: 'Dissolved oxygen', typed: (f) => ({ value: f.do[0]?.v ?? '', unit: f.doUnit }), remove: (p) => ({ ...p, field: without(p.field, 'do') }) },
  percent: { formKey: () => 'do.0', label: 'Dissolved oxygen', typed: (f) => ({ value: f.do[0]?.v ?? '', unit: f.doUnit }), remove: (p) => ({ ...p, field: without(p.field, 'do') }) },
  alkalinityMgLCaCO3: ALK,
  points: ALK,
  sampleVolumeMl: { ...ALK, formKey: () => 'titSampleMl' },
  titrantNormality: { ...ALK, formKey: () => 'titNormality' },
  caMgL: {
    formKey: () => 'kitValue',
    label: 'Calcium',
    typed: (f) => ({ value: f.kitValue, unit: f.kitUnit }),
    remove: (p) => ({ ...p, field: { ...p.field, kits: p.field.kits.filter((k) => k.analyte !== 'calcium' && k.analyte !== 'calcium-hardness') } }),
  },
  mgMgL: { ...ion('mgMgL', 'Magnesium'), remove: (p) => ({ ...p, field: { ...ion('mgMgL', '').remove(p).field, kits: p.field.kits.filter((k) => k.analyte !== 'total-hardness' && k.analyte !== 'magnesium') } }) },
  naMgL: ion('naMgL', 'Sodium'),
  kMgL: ion('kMgL', 'Potassium'),
  clMgL: ion('clMgL', 'Chloride'),
  so4MgL: ion('so4MgL', 'Sulfate'),
  no3NMgL: ion('no3NMgL', 'Nitrate as N'),
  fMgL: ion('fMgL', 'Fluoride'),
  sio2MgL: ion('sio2MgL', 'Silica'),
  tdsMgL: ion('tdsMgL', 'Total dissolved solids'),
  totalNH3NMgL: ion('nh3nh4NMgL', 'Total ammonia as N'),
};

const fmt = (v: number) => (Math.abs(v) >= 100 ? v.toFixed(0) : v.toPrecision(3)).replace(/\.0+$/, '');

/** Say an engine refusal in the crew's words and unit ("… 29.9 hPa is outside 507–1115 hPa"). */
function say(drop: Drop, form: SampleForm, engineMessage: string): string {
  const t = drop.typed(form);
  const unit = t.unit ? ` ${t.unit}` : '';
  const m = /=\s*(-?[\d.e+-]+).*range\s+(-?[\d.e+-]+)\s+to\s+(-?[\d.e+-]+)/.exec(engineMessage);
  const typed = Number(t.value.replace(',', '.'));
  if (m && Number.isFinite(typed) && Number(m[1]) !== 0) {
    const k = typed / Number(m[1]);
    return `${drop.label} ${t.value}${unit} is outside ${fmt(Number(m[2]) * k)}–${fmt(Number(m[3]) * k)}${unit}: check the value and its unit.`;
  }
  return `${drop.label}: this value cannot be used (${engineMessage.replace(/\.$/, '')}). Check the value and its unit.`;
}

/** An engine warning tied to a box, said in the crew's unit where the engine gives a range in its own. */
function sayWarning(drop: Drop, form: SampleForm, message: string, d: Derived): string {
  const t = drop.typed(form);
  const typed = Number(t.value.replace(',', '.'));
  const m = /(-?[\d.]+)–(-?[\d.]+) kPa/.exec(message);
  if (drop === PRESSURE && m && d.pressureKPa && Number.isFinite(typed)) {
    const k = typed / d.pressureKPa;
    return `${drop.label} ${t.value} ${t.unit} is outside ${fmt(Number(m[1]) * k)}–${fmt(Number(m[2]) * k)} ${t.unit}: check the value and its unit.`;
  }
  return message;
}

/**
 * Derive as far as the entries allow. `errors`: entries the engine refused (marked, left out, and
 * to be corrected before saving). `marks`: warnings that need action and name an entry, shown on
 * that entry's own box (a pressure slip, a unit slip) without blocking the save.
 */
export function deriveLive(
  form: SampleForm,
  record: SampleInputRecord,
  lab: Sample['lab'],
  settings: Pick<Settings, 'activityModel' | 'conductanceFactor'>,
  profile: MethodProfile,
): { derived: Derived; errors: FormErrors; marks: FormErrors } {
  let part: Part = { field: record.field as Field, pressure: record.pressure };
  const errors: FormErrors = {};
  let d = deriveSample({ ...part, lab }, settings, profile);
  for (let i = 0; i < 6 && d.error; i++) {
    const drop = DROPS[d.error.field] ?? (/^points\[/.test(d.error.field) ? ALK : undefined);
    if (!drop) break;
    errors[drop.formKey(form)] = say(drop, form, d.error.message);
    part = drop.remove(part);
    d = deriveSample({ ...part, lab }, settings, profile);
  }
  const marks: FormErrors = {};
  for (const w of d.warnings) {
    const drop = w.field ? DROPS[w.field] : undefined;
    if (!drop || warningKind(w) !== 'action') continue;
    const key = drop.formKey(form);
    if (!errors[key] && !marks[key]) marks[key] = sayWarning(drop, form, w.message, d);
  }
  return { derived: d, errors, marks };
}
