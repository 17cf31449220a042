import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { demoRecords, DEMO_SITES } from '../../src/demo/scenario';
import { Sample, Site, CalibrationEvent, DEFAULT_SETTINGS } from '../../src/records/schema';
import { calibrationsCsv, derivedRows, LONG_HEADER, longCsv, parseCsv, safeCell, titrationsCsv, toCsv, unsafeCell, WIDE_COLUMNS, wideCsv } from '../../src/exchange/csv';
import { samplesGeoJson, sitesGeoJson } from '../../src/exchange/geojson';
import { deriveSample } from '../../src/records/derive';
import { ENGINE_VERSION } from '../../src/chemistry';

const T = '2026-06-14T12:00:00-06:00';
const meta = { createdAt: T, updatedAt: T };
const { samples: rawSamples, calibrations: rawCals } = demoRecords(new Date('2026-06-14T12:00:00'));
const samples = rawSamples.map((s) => Sample.parse({ ...s, ...meta, localDate: s.time.slice(0, 10) }));
const sites = DEMO_SITES.map((s) => Site.parse({ ...s, ...meta }));
const cals = rawCals.map((c) => CalibrationEvent.parse({ ...c, ...meta, localDate: c.time.slice(0, 10) }));
const ctx = { samples, sites, settings: DEFAULT_SETTINGS };

describe('wide CSV (one row per sample)', () => {
  it('round-trips every value: parse(export) equals what was exported, number for number', () => {
    const text = wideCsv(ctx);
    const { header, rows, errors } = parseCsv(text);
    expect(errors).toEqual([]);
    expect(header).toEqual(WIDE_COLUMNS.map((c) => c.h));
    expect(rows).toHaveLength(samples.length);
    const siteById = new Map(sites.map((s) => [s.id, s]));
    const exported = derivedRows(ctx);
    samples.forEach((s, i) => {
      const d = deriveSample(s, DEFAULT_SETTINGS);
      expect(exported[i]!.d.analysis?.saturationIndex.calcite).toBe(d.analysis?.saturationIndex.calcite);
      for (const col of WIDE_COLUMNS) {
        const v = col.get({ ...exported[i]!, s, site: siteById.get(s.siteId), d });
        const cell = rows[i]![col.h]!;
        if (v === undefined || v === null) expect(cell, col.h).toBe('');
        else if (typeof v === 'number') expect(Number(cell), col.h).toBe(v);
        else expect(unsafeCell(cell), col.h).toBe(String(v));
      }
    });
  });
  it('carries units in headers, ISO times with offset, the engine version and the ionic-strength source', () => {
    const { rows } = parseCsv(wideCsv(ctx));
    const r = rows[0]!;
    expect(r.time_local).toMatch(/^2026-06-1\dT\d\d:\d\d:\d\d[+-]\d\d:\d\d$/);
    expect(r.engine_version).toBe(ENGINE_VERSION);
    expect(['conductance', 'composition']).toContain(r.ionic_strength_source);
    expect(r.datum).toBe('WGS84');
    const rep = rows.find((x) => x.qc_type === 'replicate')!;
    expect(rep.qc_parent_id).toBe(samples[0]!.id);
  });
  it('raw reading columns report the stabilization median, so they agree with the computed columns', () => {
    const s = structuredClone(samples[1]!);
    const t = s.field.conductance!.values[0]!.time;
    // seven readings: the first two drift, the last five are stable (median 400)
    s.field.conductance!.values = [430, 415, 401, 400, 399, 400, 401].map((value) => ({ time: t, value }));
    s.revision += 1; // an edit, as the store records it (derived results are cached per revision)
    const { rows } = parseCsv(wideCsv({ ...ctx, samples: [s] }));
    expect(rows[0]!.sc_field_uS_cm_25C).toBe('400');
    expect(rows[0]!.sc_uS_cm_25C).toBe('400');
  });
  it('adds a BOM only when asked (for spreadsheets) and parses either way', () => {
    const withBom = wideCsv(ctx, { bom: true });
    expect(withBom.charCodeAt(0)).toBe(0xfeff);
    expect(wideCsv(ctx).charCodeAt(0)).not.toBe(0xfeff);
    expect(parseCsv(withBom).header[0]).toBe('sample_id');
  });
});

