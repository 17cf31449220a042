import { IDBFactory } from 'fake-indexeddb';
import { closeChangeChannel, resetDb } from '../../src/store';

/** A fresh, empty IndexedDB for each test, and no cached connection. */
export async function freshDb(): Promise<void> {
  await resetDb();
  closeChangeChannel();
  (globalThis as { indexedDB: IDBFactory }).indexedDB = new IDBFactory();
}

export function sampleAt(time: string, over: Record<string, unknown> = {}) {
  return {
    siteId: 'site-1',
    time,
    crew: ['T. Mills'],
    field: {
      tempC: { values: [{ time, value: 9.4 }] },
      pH: { values: [{ time, value: 7.81 }] },
      conductance: { mode: 'ec' as const, unit: 'uS/cm' as const, tempC: 9.4, alpha: 0.0191, values: [{ time, value: 301 }] },
      alkalinity: { kind: 'direct' as const, value: 160, unit: 'mg/L CaCO3' as const },
      kits: [{ analyte: 'calcium-hardness' as const, value: 150, unit: 'mg/L CaCO3' as const }],
      ions: {},
    },
    ...over,
  };
}
