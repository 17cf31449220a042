import { DEFAULT_PROFILE, DEFAULT_QC_LIMITS, profileRef, type MethodProfile, type ProfileRef, type QcParameter } from './profiles';
import { replicateRpd } from './stabilization';

/** Values of one sample for QC, in the engine's units (°C, pH, µS/cm at 25 °C, mg/L, mg/L as CaCO₃). */
export type QcValues = Partial<Record<QcParameter, number>>;

export interface QcCheck {
  parameter: QcParameter;
  /** the QC sample's value */
  value: number;
  /** the parent's value (replicates) */
  parentValue?: number;
  /** |value − parentValue| (replicates) */
  difference?: number;
  /** relative percent difference (replicates, ratio quantities) */
  rpdPercent?: number;
  pass: boolean;
  /** what was compared with what, in words */
  message: string;
}

export interface QcVerdict {
  kind: 'replicate' | 'blank';
  /** true: every judged parameter passes; false: one fails; undefined: nothing could be judged */
  pass: boolean | undefined;
  checks: QcCheck[];
  profile: ProfileRef;
}

const NAMES: Record<QcParameter, string> = { temperature: 'Temperature', pH: 'pH', sc: 'SC', do: 'DO', alkalinity: 'Alkalinity', calcium: 'Calcium' };
const UNITS: Record<QcParameter, string> = { temperature: ' °C', pH: '', sc: ' µS/cm', do: ' mg/L', alkalinity: ' mg/L CaCO₃', calcium: ' mg/L' };
const ORDER: QcParameter[] = ['temperature', 'pH', 'sc', 'do', 'alkalinity', 'calcium'];

const fmt = (v: number) => (Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 10 ? v.toFixed(1) : v.toFixed(2));
const verdictOf = (checks: QcCheck[]) => (checks.length === 0 ? undefined : checks.every((c) => c.pass));

/**
 * A field replicate against its parent, parameter by parameter: RPD = 100 |a − b| / ((a + b)/2)
 * (common QC practice, e.g. EPA SW-846 ch. 1) within the profile's limit, or the plain difference
 * within its limit (pH and temperature by difference only). Parameters missing on either side are
 * not judged. Limits: the profile's `qc.replicate` (defaults in {@link DEFAULT_QC_LIMITS}).
 */
export function replicateVerdict(replicate: QcValues, parent: QcValues, profile: MethodProfile = DEFAULT_PROFILE): QcVerdict {
  const limits = (profile.qc ?? DEFAULT_QC_LIMITS).replicate;
  const checks: QcCheck[] = [];
  for (const p of ORDER) {
    const a = replicate[p];
    const b = parent[p];
    if (a === undefined || b === undefined || !Number.isFinite(a) || !Number.isFinite(b)) continue;
    const lim = limits[p];
    const difference = Math.abs(a - b);
    const rpd = lim.maxRpdPercent !== undefined ? replicateRpd(a, b) : undefined;
    const byRpd = rpd !== undefined && lim.maxRpdPercent !== undefined && rpd <= lim.maxRpdPercent + 1e-9;
    const byAbs = lim.maxAbsDiff !== undefined && difference <= lim.maxAbsDiff + 1e-9;
    const pass = byRpd || byAbs;
    const allowed = [lim.maxRpdPercent !== undefined ? `${lim.maxRpdPercent} %` : '', lim.maxAbsDiff !== undefined ? `${lim.maxAbsDiff}${UNITS[p]}` : ''].filter(Boolean).join(' or ');
    const said = rpd !== undefined ? `RPD ${rpd.toFixed(1)} % (difference ${fmt(difference)}${UNITS[p]})` : `difference ${fmt(difference)}${UNITS[p]}`;
    checks.push({
      parameter: p,
      value: a,
      parentValue: b,
      difference,
      ...(rpd !== undefined ? { rpdPercent: rpd } : {}),
      pass,
      message: `${NAMES[p]} ${fmt(a)} vs ${fmt(b)}: ${said}, allowed ${allowed}.`,
    });
  }
  return { kind: 'replicate', pass: verdictOf(checks), checks, profile: profileRef(profile) };
}

/**
 * A field blank against the profile's blank limits (`qc.blank`): SC, alkalinity and calcium at or
 * below them. A blank is deionized water: it is never judged against natural-water ranges.
 */
export function blankVerdict(blank: QcValues, profile: MethodProfile = DEFAULT_PROFILE): QcVerdict {
  const lim = (profile.qc ?? DEFAULT_QC_LIMITS).blank;
  const max: Partial<Record<QcParameter, number>> = { sc: lim.scUsPerCm, alkalinity: lim.alkalinityMgLCaCO3, calcium: lim.caMgL };
  const checks: QcCheck[] = [];
  for (const p of ORDER) {
    const v = blank[p];
    const m = max[p];
    if (v === undefined || m === undefined || !Number.isFinite(v)) continue;
    const pass = v <= m + 1e-9;
    checks.push({ parameter: p, value: v, pass, message: `${NAMES[p]} ${fmt(v)}${UNITS[p]} in the blank, allowed up to ${m}${UNITS[p]}.` });
  }
  return { kind: 'blank', pass: verdictOf(checks), checks, profile: profileRef(profile) };
}
