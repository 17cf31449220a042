// Numbers as measured: every exported number is rounded by its parameter's rule (src/exchange/rounding.ts,
// stated in DEVELOPERS.md) and never carries float noise such as 7.079999999999999.
// Source of the rules: the resolution each field method supports (USGS NFM A6, from memory; table in DEVELOPERS.md).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { demoRecords, DEMO_SITES } from '../../src/demo/scenario';
import { calibrationsCsv, longCsv, parseCsv, titrationsCsv, WIDE_COLUMNS, wideCsv } from '../../src/exchange/csv';
import { samplesGeoJson } from '../../src/exchange/geojson';
import { ROUNDING, roundTo, type RoundKey, type RoundRule } from '../../src/exchange/rounding';
import { wqxResultRows } from '../../src/exchange/wqx';
import { CalibrationEvent, DEFAULT_SETTINGS, Sample, Site } from '../../src/records/schema';
import { RECORDED_SAMPLES, RECORDED_SITES } from './recorded-day';

/** Decimals written in a number's text ("1.23e-7" has 9). */
function decimalsOf(text: string): number {
  const m = /^-?\d*(?:\.(\d+))?(?:e([+-]?\d+))?$/i.exec(text.trim());
  if (!m) throw new Error(`not a number: ${text}`);
  return Math.max(0, (m[1]?.length ?? 0) - Number(m[2] ?? 0));
}
/** Significant digits written ("1410" has 3, "0.00912" has 3). */
function sigDigitsOf(text: string): number {
  const mant = text.trim().replace(/^-/, '').replace(/e.*$/i, '');
  const digits = mant.replace('.', '').replace(/^0+/, '');
  return (mant.includes('.') ? digits : digits.replace(/0+$/, '')).length || 1;
}
/** Does the text obey the rule? (Independent of roundTo: reads the digits written.) */
function obeys(rule: RoundRule, text: string): boolean {
  if (rule.kind === 'decimals') return decimalsOf(text) <= rule.decimals;
  return sigDigitsOf(text) <= rule.figures || (rule.wholeUnits === true && decimalsOf(text) === 0);
}

const T = '2026-06-14T12:00:00-06:00';
const meta = { createdAt: T, updatedAt: T };
const demo = demoRecords(new Date('2026-06-14T12:00:00'));
const samples = [...demo.samples.map((s) => Sample.parse({ ...s, ...meta, localDate: s.time.slice(0, 10) })), ...RECORDED_SAMPLES];
const sites = [...DEMO_SITES.map((s) => Site.parse({ ...s, ...meta })), ...RECORDED_SITES];
const ctx = { samples, sites, settings: { ...DEFAULT_SETTINGS, projectId: 'P1', organizationId: 'ORG' } };

describe('rounding rules', () => {
  it.each([
    ['pH', 7.079999999999999, 7.08], // float noise from the entry
    ['temperature', 11.449999, 11.4],
    ['temperature', -0.04, 0], // never "-0"
    ['conductance', 1413.4, 1413], // never coarser than 1 µS/cm
    ['conductance', 45.64, 45.6], // 3 significant figures below 100
    ['conductance', 1.349, 1.35],
    ['ionicStrength', 0.0091234, 0.00912],
    ['concentration', 9.996, 10], // rounding up a magnitude keeps 3 figures: 10.0
    ['concentration', 172.44, 172],
    ['doMgL', 10.905, 10.91],
    ['index', -0.125, -0.12],
  ] as Array<[RoundKey, number, number]>)('%s %d → %d', (key, input, out) => {
    expect(roundTo(ROUNDING[key], input)).toBe(out);
    expect(String(roundTo(ROUNDING[key], input))).toBe(String(out));
  });

  it('property: the printed result of every rule obeys that rule, and is within half a step of the input', () => {
    fc.assert(
      fc.property(fc.constantFrom(...(Object.keys(ROUNDING) as RoundKey[])), fc.double({ min: -1e5, max: 1e5, noNaN: true }), (key, x) => {
        const rule = ROUNDING[key];
        const out = roundTo(rule, x);
        if (!obeys(rule, String(out))) return false;
        return Math.abs(out - x) <= Math.abs(x) * 0.006 + 0.5 * 10 ** -(rule.kind === 'decimals' ? rule.decimals : 0) + 1e-12;
      }),
      { seed: 15, numRuns: 3000 },
    );
  });
});

