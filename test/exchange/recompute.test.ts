// Office recompute and lab import. Expected values come from the fixtures themselves (invented,
// see test/fixtures/exchange/PROVENANCE.md) and from the engine run on the same inputs (source:
// this test); unit factors from molar masses (IUPAC atomic weights; read).
import { describe, expect, it, beforeEach } from 'vitest';
import { mkdirSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { execFileSync, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { parseCsv } from '../../src/exchange/csv';
import { OFFICE_COLUMNS, VALUES_COLUMNS, recomputeCsv } from '../../src/exchange/recompute';
import { applyLabRows, checkLabRows, guessMapping, sampleLabels } from '../../src/exchange/lab-import';
import { loadDemo } from '../../src/demo/load';
import { deleteSample, getDb, getSample, history, saveSample } from '../../src/store';
import { deriveSample } from '../../src/records/derive';
import { DEFAULT_SETTINGS } from '../../src/records/defaults';
import { freshDb } from '../store/helpers';

const fx = (n: string) => readFileSync(join(__dirname, '../fixtures/exchange', n), 'utf8');
const ROOT = join(__dirname, '../..');

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
  it('joined with a lab report, fills the missing ions and checks the balance (Standard Methods 1030 E); says what it did not use', () => {
    const { rows } = parseCsv(recomputeCsv(fx('demo-day.csv'), fx('demo-lab.csv')));
    const wf01 = rows.find((r) => r.sample_id === 'demo-sample-2-0')!;
    expect(wf01.office_lab_values_used).toBe('mgMgL; naMgL; kMgL; clMgL; so4MgL');
    expect(wf01.office_ionic_strength_source).toBe('composition');
    expect(Number.isFinite(Number(wf01.office_charge_balance_pct))).toBe(true);
    expect(wf01.office_charge_balance_ok).toMatch(/true|false/);
    // field calcium is kept, the lab's 60.2 does not replace the field kit's 61
    expect(wf01.ca_mg_L).toBe('61');
    expect(wf01.office_lab_values_not_used).toBe('Calcium: field value kept');
    expect(rows.find((r) => r.sample_id === 'demo-sample-2-1')!.office_lab_values_not_used).toBe('Chloride: not detected (< 0.5 mg/L)');
  });
  it('lab rows not in mg/L are converted and used, not dropped: meq/L, µg/L, mmol/L, "as N" give the same result as mg/L', () => {
    const asWritten = fx('lab-as-written.csv');
    const a = parseCsv(recomputeCsv(fx('demo-day.csv'), asWritten)).rows.find((r) => r.sample_id === 'demo-sample-2-1')!;
    expect(a.office_lab_values_used).toBe('mgMgL; naMgL; kMgL; clMgL; so4MgL; no3NMgL');
    expect(a.office_lab_values_not_used).toContain('Fluoride: not detected (< 0.05 mg/L)');
    expect(a.office_lab_values_not_used).toContain('Turbidity: not an engine input');
    expect(a.office_lab_values_not_used).toContain('Calcium: field value kept');
    // the same values written in mg/L by hand: Mg 1.07 meq/L × 24.305/2, Na 9800 µg/L, SO4 0.075 mmol/L × 96.06
    const inMgL = ['sample_id,parameter,value,unit', 'demo-sample-2-1,Magnesium,' + (1.07 * 24.305) / 2 + ',mg/L', 'demo-sample-2-1,Sodium,9.8,mg/L', 'demo-sample-2-1,Potassium,2.2,mg/L',
      'demo-sample-2-1,Chloride,6.5,mg/L', 'demo-sample-2-1,Sulfate,' + 0.075 * 96.06 + ',mg/L', 'demo-sample-2-1,Nitrate as N,0.42,mg/L'].join('\n');
    const b = parseCsv(recomputeCsv(fx('demo-day.csv'), inMgL)).rows.find((r) => r.sample_id === 'demo-sample-2-1')!;
    expect(Number(a.office_ionic_strength_mol_L)).toBeCloseTo(Number(b.office_ionic_strength_mol_L), 12);
    expect(Number(a.office_charge_balance_pct)).toBeCloseTo(Number(b.office_charge_balance_pct), 9);
    expect(a.office_ionic_strength_source).toBe('composition');
  });
  it('an unknown lab unit stops the run with the row named', () => {
    const bad = fx('lab-as-written.csv').replace('0.075,mmol/L', '0.075,mg/kg dry').replace('1.4,NTU', '1.4,jackson');
    expect(() => recomputeCsv(fx('demo-day.csv'), bad)).toThrow(/2 row\(s\) refused[\s\S]*row 6 \(demo-sample-2-1 Sulfate\): unit “mg\/kg dry” is not a UCUM unit[\s\S]*row 14 \(demo-sample-2-1 Turbidity\)/);
  });
  it('--format values: one row per value, lab values in the engine unit with what the lab reported, censored ones marked', () => {
    const { header, rows } = parseCsv(recomputeCsv(fx('demo-day.csv'), fx('lab-as-written.csv'), { format: 'values' }));
    expect(header).toEqual(VALUES_COLUMNS);
    const of = (p: string) => rows.find((r) => r.sample_id === 'demo-sample-2-1' && r.parameter === p && r.origin !== 'field')!;
    expect(of('Magnesium')).toMatchObject({ unit_ucum: 'mg/L', origin: 'lab', method: 'EPA 200.7; lab sample L26-0500; reported as 1.07 meq/L' });
    expect(Number(of('Magnesium').value)).toBeCloseTo((1.07 * 24.305) / 2, 9);
    expect(of('Nitrate')).toMatchObject({ value: '0.42', unit_ucum: 'mg{N}/L' });
    expect(of('Fluoride')).toMatchObject({ value: '0.05', qualifier: 'not detected; U' });
    expect(of('Turbidity')).toMatchObject({ value: '1.4', unit_ucum: '{NTU}' });
    expect(of('pH')).toMatchObject({ value: '7.1', unit_ucum: '[pH]', origin: 'lab' });
    expect(of('saturation_index_calcite').origin).toBe('computed');
  });
  it('never writes a formula-looking cell, header names included', () => {
    const day = fx('demo-day.csv').split('\r\n');
    day[0] = day[0]!.replace('weather', '=HYPERLINK("http://x";"y")').replace('remarks', '@SUM(A1)');
    day[1] = day[1]!.replace('overcast after rain', '"=1+2"');
    const out = recomputeCsv(day.join('\r\n'));
    const { header, rows } = parseCsv(out);
    expect(header).toContain(`'=HYPERLINK("http://x";"y")`);
    expect(header).toContain(`'@SUM(A1)`);
    expect(rows[0]![header.find((h) => h.includes('HYPERLINK'))!]).toBe(`'=1+2`);
    for (const cell of [...header, ...rows.flatMap((r) => Object.values(r))]) expect(cell).not.toMatch(/^[=+@\t\r]|^-(?![\d.])/);
  });
  it('refuses a file that is not a samples CSV, saying so', () => {
    expect(() => recomputeCsv('a,b\r\n1,2\r\n')).toThrow(/no sample_id column/);
  });
});