describe('formula injection', () => {
  it.each([
    ['=HYPERLINK("http://x","click")', "'=HYPERLINK(\"http://x\",\"click\")"],
    ['+1+1', "'+1+1"],
    ['-cmd|calc', "'-cmd|calc"],
    ['@SUM(A1)', "'@SUM(A1)"],
    ['\tTAB', "'\tTAB"],
    ['\rCR', "'\rCR"],
    ['-0.25', '-0.25'],
    ['+12', '+12'],
    ['plain text', 'plain text'],
  ])('%j → %j', (input, expected) => {
    expect(safeCell(input)).toBe(expected);
  });
  it('a remark typed as a formula is exported inert and read back as typed', () => {
    const evil = Sample.parse({ ...samples[1]!, remarks: '=1+2', crew: ['@admin'] });
    const { rows } = parseCsv(wideCsv({ ...ctx, samples: [evil] }));
    expect(rows[0]!.remarks).toBe("'=1+2");
    expect(unsafeCell(rows[0]!.remarks!)).toBe('=1+2');
    expect(rows[0]!.crew).toBe("'@admin");
  });
  it('property: no cell of any CSV starts a live formula', () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.oneof(fc.string(), fc.double(), fc.constant(undefined)), { minLength: 2, maxLength: 2 }), { maxLength: 10 }), (rows) => {
        const { rows: back } = parseCsv(toCsv(['a', 'b'], rows));
        return back.every((r) => Object.values(r).every((c) => !/^[=+\-@\t\r]/.test(c) || /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(c)));
      }),
      { seed: 21, numRuns: 300 },
    );
  });
});

