// Every WQX row validated against the published web-template JSON Schema (npm `wqx` 3.0.209) with
// ajv, plus the package's conditional rules (required/*.json) rebuilt on the template's column names:
// as shipped they never fire (their `if` carries unevaluatedProperties: false and names columns
// without spaces), so a row missing e.g. the sample fraction of a dissolved ion would pass.
// Source of every rule checked: the npm `wqx` 3.0.209 JSON Schema and value lists (read from the package at test time).
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import Ajv2020 from 'ajv/dist/2020';
import addFormats from 'ajv-formats';
import type { ValidateFunction } from 'ajv';
import { describe, expect, it } from 'vitest';
import { demoRecords, DEMO_SITES } from '../../src/demo/scenario';
import { DEFAULT_SETTINGS, Sample, Site } from '../../src/records/schema';
import { parseCsv, unsafeCell } from '../../src/exchange/csv';
import { activityIdOf, WqxExportError, wqxLocationRows, wqxLocationsCsv, wqxResultRows, wqxResultsCsv, wqxTimeZoneCode, WQX_LOCATION_COLUMNS, WQX_RESULT_COLUMNS, type WqxRow } from '../../src/exchange/wqx';
import { FIELD_METHODS, ION_METHODS, KIT_METHODS, labMethod } from '../../src/records/methods';
import { RECORDED_SAMPLES, RECORDED_SITES } from './recorded-day';

const PKG = join(process.cwd(), 'node_modules', 'wqx');
const readJson = (p: string) => JSON.parse(readFileSync(join(PKG, p), 'utf8'));
const resultsSchema = readJson('json-schema/physical-chemistry.json');
const locationSchema = readJson('json-schema/location.json');

const ajv = new Ajv2020({ strict: false, allErrors: true });
addFormats(ajv);
const validateResult = ajv.compile(resultsSchema);
const validateLocation = ajv.compile(locationSchema);

/**
 * The package's conditional rules on the template's column names: "ActivityType" → "Activity Type",
 * "ResultAnalyticalMethodID" → "Result Analytical Method ID". "MonitoringLocationType" has no column
 * in the results template, which names the location by "Monitoring Location ID" (its type lives in
 * the locations file): the rule becomes "these activity types need a Monitoring Location ID".
 * Rules whose `if` names no column of the template (FrequencyClassType: biological) cannot fire.
 */
function conditionalRules(template: { properties: Record<string, unknown> }, renames: Record<string, string> = {}) {
  const column = (p: string) => renames[p] ?? p.replace(/([a-z])([A-Z])/g, '$1 $2');
  const rules: Array<{ file: string; validate: ValidateFunction; when: string; needs: string[] }> = [];
  for (const file of readdirSync(join(PKG, 'required')).filter((f) => f.endsWith('.json'))) {
    const rule = readJson(join('required', file));
    const [ifProp, cond] = Object.entries(rule.if.properties as Record<string, { enum: string[] }>)[0]!;
    const when = column(ifProp);
    if (!(when in template.properties)) continue;
    const needs = (rule.then.required as string[]).map(column);
    for (const n of needs) expect(template.properties, `${file}: ${n}`).toHaveProperty([n]);
    rules.push({ file, when, needs, validate: ajv.compile({ if: { properties: { [when]: { enum: cond.enum } }, required: [when] }, then: { required: needs } }) });
  }
  return rules;
}
const resultRules = conditionalRules(resultsSchema, { MonitoringLocationType: 'Monitoring Location ID' });
const locationRules = conditionalRules(locationSchema);

/** Read an exported file back into typed rows (numbers where the schema says number), empty cells left out. */
function readBack(csv: string, schema: { properties: Record<string, { type?: string }> }): WqxRow[] {
  const { rows, errors } = parseCsv(csv);
  expect(errors).toEqual([]);
  return rows.map((r) => {
    const o: WqxRow = {};
    for (const [k, v] of Object.entries(r)) {
      if (v === '') continue;
      const t = schema.properties[k]?.type;
      o[k] = t === 'number' || t === 'integer' ? Number(v) : unsafeCell(v);
    }
    return o;
  });
}

