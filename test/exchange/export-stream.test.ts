// Chunked exports (what the export worker writes) are byte for byte the one-piece exports the page
// writes, on the demo day and on a generated 10,000-sample day. Expected values: the one-piece
// export functions' own output.
import { describe, expect, it } from 'vitest';
import { demoRecords, DEMO_SITES } from '../../src/demo/scenario';
import { CalibrationEvent, Sample, Site, DEFAULT_SETTINGS } from '../../src/records/schema';
import { calibrationsCsv, longCsv, titrationsCsv, wideCsv } from '../../src/exchange/csv';
import { samplesGeoJson } from '../../src/exchange/geojson';
import { exportParts, type StreamInput } from '../../src/exchange/export-stream';
import { derivedCache } from '../../src/records/derived-cache';
import { generatedDay } from './generated-day';

const T = '2026-06-14T12:00:00-06:00';
const demo = demoRecords(new Date('2026-06-14T12:00:00'));
// readable codes as the store gives them, so a replicate's qc_parent_code must be found across chunks
const demoSamples = demo.samples.map((s, i) => Sample.parse({ ...s, sampleCode: `DEMO-${i}`, createdAt: T, updatedAt: T, localDate: s.time.slice(0, 10) }));
const demoSites = DEMO_SITES.map((s) => Site.parse({ ...s, createdAt: T, updatedAt: T }));
const demoCals = demo.calibrations.map((c) => CalibrationEvent.parse({ ...c, createdAt: T, updatedAt: T, localDate: c.time.slice(0, 10) }));

const joined = (input: StreamInput, chunk?: number) => {
  const parts = [...exportParts(input, chunk)];
  // progress only grows and ends at the total
  parts.forEach((p, i) => i > 0 && expect(p.done).toBeGreaterThanOrEqual(parts[i - 1]!.done));
  expect(parts.at(-1)!.done).toBe(input.samples.length);
  return parts.map((p) => p.text).join('');
};

describe('chunked export = one-piece export, byte for byte', () => {
  const ctx = { samples: demoSamples, sites: demoSites, settings: DEFAULT_SETTINGS };
  it('the demo holds a replicate whose parent is in another chunk of 2', () => {
    const rep = demoSamples.findIndex((s) => s.qc.type === 'replicate');
    const parent = demoSamples.findIndex((s) => s.id === demoSamples[rep]?.qc.parentId);
    expect(rep).toBeGreaterThanOrEqual(0);
    expect(Math.floor(rep / 2)).not.toBe(Math.floor(parent / 2));
    expect(wideCsv(ctx)).toContain(`,DEMO-${parent},`);
  });
  it.each([true, false])('demo day, every file kind, chunks of 2 samples (BOM %s)', (bom) => {
    expect(joined({ ...ctx, kind: 'csv-wide', bom }, 2)).toBe(wideCsv(ctx, { bom }));
    expect(joined({ ...ctx, kind: 'csv-long', bom }, 2)).toBe(longCsv(ctx, { bom }));
    expect(joined({ ...ctx, kind: 'csv-titrations', bom }, 2)).toBe(titrationsCsv(demoSamples, { bom }));
    expect(joined({ ...ctx, kind: 'csv-calibrations', calibrations: demoCals, bom }, 2)).toBe(calibrationsCsv(demoCals, { bom }));
    expect(joined({ ...ctx, kind: 'geojson' }, 2)).toBe(samplesGeoJson(demoSamples, demoSites, DEFAULT_SETTINGS));
  });

  it('an empty selection gives the header alone, as the one-piece writer does', () => {
    const none = { samples: [], sites: demoSites, settings: DEFAULT_SETTINGS };
    expect(joined({ ...none, kind: 'csv-wide', bom: true })).toBe(wideCsv(none, { bom: true }));
  });

  // (the 10,000-sample day is compared in the browser, worker against page: test/browser/export-worker.test.ts)
  it('generated day of 1,200 samples, chunks of 250: samples and values CSV', () => {
    const day = generatedDay(1200);
    const big = { samples: day.samples, sites: day.sites, settings: DEFAULT_SETTINGS };
    derivedCache.clear();
    const whole = wideCsv(big, { bom: true });
    derivedCache.clear();
    const chunked = joined({ ...big, kind: 'csv-wide', bom: true });
    expect(chunked.length).toBeGreaterThan(1200 * 300);
    expect(chunked).toBe(whole);
    expect(joined({ ...big, kind: 'csv-long', bom: false })).toBe(longCsv(big));
  }, 60_000);
});