describe('the office command as a program', () => {
  const dir = join(ROOT, 'test-output', 'office');
  const run = (args: string[], opts: { cwd?: string; input?: Buffer } = {}) =>
    spawnSync('npm', ['run', '-s', 'recompute', '--', ...args], { cwd: opts.cwd ?? dir, encoding: 'utf8', input: opts.input, timeout: 60_000 });
  beforeEach(() => {
    rmSync(dir, { recursive: true, force: true });
    mkdirSync(dir, { recursive: true });
    writeFileSync(join(dir, 'day.csv'), fx('demo-day.csv'));
    writeFileSync(join(dir, 'lab.csv'), fx('lab-as-written.csv'));
  });
  it("runs the README's examples exactly as written, from the office's own folder", () => {
    const readme = readFileSync(join(ROOT, 'README.md'), 'utf8');
    const examples = [...readme.matchAll(/^ *(npm run -s recompute -- .+)$/gm)].map((m) => m[1]!.trim());
    expect(examples.length).toBeGreaterThanOrEqual(3);
    for (const cmd of examples) {
      const r = spawnSync('sh', ['-c', cmd], { cwd: dir, encoding: 'utf8', timeout: 60_000 });
      expect(r.status, `${cmd}\n${r.stderr}`).toBe(0);
      const out = /--out (\S+)/.exec(cmd)![1]!;
      const { rows, errors } = parseCsv(readFileSync(join(dir, out), 'utf8'));
      expect(errors).toEqual([]);
      expect(rows.length).toBeGreaterThanOrEqual(3);
      expect(existsSync(join(dir, `${out}.partial`))).toBe(false);
    }
  }, 120_000);
  it('writes only CSV to standard output with -s, reads standard input as -', () => {
    const r = run(['-', '--format', 'values'], { input: Buffer.from(fx('demo-day.csv')) });
    expect(r.status).toBe(0);
    expect(r.stdout.split('\r\n')[0]).toBe(VALUES_COLUMNS.join(','));
    expect(parseCsv(r.stdout).errors).toEqual([]);
  }, 60_000);
  it('refuses non-UTF-8 input saying where, converts it when told the encoding, converts UTF-16 with a BOM', () => {
    const latin = Buffer.from(fx('demo-day.csv').replace('overcast after rain', 'Regen über Nacht'), 'latin1');
    writeFileSync(join(dir, 'latin.csv'), latin);
    const refused = run(['latin.csv', '--out', 'x.csv']);
    expect(refused.status).toBe(1);
    expect(refused.stderr).toMatch(/latin\.csv is not UTF-8 text \(byte 0xFC at byte \d+, line 2\)\. Save it as “CSV UTF-8”.*--encoding windows-1252/);
    expect(existsSync(join(dir, 'x.csv'))).toBe(false);
    expect(existsSync(join(dir, 'x.csv.partial'))).toBe(false);
    const converted = run(['latin.csv', '--encoding', 'windows-1252', '--out', 'x.csv']);
    expect(converted.status, converted.stderr).toBe(0);
    expect(parseCsv(readFileSync(join(dir, 'x.csv'), 'utf8')).rows[0]!.weather).toBe('Regen über Nacht');
    writeFileSync(join(dir, 'utf16.csv'), Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(fx('demo-day.csv'), 'utf16le')]));
    const u16 = run(['utf16.csv', '--out', 'y.csv']);
    expect(u16.status, u16.stderr).toBe(0);
    expect(parseCsv(readFileSync(join(dir, 'y.csv'), 'utf8')).rows).toHaveLength(3);
  }, 90_000);
  it('names bad options and unknown formats', () => {
    expect(run(['day.csv', '--format', 'xml']).stderr).toMatch(/--format must be one of samples, values/);
    expect(run(['day.csv', '--bogus']).stderr).toMatch(/unknown option --bogus/);
    expect(run(['day.csv', '--out', 'day.csv']).stderr).toMatch(/would overwrite the input/);
  }, 60_000);
});

