// Which engine warnings the crew must act on at the bank, and which are standing notices that belong
// with the result's details. The engine's own `kind` decides where it is given; the code list below
// covers warnings that come without one (e.g. from the titration), and the "still to enter" hints.
import type { ChemWarning } from '../chemistry';

export type WarningKind = 'action' | 'notice' | 'missing';

/** Codes that describe the result rather than ask for a re-measurement. */
const NOTICE = new Set<string>([
  'ionic-strength-estimated',
  'ionic-strength-partial',
  'pco2-high',
  'pco2-below-atmosphere',
  'si-will-rise-downstream',
  'alkalinity-noncarbonate',
  'constants-extrapolated',
  'activity-model-out-of-range',
  'temperature-assumed',
]);

/** Codes that say what is still to be entered (shown as a hint, not as an alarm). */
const MISSING = new Set<string>(['needs-temperature', 'calcite-needs-inputs', 'ionic-strength-unknown']);

export function warningKind(w: ChemWarning): WarningKind {
  if (MISSING.has(w.code)) return 'missing';
  if (w.kind) return w.kind; // the engine's own word wins where it gives one
  return NOTICE.has(w.code) ? 'notice' : 'action';
}

export function splitWarnings(ws: ChemWarning[]): Record<WarningKind, ChemWarning[]> {
  const out: Record<WarningKind, ChemWarning[]> = { action: [], notice: [], missing: [] };
  for (const w of ws) out[warningKind(w)].push(w);
  return out;
}
