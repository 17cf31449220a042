import { beforeEach, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import {
  DB_VERSION,
  MIGRATIONS,
  MigrationError,
  getDb,
  listDay,
  openBanksideDb,
  resetDb,
  type Migration,
} from '../../src/store';
import { Sample } from '../../src/records/schema';
import { freshDb } from './helpers';

const v1Fixture = JSON.parse(readFileSync(join(__dirname, '../fixtures/store/v1-records.json'), 'utf8'));

/** Build a database exactly as schema version 1 left it, with the fixture's records. */
async function seedV1(): Promise<void> {
  const db = await openBanksideDb({ version: 1 });
  const tx = db.transaction(['sites', 'samples', 'settings'] as never, 'readwrite');
  for (const s of v1Fixture.sites) await tx.objectStore('sites' as never).put(s as never);
  for (const s of v1Fixture.samples) await tx.objectStore('samples' as never).put(s as never);
  for (const s of v1Fixture.settings) await tx.objectStore('settings' as never).put(s as never);
  await tx.done;
  db.close();
}

beforeEach(freshDb);

describe('schema migrations (one upgrade path)', () => {
  it(`upgrades a version-1 database with data to version ${DB_VERSION}`, async () => {
    await seedV1();
    const db = await getDb();
    expect(db.version).toBe(DB_VERSION);
    const samples = await db.getAll('samples');
    expect(samples).toHaveLength(3);
    for (const s of samples) expect(Sample.safeParse(s).success).toBe(true);
    const first = samples.find((s) => s.id === 's-v1-1')!;
    expect(first.time).toBe('2026-03-01T10:00:00Z');
    expect(first.field.pH!.values[0]!.value).toBe(7.62);
    expect(first.field.conductance).toMatchObject({ mode: 'sc', values: [{ value: 388 }] });
    expect(first.field.kits).toEqual([{ analyte: 'calcium', value: 51, unit: 'mg/L' }]);
    expect(first.remarks).toBe('first visit');
    // the new indexes work on migrated data
    expect((await listDay('2026-03-01')).map((s) => s.id)).toEqual(['s-v1-1', 's-v1-2']);
    expect(await db.getAllFromIndex('sites', 'code', 'OLD-1')).toHaveLength(1);
    expect((await db.get('settings', 'settings'))!.operator).toBe('A. Field');
  });

  it('a failing step aborts the whole upgrade: the database stays at version 1 with its data', async () => {
    await seedV1();
    const broken: Migration = {
      to: 2,
      run(db, tx, fail) {
        MIGRATIONS[1]!.run(db, tx, fail);
        // the second record hits a bug mid-way through the cursor
        throw new Error('simulated bug in step 2');
      },
    };
    await expect(openBanksideDb({ migrations: [MIGRATIONS[0]!, broken] })).rejects.toBeInstanceOf(MigrationError);
    await resetDb();
    const raw = await openBanksideDb({ version: 1 });
    expect(raw.version).toBe(1);
    expect([...raw.objectStoreNames].sort()).toEqual(['drafts', 'samples', 'settings', 'sites']);
    const samples = (await raw.getAll('samples' as never)) as Array<{ id: string; timestamp: number }>;
    expect(samples.map((s) => s.id).sort()).toEqual(['s-v1-1', 's-v1-2', 's-v1-3']);
    expect(samples[0]!.timestamp).toBeTypeOf('number'); // untouched v1 shape
    raw.close();
  });

  it('an asynchronous failure inside a cursor step also aborts (fail callback)', async () => {
    await seedV1();
    const asyncBroken: Migration = {
      to: 2,
      run(db, tx, fail) {
        MIGRATIONS[1]!.run(db, tx, fail);
        const req = (tx.objectStore('sites') as unknown as { openCursor(): Promise<unknown> }).openCursor();
        void Promise.resolve(req).then(() => fail(new Error('bad site record')));
      },
    };
    await expect(openBanksideDb({ migrations: [MIGRATIONS[0]!, asyncBroken] })).rejects.toThrow(/could not be upgraded/);
    const raw = await openBanksideDb({ version: 1 });
    expect(raw.version).toBe(1);
    raw.close();
  });

  it('two tabs: an old tab is asked to save and close (blocking) so the new version can open', async () => {
    await seedV1();
    const events: string[] = [];
    const oldTab = await openBanksideDb({
      version: 1,
      onBlocking: () => {
        events.push('old tab: saving draft and closing');
        oldTab.close();
      },
    });
    const newTab = await openBanksideDb({ onBlocked: () => events.push('new tab: blocked') });
    expect(newTab.version).toBe(DB_VERSION);
    expect(events[0]).toBe('old tab: saving draft and closing');
    newTab.close();
  });
});
