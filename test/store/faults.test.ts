import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { createBackup, getSample, listDay, restoreBackup, saveSample, BackupError, StoreError, history, saveSite, listSites } from '../../src/store';
import { freshDb, sampleAt } from './helpers';

beforeEach(freshDb);
afterEach(() => vi.restoreAllMocks());

/** The browser's storage-full error, as Chromium raises it. */
function quotaError(): DOMException {
  return new DOMException('The quota has been exceeded.', 'QuotaExceededError');
}

describe('storage full (QuotaExceededError)', () => {
  it('gives a clear message and leaves the stored record as it was', async () => {
    const s = await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills');
    // Make the next write fail the way a full disk does (the browser's error, not our code).
    const proto = (globalThis as unknown as { IDBObjectStore: { prototype: { put(...a: unknown[]): unknown } } }).IDBObjectStore.prototype;
    const realPut = proto.put;
    vi.spyOn(proto, 'put').mockImplementation(function (this: { name: string }, ...args: unknown[]) {
      if (this.name === 'samples') throw quotaError();
      return realPut.apply(this, args);
    });
    const edited = structuredClone(s);
    edited.remarks = 'typed while the phone was full';
    try {
      await saveSample(edited, 'T. Mills');
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(StoreError);
      expect((e as StoreError).kind).toBe('quota');
      expect((e as StoreError).message).toMatch(/NOT saved/);
      expect((e as StoreError).message).toMatch(/export it/);
    }
    vi.restoreAllMocks();
    expect((await getSample(s.id))!.remarks).toBe('');
    expect(await history(s.id)).toHaveLength(1); // no orphan revision
  });
});

describe('backup and restore', () => {
  async function seed() {
    await saveSite({ id: 'site-1', code: 'WF-01', name: 'Footbridge', type: 'stream', latitude: 45.1, longitude: -111.2 }, 'T. Mills');
    const a = await saveSample(sampleAt('2026-06-14T09:30:00-06:00'), 'T. Mills');
    const b = await saveSample(sampleAt('2026-06-14T11:00:00-06:00'), 'T. Mills');
    return { a, b };
  }

  it('round-trips every record into an empty database, and a second restore adds nothing', async () => {
    const { a, b } = await seed();
    const file = JSON.stringify(await createBackup());
    await freshDb();
    const first = await restoreBackup(file);
    expect(first.perStore.samples).toEqual({ added: 2, updated: 0, unchanged: 0 });
    expect(first.perStore.revisions!.added).toBe(3);
    expect(await getSample(a.id)).toEqual(a);
    expect(await getSample(b.id)).toEqual(b);
    const again = await restoreBackup(file);
    expect(again.added).toBe(0);
    expect(again.updated).toBe(0);
    expect(await listDay('2026-06-14')).toHaveLength(2);
    expect(await listSites()).toHaveLength(1);
  });

  it('merges by ID: a newer copy in the file replaces, an older one does not', async () => {
    const { a } = await seed();
    const file = await createBackup();
    const fileSamples = file.stores.samples as Array<{ id: string; updatedAt: string; remarks: string }>;
    const inFile = fileSamples.find((s) => s.id === a.id)!;
    inFile.remarks = 'edited on the office copy';
    inFile.updatedAt = '2099-01-01T00:00:00Z';
    const r = await restoreBackup(JSON.stringify(file));
    expect(r.perStore.samples!.updated).toBe(1);
    expect((await getSample(a.id))!.remarks).toBe('edited on the office copy');
    inFile.updatedAt = '2000-01-01T00:00:00Z';
    inFile.remarks = 'stale';
    await restoreBackup(JSON.stringify(file));
    expect((await getSample(a.id))!.remarks).toBe('edited on the office copy');
  });

  it.each([
    ['a file cut short', (t: string) => t.slice(0, t.length / 2), /not a Bankside backup/],
    ['a foreign JSON file', () => JSON.stringify({ type: 'FeatureCollection', features: [] }), /not a Bankside backup/],
    ['a newer format', (t: string) => t.replace('"formatVersion":1', '"formatVersion":9'), /newer version/],
    ['one damaged record', (t: string) => t.replace('"time":"2026-06-14T11:00:00-06:00"', '"time":"yesterday"'), /damaged/],
  ])('refuses %s with a clear message and changes nothing', async (_name, damage, message) => {
    await seed();
    const file = JSON.stringify(await createBackup());
    await freshDb();
    await saveSite({ code: 'KEEP', name: 'Already here', type: 'well' }, 'T. Mills');
    await expect(restoreBackup(damage(file))).rejects.toThrow(message);
    await expect(restoreBackup(damage(file))).rejects.toBeInstanceOf(BackupError);
    expect((await listSites()).map((s) => s.code)).toEqual(['KEEP']);
    expect(await listDay('2026-06-14')).toHaveLength(0);
  });
});
