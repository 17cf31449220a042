import { describe, expect, it, beforeEach } from 'vitest';
import { readFileSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { join } from 'node:path';
import { parseCsv } from '../../src/exchange/csv';
import { OFFICE_COLUMNS, recomputeCsv } from '../../src/exchange/recompute';
import { applyLabRows, checkLabRows, guessMapping } from '../../src/exchange/lab-import';
import { loadDemo } from '../../src/demo/load';
import { getSample, history } from '../../src/store';
import { freshDb } from '../store/helpers';

const fx = (n: string) => readFileSync(join(__dirname, '../fixtures/exchange', n), 'utf8');

describe('office recompute', () => {
  it('re-runs the engine on an exported day: the office SI equals the field SI (same engine)', () => {
    const { header, rows } = parseCsv(recomputeCsv(fx('demo-day.csv')));
    expect(header.slice(-OFFICE_COLUMNS.length)).toEqual(OFFICE_COLUMNS);
    expect(rows).toHaveLength(3);
    for (const r of rows) {
      expect(r.office_error).toBe('');
      expect(Number(r.office_si_calcite)).toBeCloseTo(Number(r.si_calcite), 9);
      expect(r.office_differs_from_field).toBe('no');
      // DO saturation now comes from the engine (salinity from SC, the row's pressure): fresh water, same figure
      if (r.do_saturation_pct) expect(Number(r.office_do_saturation_pct)).toBeCloseTo(Number(r.do_saturation_pct), 0);
    }
    expect(rows.some((r) => r.office_do_saturation_pct !== '')).toBe(true);
  });
  it('joined with a lab report, fills the missing ions and checks the balance (Standard Methods 1030 E)', () => {
    const { rows } = parseCsv(recomputeCsv(fx('demo-day.csv'), fx('demo-lab.csv')));
    const wf01 = rows.find((r) => r.sample_id === 'demo-sample-2-0')!;
    expect(wf01.office_lab_values_used).toBe('mgMgL; naMgL; kMgL; clMgL; so4MgL');
    expect(wf01.office_ionic_strength_source).toBe('composition');
    expect(Number.isFinite(Number(wf01.office_charge_balance_pct))).toBe(true);
    expect(wf01.office_charge_balance_ok).toMatch(/true|false/);
    // field calcium is kept, the lab's 60.2 does not replace the field kit's 61
    expect(wf01.ca_mg_L).toBe('61');
  });
  it('runs as `npm run recompute -- day.csv --lab lab.csv`', () => {
    const out = execFileSync('node', ['scripts/recompute.mjs', 'test/fixtures/exchange/demo-day.csv', '--lab', 'test/fixtures/exchange/demo-lab.csv'], { encoding: 'utf8' });
    expect(parseCsv(out).rows).toHaveLength(3);
    expect(out.split('\r\n')[0]).toContain('office_si_calcite');
  }, 60_000);
  it('refuses a file that is not a samples CSV, saying so', () => {
    expect(() => recomputeCsv('a,b\r\n1,2\r\n')).toThrow(/no sample_id column/);
  });
});

describe('lab-results import', () => {
  beforeEach(freshDb);
  it('maps columns, reports row errors, stores lab values beside field values with a revision', async () => {
    await loadDemo(new Date('2026-06-14T12:00:00'));
    const text = fx('demo-lab.csv');
    const mapping = guessMapping(parseCsv(text).header);
    expect(mapping).toMatchObject({ sampleId: 'sample_id', parameter: 'parameter', value: 'value', unit: 'unit', qualifier: 'qualifier', labSampleId: 'lab_sample_id' });
    const known = new Set(['demo-sample-2-0', 'demo-sample-2-1']);
    const { rows, fileErrors } = checkLabRows(text, mapping as never, known);
    expect(fileErrors).toEqual([]);
    expect(rows.filter((r) => r.errors.length > 0).map((r) => [r.row, r.errors[0]])).toEqual([
      [8, 'sample “demo-sample-9-9” is not on this phone'],
      [9, 'value “<0.5” is not a number'],
    ]);
    const before = await getSample('demo-sample-2-0');
    const res = await applyLabRows(rows, 'office');
    expect(res).toEqual({ samples: 1, values: 6, skipped: 2 });
    const after = (await getSample('demo-sample-2-0'))!;
    expect(after.lab.map((l) => l.parameter)).toEqual(['Magnesium', 'Sodium', 'Potassium', 'Chloride', 'Sulfate', 'Calcium']);
    expect(after.field).toEqual(before!.field);
    expect((await history('demo-sample-2-0')).at(-1)!.by).toBe('office');
    expect((await applyLabRows(rows, 'office')).values).toBe(0); // importing again adds nothing
  });
});