describe('long CSV, calibrations, titrations, GeoJSON', () => {
  it('long file: one row per value with UCUM units and origin', () => {
    const { header, rows } = parseCsv(longCsv(ctx));
    expect(header).toEqual(LONG_HEADER);
    const first = rows.filter((r) => r.sample_id === samples[0]!.id);
    expect(first.find((r) => r.parameter === 'water_temperature')).toMatchObject({ unit_ucum: 'Cel', origin: 'field' });
    expect(first.find((r) => r.parameter === 'pH')).toMatchObject({ unit_ucum: '[pH]', value: '7.06' }) // median of 7.12, 7.08, 7.06, 7.05, 7.05;
    expect(first.find((r) => r.parameter === 'alkalinity_as_CaCO3')).toMatchObject({ origin: 'computed', unit_ucum: 'mg/L' });
    expect(first.find((r) => r.parameter === 'saturation_index_calcite')!.unit_ucum).toBe('1');
    for (const r of rows) expect(Number.isFinite(Number(r.value))).toBe(true);
  });
  it('long file: a replicate is told apart by its QC type and parent, every row has its position, the calcite SI its band', () => {
    const { rows } = parseCsv(longCsv(ctx));
    const rep = rows.filter((r) => r.sample_id === 'demo-sample-0-0-rep');
    expect(rep.length).toBeGreaterThan(10);
    for (const r of rep) expect(r).toMatchObject({ qc_type: 'replicate', qc_parent_id: samples[0]!.id });
    expect(rows.filter((r) => r.sample_id === samples[0]!.id).every((r) => r.qc_type === 'environmental')).toBe(true);
    for (const r of rows) expect(r).toMatchObject({ datum: 'WGS84' });
    expect(rows.every((r) => Number(r.latitude_deg) > 45 && Number(r.longitude_deg) < -110)).toBe(true);
    const si = rows.filter((r) => r.parameter === 'saturation_index_calcite');
    expect(si.length).toBe(samples.length);
    for (const r of si) expect(Number(r.band_95pct_plus_minus)).toBeGreaterThan(0);
    expect(rows.filter((r) => r.parameter !== 'saturation_index_calcite').every((r) => r.band_95pct_plus_minus === '')).toBe(true);
    const ca = rows.find((r) => r.parameter === 'calcium')!;
    expect(ca).toMatchObject({ sample_fraction: 'total', method: 'kit 3500-CA(B) (APHA)' });
  });
  it('calibration events and titration points as their own files', () => {
    const c = parseCsv(calibrationsCsv(cals)).rows;
    expect(c).toHaveLength(9);
    expect(c.find((r) => r.parameter === 'pH')!.ph_buffers).toBe('7@-4.2mV/12C | 10.01@-173.1mV/12C | 4@162.9mV/12C');
    // slope = (−173.1 − (−4.2)) / 3.01 = −56.11 mV/pH; Nernst at 12 °C = 56.58 mV/pH (CODATA constants) → 99.2 %;
    // offset at pH 7 = −4.2 mV; the pH 4 buffer reads back through the line: 7 + (162.9 + 4.2)/−56.11 = 4.022 → 0.02
    expect(c.find((r) => r.parameter === 'pH')).toMatchObject({ ph_slope_pct_nernst: '99.2', ph_offset_mV_at_pH7: '-4.2', deviation: '0.02', deviation_unit: 'pH' });
    // SC check: (1402 − 1413) / 1413 = −0.78 % → −0.8
    expect(c.find((r) => r.parameter === 'sc')).toMatchObject({ deviation: '-0.8', deviation_unit: '%' });
    const doRow = c.find((r) => r.parameter === 'do')!;
    expect(doRow.deviation_unit).toBe('mg/L');
    expect(Math.abs(Number(doRow.deviation))).toBeLessThan(0.3);
    const t = parseCsv(titrationsCsv(samples)).rows;
    expect(t.length).toBe(30); // the titrated spring sample and its replicate, 15 points each
    expect(t[0]).toMatchObject({ point: '1', titrant_amount: '0', titrant_unit: 'counts', pH: '7.06' });
  });
  it('GeoJSON: NAD83 maps when its stated accuracy covers the NAD83–WGS84 shift; otherwise null geometry with a reason', () => {
    const nad = (accuracyM: number | undefined, datum = 'NAD83') => Site.parse({ ...sites[0]!, id: `n${accuracyM}${datum}`, datum, accuracyM });
    const g = JSON.parse(sitesGeoJson([nad(5), nad(0.5), nad(undefined), nad(5, 'NAD27'), nad(3, 'NAD83(2011)')]));
    expect(g.features.map((f: { geometry: unknown }) => f.geometry !== null)).toEqual([true, false, false, false, true]);
    expect(g.features[0].properties).toMatchObject({ datum: 'NAD83' });
    expect(g.features[0].properties.no_geometry_reason).toBeUndefined();
    expect(g.features[1].properties.no_geometry_reason).toMatch(/finer than the NAD83–WGS84 shift/);
    expect(g.features[2].properties.no_geometry_reason).toMatch(/without a stated accuracy/);
    expect(g.features[3].properties).toMatchObject({ datum: 'NAD27', no_geometry_reason: expect.stringMatching(/NAD27 is not WGS84-compatible/) });
  });
  it('GeoJSON (RFC 7946): longitude first, WGS84 only', () => {
    const g = JSON.parse(sitesGeoJson([...sites, Site.parse({ ...sites[0]!, id: 'nad', datum: 'NAD27' })]));
    expect(g.type).toBe('FeatureCollection');
    expect(g.features[0].geometry).toEqual({ type: 'Point', coordinates: [-110.90112, 45.50321] });
    expect(g.features[3].geometry).toBeNull();
    const sg = JSON.parse(samplesGeoJson(samples, sites, DEFAULT_SETTINGS));
    expect(sg.features).toHaveLength(samples.length);
    expect(sg.features[0].properties.calcite_state).not.toBe('unknown');
  });
});