describe('lab-results import', () => {
  beforeEach(freshDb);
  const samplesNow = async () => sampleLabels(await (await getDb()).getAll('samples'));

  it('maps columns, reports row errors, stores lab values beside field values with a revision', async () => {
    await loadDemo(new Date('2026-06-14T12:00:00'));
    const text = fx('demo-lab.csv');
    const mapping = guessMapping(parseCsv(text).header);
    expect(mapping).toMatchObject({ sampleId: 'sample_id', parameter: 'parameter', value: 'value', unit: 'unit', qualifier: 'qualifier', labSampleId: 'lab_sample_id' });
    const { rows, fileErrors } = checkLabRows(text, mapping as never, await samplesNow());
    expect(fileErrors).toEqual([]);
    expect(rows.filter((r) => r.errors.length > 0).map((r) => [r.row, r.errors[0]])).toEqual([[8, 'sample “demo-sample-9-9” is not on this phone']]);
    // "<0.5" with a "<" qualifier is a censored value with its limit, no longer "not a number"
    expect(rows.find((r) => r.row === 9)).toMatchObject({ censored: true, detectionLimit: 0.5, errors: [] });
    const before = await getSample('demo-sample-2-0');
    const res = await applyLabRows(rows, 'office');
    expect(res).toEqual({ samples: 2, values: 7, skipped: 1 });
    const after = (await getSample('demo-sample-2-0'))!;
    expect(after.lab.map((l) => l.parameter)).toEqual(['Magnesium', 'Sodium', 'Potassium', 'Chloride', 'Sulfate', 'Calcium']);
    expect(after.field).toEqual(before!.field);
    expect((await getSample('demo-sample-2-1'))!.lab).toEqual([expect.objectContaining({ parameter: 'Chloride', censored: true, detectionLimit: 0.5, unitUcum: 'mg/L' })]);
    expect((await history('demo-sample-2-0')).at(-1)).toMatchObject({ by: 'office', action: 'import' });
    expect((await applyLabRows(rows, 'office')).values).toBe(0); // importing again adds nothing
  });

  it('guesses the client sample ID among common header names, and by which column holds this phone’s codes', async () => {
    expect(guessMapping(['Lab Sample ID', 'Client Sample ID', 'Analyte', 'Result', 'Units', 'Qualifier', 'MDL', 'Method'])).toEqual({
      sampleId: 'Client Sample ID', labSampleId: 'Lab Sample ID', parameter: 'Analyte', value: 'Result', unit: 'Units', qualifier: 'Qualifier', detectionLimit: 'MDL', method: 'Method',
    });
    expect(guessMapping(['Lab ID', 'Customer Sample No', 'Test', 'Result Value', 'Result Units']).sampleId).toBe('Customer Sample No');
    expect(guessMapping(['Field ID', 'Characteristic', 'Conc', 'Unit']).sampleId).toBe('Field ID');
    // two candidate columns: the one holding the phone's sample codes wins
    const header = ['Sample Name', 'Client ID', 'Analyte', 'Result', 'Units'];
    const rows = [{ 'Sample Name': 'spring upper', 'Client ID': 'WF-01-20260614-0920' }, { 'Sample Name': 'spring lower', 'Client ID': 'WF-02-20260614-1040' }];
    expect(guessMapping(header).sampleId).toBe('Client ID');
    expect(guessMapping(header, rows, new Set(['WF-01-20260614-0920', 'WF-02-20260614-1040'])).sampleId).toBe('Client ID');
    expect(guessMapping(['Client ID', 'Sample Name', 'Analyte'], rows, new Set(['spring upper'])).sampleId).toBe('Sample Name');
  });

  it('reads a lab report as written: units converted for the chemistry, censored values with limits; the ions are used (ionic strength from the composition, charge balance), field values never replaced', async () => {
    await loadDemo(new Date('2026-06-14T12:00:00'));
    const text = fx('lab-as-written.csv');
    const parsed = parseCsv(text);
    const known = await samplesNow();
    const mapping = guessMapping(parsed.header, parsed.rows, new Set(known.keys()));
    const { rows } = checkLabRows(text, mapping as never, known);
    expect(rows.filter((r) => r.errors.length > 0)).toEqual([]);
    const byParam = (p: string) => rows.find((r) => r.parameter === p)!;
    expect(byParam('Fluoride')).toMatchObject({ censored: true, detectionLimit: 0.05 });
    expect(byParam('Ammonia')).toMatchObject({ censored: true, detectionLimit: 0.03, unitUcum: 'mg{N}/L' });
    expect(byParam('Phosphorus')).toMatchObject({ censored: true, detectionLimit: 0.02 });
    expect(byParam('Specific conductance').unitUcum).toBe('uS/cm');
    expect(byParam('pH').unitUcum).toBe('[pH]');
    expect(byParam('Hardness').unitUcum).toBe('mg{CaCO3}/L');
    expect(byParam('Turbidity').unitUcum).toBe('{NTU}');
    const fieldOnly = deriveSample((await getSample('demo-sample-2-1'))!, DEFAULT_SETTINGS);
    expect(fieldOnly.analysis!.ionicStrength.source).toBe('conductance');
    expect(fieldOnly.analysis!.chargeBalancePercent).toBeUndefined();
    await applyLabRows(rows, 'office');
    const s = (await getSample('demo-sample-2-1'))!;
    expect(s.lab).toHaveLength(14);
    const d = deriveSample(s, DEFAULT_SETTINGS);
    expect(d.labInputs).toEqual(['mgMgL', 'naMgL', 'kMgL', 'clMgL', 'so4MgL', 'no3NMgL']);
    expect(d.input.mgMgL).toBeCloseTo((1.07 * 24.305) / 2, 9);
    expect(d.input.naMgL).toBeCloseTo(9.8, 9);
    expect(d.input.caMgL).toBe(fieldOnly.input.caMgL); // the field kit's calcium, not the lab's 2.45 mmol/L
    expect(d.input.alkalinityMgLCaCO3).toBe(fieldOnly.input.alkalinityMgLCaCO3);
    expect(d.analysis!.ionicStrength.source).toBe('composition');
    expect(Number.isFinite(d.analysis!.chargeBalancePercent)).toBe(true);
  });

  it('checks every stored limit in the preview and names the field', async () => {
    await loadDemo(new Date('2026-06-14T12:00:00'));
    const long = 'x'.repeat(61);
    const text = ['sample_id,parameter,value,unit,method', `demo-sample-2-0,${long},1,mg/L,`, `demo-sample-2-0,Sodium,1,mg/L,${'m'.repeat(201)}`, 'demo-sample-2-0,Sodium,1,' + 'mg/L'.padEnd(31, ' ') + 'x,'].join('\n');
    const { rows } = checkLabRows(text, guessMapping(['sample_id', 'parameter', 'value', 'unit', 'method']) as never, await samplesNow());
    expect(rows[0]!.errors).toEqual([expect.stringMatching(/^parameter: .*60/)]);
    expect(rows[1]!.errors).toEqual([expect.stringMatching(/^method: .*200/)]);
    expect(rows[2]!.errors[0]).toMatch(/unit/);
  });

  it('never accepts values onto a deleted sample: refused in the preview (and at storing: next test)', async () => {
    await loadDemo(new Date('2026-06-14T12:00:00'));
    await deleteSample('demo-sample-2-2', 'T. Mills');
    const text = ['sample_id,parameter,value,unit', 'demo-sample-2-2,Sodium,4,mg/L'].join('\n');
    const { rows } = checkLabRows(text, guessMapping(['sample_id', 'parameter', 'value', 'unit']) as never, await samplesNow());
    expect(rows[0]!.errors).toEqual(['sample “demo-sample-2-2” was deleted on this phone: restore it first']);
  });

  it('is all-or-nothing per file: one transaction, so a sample deleted after the preview leaves every sample as it was', async () => {
    await loadDemo(new Date('2026-06-14T12:00:00'));
    const text = ['sample_id,parameter,value,unit', 'demo-sample-2-0,Sodium,4,mg/L', 'demo-sample-2-1,Sodium,5,mg/L', 'demo-sample-2-2,Sodium,6,mg/L'].join('\n');
    const { rows } = checkLabRows(text, guessMapping(['sample_id', 'parameter', 'value', 'unit']) as never, await samplesNow());
    expect(rows.every((r) => r.errors.length === 0)).toBe(true);
    const before = await Promise.all(['demo-sample-2-0', 'demo-sample-2-1', 'demo-sample-2-2'].map(getSample));
    const revisions = await (await getDb()).count('revisions');
    // another tab deletes the last sample between the preview and the Store button
    await deleteSample('demo-sample-2-2', 'other tab');
    await expect(applyLabRows(rows, 'office')).rejects.toThrow(/was deleted.*Nothing was stored/);
    const after = await Promise.all(['demo-sample-2-0', 'demo-sample-2-1'].map(getSample));
    expect(after).toEqual(before.slice(0, 2));
    expect(await (await getDb()).count('revisions')).toBe(revisions + 1); // only the delete
    // a sample edited meanwhile keeps its edit and gets the lab values on top
    await saveSample({ ...(await getSample('demo-sample-2-0'))!, remarks: 'edited' }, 'T. Mills');
    const ok = await applyLabRows(rows.slice(0, 1), 'office');
    expect(ok).toEqual({ samples: 1, values: 1, skipped: 0 });
    expect((await getSample('demo-sample-2-0'))!.remarks).toBe('edited');
  });
});

it('the office command runs via node directly too', () => {
  const out = execFileSync('node', ['scripts/recompute.mjs', 'test/fixtures/exchange/demo-day.csv', '--lab', 'test/fixtures/exchange/demo-lab.csv'], { encoding: 'utf8', cwd: ROOT });
  expect(parseCsv(out).rows).toHaveLength(3);
}, 60_000);
