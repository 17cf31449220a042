// Node only (the office command and tests): any UCUM unit through the full UCUM library, after
// the lab spellings the phone's small mapping knows. Never imported by the app (the library is
// about 59 kB gzip in a browser; test/exchange/units.test.ts checks the build has none of it).
import ucum from '@lhncbc/ucum-lhc';
import { parseLabUnit, type LabUnit } from '../records/lab-units';

const utils = ucum.UcumLhcUtils.getInstance();
const TARGETS: Array<[string, LabUnit['kind']]> = [['mg/L', 'mass'], ['mmol/L', 'amount'], ['meq/L', 'equivalents'], ['uS/cm', 'conductance']];

/** Run a library call with its console.log silenced (it logs parse errors, which would land in a CSV on stdout). */
function quiet<T>(f: () => T): T {
  const log = console.log;
  console.log = () => {};
  try {
    return f();
  } finally {
    console.log = log;
  }
}

/** Is this a valid UCUM code (case-sensitive, as UCUM requires; no spaces)? */
export function isUcum(code: string): boolean {
  return !/\s/.test(code) && quiet(() => utils.validateUnitString(code)).status === 'valid';
}

/**
 * A lab unit: a common lab spelling ("mg/l as N", "uS/cm @25C", "std units", "NTU") or any valid
 * UCUM code (e.g. "mg/dL", "ug/mL", "g/m3"), with its factor to mg/L, mmol/L, meq/L or µS/cm.
 * undefined when it is neither.
 */
export function labUnit(raw: string): LabUnit | undefined {
  const known = parseLabUnit(raw);
  if (known) return known;
  const code = raw.trim();
  if (!code || !isUcum(code)) return undefined;
  for (const [target, kind] of TARGETS) {
    const r = quiet(() => utils.convertUnitTo(code, 1, target));
    if (r.status === 'succeeded' && r.toVal !== null && Number.isFinite(r.toVal)) return { ucum: code, kind, factor: r.toVal };
  }
  return { ucum: code, kind: 'other', factor: 1 };
}
