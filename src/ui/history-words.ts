// A sample's history said in the crew's words: "DO reading 1: 9.8 → 9.6 mg/L", never a stored path
// such as "field.do.values.0.value". Paths come from records/diff.ts over the stored sample.
import type { Change } from '../records/diff';
import { ION_FIELDS } from './forms/sample-form';
import { showDateTime } from './format';

const READINGS: Record<string, { name: string; unit: string }> = {
  tempC: { name: 'Temperature', unit: '°C' },
  pH: { name: 'pH', unit: '' },
  do: { name: 'DO', unit: '' },
  conductance: { name: 'Conductance', unit: 'µS/cm' },
};

const TOP: Record<string, string> = {
  siteId: 'Site',
  time: 'Sampling time',
  crew: 'Crew',
  method: 'Method',
  flow: 'Flow',
  weather: 'Weather',
  remarks: 'Remarks',
  qualifiers: 'Qualifiers',
  'qc.type': 'Sample type',
  'qc.parentId': 'Parent sample',
  'pressure.value': 'Barometric pressure',
  'pressure.unit': 'Pressure unit',
  'pressure.source': 'Pressure source',
  'field.conductance.mode': 'Conductance as read',
  'field.conductance.alpha': 'Compensation coefficient α',
  'field.conductance.tempC': 'Temperature of the EC reading',
  'field.alkalinity.value': 'Alkalinity',
  'field.alkalinity.unit': 'Alkalinity unit',
  'field.alkalinity.kind': 'Alkalinity entered as',
  'field.do.unit': 'DO unit',
  deletedAt: 'Deleted',
};

const ION_NAMES = Object.fromEntries(ION_FIELDS.map((f) => [f.key, f]));
const KIT_WORDS: Record<string, string> = { calcium: 'Calcium kit', 'calcium-hardness': 'Calcium hardness kit', 'total-hardness': 'Total hardness kit', magnesium: 'Magnesium kit' };

function show(v: unknown): string {
  if (v === undefined || v === null || v === '') return '(empty)';
  if (typeof v === 'string' && /^\d{4}-\d{2}-\d{2}T/.test(v)) return showDateTime(v);
  if (Array.isArray(v)) return v.length ? v.map(show).join(', ') : '(none)';
  if (typeof v === 'object') return '(changed)';
  return String(v);
}

/** One change as a line of words; `units` gives the sample's DO unit where the path alone cannot. */
export function describeChange(c: Change, doUnit = 'mg/L', siteName?: (id: string) => string | undefined): string {
  const p = c.path;
  const r = /^field\.(tempC|pH|do|conductance)\.values\.(\d+)\.(value|time)$/.exec(p);
  if (r) {
    const info = READINGS[r[1]!]!;
    const unit = r[1] === 'do' ? doUnit : info.unit;
    const what = r[3] === 'time' ? ' time' : '';
    return `${info.name} reading ${Number(r[2]) + 1}${what}: ${show(c.from)} → ${show(c.to)}${unit && !what && c.to !== undefined ? ` ${unit}` : ''}`;
  }
  const ion = /^field\.ions\.(\w+)$/.exec(p);
  if (ion && ION_NAMES[ion[1]!]) return `${ION_NAMES[ion[1]!]!.label}: ${show(c.from)} → ${show(c.to)} mg/L`;
  const kit = /^field\.kits\.(\d+)\.(value|unit|analyte)$/.exec(p);
  if (kit) return `Kit result ${Number(kit[1]) + 1}${kit[2] === 'value' ? '' : ` ${kit[2] === 'unit' ? 'unit' : 'type'}`}: ${show(KIT_WORDS[c.from as string] ?? c.from)} → ${show(KIT_WORDS[c.to as string] ?? c.to)}`;
  const pt = /^field\.alkalinity\.titration\.points\.(\d+)\.(amount|pH)$/.exec(p);
  if (pt) return `Titration point ${Number(pt[1]) + 1} ${pt[2] === 'pH' ? 'pH' : 'titrant'}: ${show(c.from)} → ${show(c.to)}`;
  if (p.startsWith('field.alkalinity.titration.')) return `Titration ${p.split('.').pop()!.replace(/([A-Z])/g, ' $1').toLowerCase()}: ${show(c.from)} → ${show(c.to)}`;
  if (p === 'siteId' && siteName) return `Site: ${siteName(String(c.from)) ?? show(c.from)} → ${siteName(String(c.to)) ?? show(c.to)}`;
  const crew = /^crew\.\d+$/.test(p) ? 'Crew' : /^qualifiers\.\d+$/.test(p) ? 'Qualifiers' : undefined;
  const label = TOP[p] ?? crew;
  if (label) return `${label}: ${show(c.from)} → ${show(c.to)}`;
  // anything not named above: its last words, never the raw path
  const words = p.split('.').filter((x) => !/^\d+$/.test(x)).pop() ?? p;
  return `${words.replace(/([A-Z])/g, ' $1').replace(/^./, (ch) => ch.toUpperCase())}: ${show(c.from)} → ${show(c.to)}`;
}

export const ACTION_WORDS: Record<string, string> = { create: 'Recorded', update: 'Changed', delete: 'Deleted', restore: 'Restored', import: 'Imported' };