function check(rows: WqxRow[], validate: ValidateFunction, rules: typeof resultRules) {
  const problems: string[] = [];
  let valid = 0;
  rows.forEach((row, i) => {
    const errs: string[] = [];
    if (!validate(row)) errs.push(...(validate.errors ?? []).map((e) => `${e.instancePath} ${e.message} ${JSON.stringify(e.params)}`));
    for (const r of rules) if (!r.validate(row)) errs.push(`${r.file}: ${r.when} "${row[r.when]}" needs ${r.needs.join(' + ')}`);
    if (errs.length === 0) valid++;
    else problems.push(`row ${i + 2} (${row['Activity ID']} ${row['Characteristic Name'] ?? row['Monitoring Location ID']}): ${errs.join('; ')}`);
  });
  return { valid, total: rows.length, problems };
}

const T = '2026-06-14T12:00:00-06:00';
const meta = { createdAt: T, updatedAt: T };
const demo = demoRecords(new Date('2026-06-14T12:00:00'));
const demoSamples = demo.samples.map((s) => Sample.parse({ ...s, ...meta, localDate: s.time.slice(0, 10) }));
const demoSites = DEMO_SITES.map((s) => Site.parse({ ...s, ...meta }));
const settings = { ...DEFAULT_SETTINGS, projectId: 'WRENFOLD-2026', organizationId: 'BANKSIDE_TEST' };

