// A generated day of n samples for export and speed tests: the invented demo samples' shapes (one with
// a titration, one with entered alkalinity, one with major ions) cycled over the demo sites, with
// readings varied by a seeded generator so every row differs. Not real data.
import { demoRecords, DEMO_SITES } from '../../src/demo/scenario';
import { Sample, Site } from '../../src/records/schema';

export function generatedDay(n: number, date = '2026-06-14'): { samples: Sample[]; sites: Site[] } {
  const templates = demoRecords(new Date(`${date}T12:00:00`)).samples.slice(0, 3);
  let seed = 20260614;
  const r = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
  const start = Date.parse(`${date}T06:00:00Z`);
  const samples = Array.from({ length: n }, (_, k) => {
    const t = structuredClone(templates[k % templates.length]!);
    const time = new Date(start + Math.floor((k * 12 * 3600_000) / n)).toISOString().replace(/\.\d{3}Z$/, 'Z');
    const shift = (vals: Array<{ time: string; value: number }> | undefined, by: number, digits: number) =>
      vals?.forEach((v) => { v.value = Number((v.value + by).toFixed(digits)); v.time = time; });
    shift(t.field!.tempC?.values, 4 * r() - 2, 1);
    shift(t.field!.pH?.values, 0.8 * r() - 0.4, 2);
    shift(t.field!.conductance?.values, Math.round(100 * r() - 50), 0);
    shift(t.field!.do?.values, r() - 0.5, 1);
    return Sample.parse({ ...t, id: `gen-${date}-${String(k).padStart(5, '0')}`, time, localDate: date, createdAt: time, updatedAt: time, remarks: k % 97 === 0 ? '=needs a check, "quoted"; commas, too' : t.remarks, qc: { type: 'environmental' }, demo: false });
  });
  return { samples, sites: DEMO_SITES.map((s) => Site.parse({ ...s, createdAt: `${date}T06:00:00Z`, updatedAt: `${date}T06:00:00Z` })) };
}