describe('no exported value carries more digits than its rule', () => {
  it('samples CSV: every numeric column has a rule and obeys it (demo + recorded day)', () => {
    const { rows } = parseCsv(wideCsv(ctx));
    let checked = 0;
    for (const col of WIDE_COLUMNS) {
      for (const r of rows) {
        const cell = r[col.h]!;
        if (cell === '' || !/^-?\d+(\.\d+)?(e[+-]?\d+)?$/i.test(cell)) continue;
        if (/_n$|^profile_version$|^revision$/.test(col.h)) continue; // counts
        expect(col.rule, `${col.h} has no rounding rule`).toBeDefined();
        expect(obeys(ROUNDING[col.rule!], cell), `${col.h} = ${cell}`).toBe(true);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(300);
    expect(rows.find((r) => r.sample_id === 'rec-4')!.ph_field).toBe('7.08');
  });

  it('values CSV: each parameter obeys its rule', () => {
    const RULE_OF: Record<string, RoundKey> = {
      water_temperature: 'temperature', conductivity_raw: 'conductance', specific_conductance_25C: 'conductance', pH: 'pH', dissolved_oxygen: 'doMgL',
      dissolved_oxygen_saturation: 'doPercent', alkalinity_as_CaCO3: 'concentration', calcium: 'concentration', ionic_strength: 'ionicStrength',
      saturation_index_calcite: 'index', saturation_index_aragonite: 'index', saturation_index_dolomite: 'index', saturation_index_gypsum: 'index',
      log_pCO2: 'index', langelier_index: 'index', ryznar_index: 'index', hardness_as_CaCO3: 'concentration', charge_balance: 'percent',
    };
    const { rows } = parseCsv(longCsv(ctx));
    let checked = 0;
    for (const r of rows) {
      if (r.origin === 'lab') continue; // lab values as the lab reported them
      const key = RULE_OF[r.parameter!] ?? 'concentration'; // typed ions, mg/L
      expect(obeys(ROUNDING[key], r.value!), `${r.parameter} = ${r.value}`).toBe(true);
      if (r.band_95pct_plus_minus) expect(obeys(ROUNDING.uncertainty, r.band_95pct_plus_minus), r.band_95pct_plus_minus).toBe(true);
      expect(obeys(ROUNDING.latLon, r.latitude_deg!)).toBe(true);
      checked++;
    }
    expect(checked).toBeGreaterThan(150);
  });

  it('WQX, GeoJSON, meter checks and titration points: no number with float noise (≤ 6 significant digits, lat/lon ≤ 6 decimals)', () => {
    const noisy = (v: unknown, where: string) => {
      if (typeof v !== 'number') return;
      const text = String(v);
      const ok = /latitude|longitude|coordinates/i.test(where) ? decimalsOf(text) <= 6 : sigDigitsOf(text) <= 6;
      expect(ok, `${where} = ${text}`).toBe(true);
    };
    for (const row of wqxResultRows(ctx)) for (const [k, v] of Object.entries(row)) noisy(v, k);
    const g = JSON.parse(samplesGeoJson(samples, sites, DEFAULT_SETTINGS));
    for (const f of g.features) {
      for (const [k, v] of Object.entries(f.properties)) noisy(v, k);
      for (const c of f.geometry?.coordinates ?? []) noisy(c, 'coordinates');
    }
    const cals = demo.calibrations.map((c) => CalibrationEvent.parse({ ...c, ...meta, localDate: c.time.slice(0, 10) }));
    for (const text of [calibrationsCsv(cals), titrationsCsv(samples)]) {
      for (const r of parseCsv(text).rows) for (const [k, v] of Object.entries(r)) if (/^-?\d+\.\d+$/.test(v)) noisy(Number(v), k);
    }
  });
});