describe('WQX Physical/Chemical Results, validated row by row against the published schema', () => {
  it('the rebuilt conditional rules fire: a dissolved ion without fraction or method is refused', () => {
    expect(resultRules.map((r) => r.file).sort()).toHaveLength(5);
    const bare: WqxRow = { 'Activity ID': 'X-1', 'Activity Type': 'Field Msr/Obs', 'Activity Media Name': 'Water', 'Activity Start Date': '2026-07-09', 'Project ID': 'P', 'Characteristic Name': 'Chloride', 'Result Value': 4.1, 'Result Unit': 'mg/L' };
    expect(validateResult(bare)).toBe(true); // the schema alone lets it through
    const c = check([bare], validateResult, resultRules);
    expect(c.valid).toBe(0);
    expect(c.problems[0]).toMatch(/Result Sample Fraction/);
    expect(c.problems[0]).toMatch(/Result Analytical Method ID/);
    expect(c.problems[0]).toMatch(/Monitoring Location ID/);
  });

  it('the demo day: 100 % of rows valid', () => {
    const rows = readBack(wqxResultsCsv({ samples: demoSamples, sites: demoSites, settings }), resultsSchema);
    const c = check(rows, validateResult, resultRules);
    expect(c.problems).toEqual([]);
    expect(c.valid).toBe(c.total);
    expect(c.total).toBeGreaterThan(100);
  });

  it('a recorded day (EC, titration, kits, replicate, blank, censored lab values): 100 % of rows valid', () => {
    const rows = readBack(wqxResultsCsv({ samples: RECORDED_SAMPLES, sites: RECORDED_SITES, settings }), resultsSchema);
    const c = check(rows, validateResult, resultRules);
    expect(c.problems).toEqual([]);
    expect(c.valid).toBe(c.total);
    const types = new Set(rows.map((r) => r['Activity Type']));
    for (const t of ['Field Msr/Obs', 'Sample-Routine', 'Quality Control Field Replicate Msr/Obs', 'Quality Control Sample-Field Replicate', 'Quality Control Sample-Field Blank']) expect(types).toContain(t);
  });

  it('carries the template’s value lists where they matter', () => {
    const rows = wqxResultRows({ samples: RECORDED_SAMPLES, sites: RECORDED_SITES, settings });
    const of = (id: string, ch: string) => rows.filter((r) => r['Activity ID'] === id && r['Characteristic Name'] === ch);
    // stabilized readings are medians, measured values Actual
    expect(of('TC-01-20260709-0812', 'pH')[0]).toMatchObject({ 'Result Value': 7.88, 'Result Unit': 'None', 'Statistical Base Code': 'Median', 'Result Value Type': 'Actual', 'Result Analytical Method ID': '150.1', 'Result Analytical Method Context': 'USEPA' });
    // SC from raw EC is calculated at the 25 °C basis; the raw reading is kept as Conductivity
    expect(of('TC-01-20260709-0812', 'Specific conductance')[0]).toMatchObject({ 'Result Unit': 'uS/cm', 'Result Temperature Basis': '25 Deg C', 'Result Value Type': 'Calculated' });
    expect(of('TC-01-20260709-0812', 'Conductivity')[0]).toMatchObject({ 'Result Value': 370, 'Statistical Base Code': 'Median' });
    // kit: fraction per filtering and the kit's method
    expect(of('TC-01-20260709-0812', 'Hardness, Calcium')[0]).toMatchObject({ 'Result Sample Fraction': 'Dissolved', 'Method Speciation': 'as CaCO3', 'Result Analytical Method ID': '2340C', 'Result Analytical Method Context': 'APHA' });
    // calcite SI with its band as confidence limits
    const si = of('TC-01-20260709-0812', 'Saturation Index Calcite')[0]!;
    expect(si['Result Value Type']).toBe('Calculated');
    expect(Number(si['Upper Confidence Limit'])).toBeGreaterThan(Number(si['Result Value']));
    expect(Number(si['Lower Confidence Limit'])).toBeLessThan(Number(si['Result Value']));
    expect(Number(si['Upper Confidence Limit']) - Number(si['Result Value'])).toBeCloseTo(Number(si['Result Value']) - Number(si['Lower Confidence Limit']), 6);
    // censored lab value: not detected, with its detection limit and no value
    const no3 = of('TC-01-20260709-0812-L', 'Nitrate')[0]!;
    expect(no3).toMatchObject({ 'Result Detection Condition': 'Not Detected', 'Result Detection/Quantitation Limit Measure': 0.05, 'Result Detection/Quantitation Limit Unit': 'mg/L', 'Method Speciation': 'as N', 'Result Qualifier': 'U' });
    expect(no3['Result Value']).toBeUndefined();
    // the replicate names its parent; the blank has measured values only
    expect(of('TC-01-20260709-0831-R', 'pH')[0]!['Activity Comment']).toMatch(/^Field replicate of TC-01-20260709-0812/);
    expect(rows.filter((r) => String(r['Activity ID']).endsWith('-B')).some((r) => r['Result Value Type'] === 'Calculated')).toBe(false);
    // times in the sample's own offset with the WQX zone code
    expect(of('TC-01-20260709-0812', 'pH')[0]).toMatchObject({ 'Activity Start Date': '2026-07-09', 'Activity Start Time': '08:12:00-06:00', 'Activity Start Time Zone': 'MDT', 'Project ID': 'WRENFOLD-2026', 'Organization': 'BANKSIDE_TEST' });
    // a result per characteristic and fraction in each activity
    const keys = rows.map((r) => `${r['Activity ID']}|${r['Characteristic Name']}|${r['Result Sample Fraction'] ?? ''}`);
    expect(new Set(keys).size).toBe(keys.length);
  });

  it('Activity IDs: at most 35 characters, unique, readable (site, local date and time, QC letter)', () => {
    const rows = wqxResultRows({ samples: [...RECORDED_SAMPLES, ...demoSamples], sites: [...RECORDED_SITES, ...demoSites], settings });
    const ids = [...new Set(rows.map((r) => String(r['Activity ID'])))];
    for (const id of ids) expect(id.length).toBeLessThanOrEqual(35);
    expect(ids).toContain('TC-01-20260709-0831-R');
    expect(ids).toContain('TC-01-20260709-0905-B');
    const long = activityIdOf({ time: '2026-07-09T08:12:00-06:00', qc: { type: 'replicate' } }, { code: 'A VERY LONG SITE CODE THAT GOES ON AND ON' });
    expect(long.length).toBeLessThanOrEqual(35);
    expect(long).toMatch(/-20260709-0812-R$/);
    // a stored sample code (the one on the bottle) is the Activity ID; its lab activity adds -L and still fits 35
    const coded = RECORDED_SAMPLES.map((x, i) => ({ ...x, sampleCode: i === 0 ? 'TAMARACK-CREEK-COUN-20260709-0812-7' : `${x.id.toUpperCase()}-CODE` }));
    const rows2 = wqxResultRows({ samples: coded, sites: RECORDED_SITES, settings });
    const ids2 = new Set(rows2.map((r) => String(r['Activity ID'])));
    expect(ids2).toContain('TAMARACK-CREEK-COUN-20260709-0812-7');
    expect(ids2).toContain('TAMARACK-CREEK-CO-20260709-0812-7-L');
    expect(ids2).toContain('REC-2-CODE-L');
    for (const id of ids2) expect(id.length).toBeLessThanOrEqual(35);
    expect(rows2.find((r) => r['Activity ID'] === 'REC-2-CODE')!['Activity Comment']).toMatch(/^Field replicate of TAMARACK-CREEK-COUN-20260709-0812-7/);
  });

  it('refuses to export without a Project ID (required by WQX) and says where to set it', () => {
    expect(() => wqxResultRows({ samples: demoSamples, sites: demoSites, settings: DEFAULT_SETTINGS })).toThrow(WqxExportError);
    expect(() => wqxResultRows({ samples: demoSamples, sites: demoSites, settings: DEFAULT_SETTINGS })).toThrow(/Project ID.*Settings/);
  });

  it('time-zone codes only where WQX lists the zone; the time keeps its offset regardless', () => {
    expect(wqxTimeZoneCode('America/Denver', '-06:00')).toBe('MDT');
    expect(wqxTimeZoneCode('America/Denver', '-07:00')).toBe('MST');
    expect(wqxTimeZoneCode('America/Phoenix', '-07:00')).toBe('MST');
    expect(wqxTimeZoneCode('Europe/Berlin', '+02:00')).toBe('CEST');
    expect(wqxTimeZoneCode('Australia/Sydney', '+10:00')).toBeUndefined();
    expect(wqxTimeZoneCode(undefined, '-06:00')).toBeUndefined();
  });

  it('every default method is in the package’s method and context lists', () => {
    const ids = new Set(resultsSchema.properties['Result Analytical Method ID'].enum);
    const contexts = new Set(resultsSchema.properties['Result Analytical Method Context'].enum);
    const all = [...Object.values(FIELD_METHODS), ...Object.values(KIT_METHODS), ...Object.values(ION_METHODS)];
    for (const p of ['calcium', 'chloride', 'alkalinity', 'ammonia', 'tds', 'sc', 'ph']) all.push(labMethod({ parameter: p })!);
    for (const m of all) {
      expect(ids, m.id).toContain(m.id);
      expect(contexts, m.context).toContain(m.context);
    }
  });

  it('the wqx package and ajv stay out of the app: no file under src imports them', () => {
    const files = (readdirSync('src', { recursive: true }) as string[]).filter((f) => /\.tsx?$/.test(f));
    expect(files.length).toBeGreaterThan(30);
    for (const f of files) expect(readFileSync(join('src', f), 'utf8'), f).not.toMatch(/from ['"](wqx|ajv|ajv-formats)(\/[^'"]*)?['"]/);
  });

  it('has the template’s own column names', () => {
    for (const c of WQX_RESULT_COLUMNS) expect(resultsSchema.properties).toHaveProperty([c]);
    for (const c of WQX_LOCATION_COLUMNS) expect(locationSchema.properties).toHaveProperty([c]);
  });
});

