// No reference values: every count is derived from the generated input itself (source: this test).
// Fuzzing the import paths (seeded, bounded): damaged, huge, wrongly encoded or wrongly shaped
// input must give a clear error and change nothing.
import { beforeEach, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { BackupError, createBackup, getDb, restoreBackup, saveSite } from '../../src/store';
import { recomputeCsv } from '../../src/exchange/recompute';
import { checkLabRows, guessMapping, sampleLabels } from '../../src/exchange/lab-import';
import { parseCsv } from '../../src/exchange/csv';
import { loadDemo } from '../../src/demo/load';
import { freshDb } from '../store/helpers';

const fx = (n: string) => readFileSync(join(__dirname, '../fixtures/exchange', n), 'utf8');

async function counts(): Promise<Record<string, number>> {
  const db = await getDb();
  const out: Record<string, number> = {};
  for (const s of ['sites', 'samples', 'revisions', 'calibrations'] as const) out[s] = await db.count(s);
  return out;
}

/** Damage a text: cut it, flip characters, or splice junk in. */
const damage = (text: string) =>
  fc.oneof(
    fc.nat({ max: text.length - 1 }).map((n) => text.slice(0, n)),
    fc.tuple(fc.nat({ max: text.length - 1 }), fc.string({ minLength: 1, maxLength: 8 })).map(([i, s]) => text.slice(0, i) + s + text.slice(i + s.length)),
    fc.tuple(fc.nat({ max: text.length - 1 }), fc.constantFrom('"', '{', '}', ',', ':', '\u0000', 'null', '-1e999')).map(([i, s]) => text.slice(0, i) + s + text.slice(i)),
  );

describe('backup restore under damage', () => {
  beforeEach(freshDb);
  it('any damaged backup either restores validly or is refused with BackupError, leaving the store as it was', async () => {
    await loadDemo(new Date('2026-06-14T12:00:00'));
    const good = JSON.stringify(await createBackup());
    await freshDb();
    await saveSite({ code: 'KEEP', name: 'Already here', type: 'well' }, 'T. Mills');
    let refused = 0;
    await fc.assert(
      fc.asyncProperty(damage(good), async (bad) => {
        const before = await counts();
        try {
          await restoreBackup(bad);
          // it was still a valid backup: everything in it must have been valid records
          return true;
        } catch (e) {
          refused++;
          if (!(e instanceof BackupError)) return false;
          expect(e.message).toMatch(/Nothing was changed/);
          expect(await counts()).toEqual(before);
          return true;
        }
      }),
      { seed: 31, numRuns: 60 },
    );
    expect(refused).toBeGreaterThan(40);
  }, 60_000);
  it('refuses a foreign or mis-encoded file', async () => {
    const utf16 = Buffer.from(JSON.stringify({ format: 'bankside-backup' }), 'utf16le').toString('utf8');
    await expect(restoreBackup(utf16)).rejects.toBeInstanceOf(BackupError);
    await expect(restoreBackup('')).rejects.toThrow(/not a Bankside backup/);
    await expect(restoreBackup('[1,2,3]')).rejects.toThrow(/not a Bankside backup/);
  });
});

describe('office recompute and lab import under bad files', () => {
  it('recompute: any damaged samples file gives a CSV or a plain Error, never a crash', () => {
    const good = fx('demo-day.csv');
    fc.assert(
      fc.property(damage(good), (bad) => {
        try {
          const out = recomputeCsv(bad);
          return parseCsv(out).errors.length === 0;
        } catch (e) {
          return e instanceof Error && !(e instanceof TypeError) && e.message.length > 10;
        }
      }),
      { seed: 32, numRuns: 200 },
    );
  });
  it('recompute: wrong columns and wrong encoding are refused in words', () => {
    expect(() => recomputeCsv('site,when\r\nA,today\r\n')).toThrow(/no sample_id column/);
    const utf16 = Buffer.from(fx('demo-day.csv'), 'utf16le').toString('utf8');
    expect(() => recomputeCsv(utf16)).toThrow();
  });
  it('lab import: random columns and cells give row errors, never an exception; a 50,000-row file is handled', () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.string({ maxLength: 6 }), { minLength: 4, maxLength: 4 }), { maxLength: 30 }), (cells) => {
        const text = ['sample_id,parameter,value,unit', ...cells.map((r) => r.map((c) => `"${c.replace(/"/g, '""')}"`).join(','))].join('\r\n');
        const { rows, fileErrors } = checkLabRows(text, guessMapping(['sample_id', 'parameter', 'value', 'unit']) as never, sampleLabels([{ id: 's1' }]));
        // a ready row is on the known sample, with a finite value or a censored one, and a stored record
        return fileErrors.length > 0 || rows.every((r) => r.errors.length > 0 || (r.sampleId === 's1' && (Number.isFinite(r.value) || r.censored === true) && r.result !== undefined));
      }),
      { seed: 33, numRuns: 200 },
    );
    const huge = ['sample_id,parameter,value,unit', ...Array.from({ length: 50_000 }, (_, i) => `s${i % 7},Sodium,${i % 100}.5,mg/L`)].join('\r\n');
    const { rows } = checkLabRows(huge, { sampleId: 'sample_id', parameter: 'parameter', value: 'value', unit: 'unit' }, sampleLabels([{ id: 's1' }]));
    expect(rows).toHaveLength(50_000);
    expect(rows.filter((r) => r.errors.length === 0)).toHaveLength(7143); // rows with i % 7 === 1
    expect(checkLabRows(huge, { sampleId: 'id', parameter: 'parameter', value: 'value', unit: 'unit' }, sampleLabels([])).fileErrors[0]).toMatch(/Column “id”/);
  }, 30_000);
});