describe('WQX Monitoring Locations', () => {
  it('every site of the demo and the recorded day is a valid location row', () => {
    for (const sites of [demoSites, RECORDED_SITES]) {
      const rows = readBack(wqxLocationsCsv(sites), locationSchema);
      const c = check(rows, validateLocation, locationRules);
      expect(c.problems).toEqual([]);
      expect(c.valid).toBe(sites.length);
    }
    expect(wqxLocationRows(RECORDED_SITES)[0]).toMatchObject({ 'Monitoring Location ID': 'TC-01', 'Monitoring Location Type': 'River/Stream', 'Monitoring Location Horizontal Coordinate Reference System': 'NAD83', 'Monitoring Location Latitude': 44.123456 });
  });
  it('the results name only locations the locations file holds', () => {
    const ids = new Set(wqxLocationRows(RECORDED_SITES).map((r) => r['Monitoring Location ID']));
    for (const r of wqxResultRows({ samples: RECORDED_SAMPLES, sites: RECORDED_SITES, settings })) expect(ids).toContain(r['Monitoring Location ID']);
  });
  it('a southern-hemisphere site fails only on the package’s latitude minimum of 0 (a defect of wqx 3.0.209, not of the standard)', () => {
    const south = Site.parse({ ...RECORDED_SITES[1]!, id: 'south', code: 'KW-1', latitude: -4.17 });
    const c = check(wqxLocationRows([south]), validateLocation, locationRules);
    expect(c.valid).toBe(0);
    expect(c.problems[0]).toMatch(/Monitoring Location Latitude must be >= 0/);
    expect(c.problems[0]!.split(';')).toHaveLength(1);
  });
});
