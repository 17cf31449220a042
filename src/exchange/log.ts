import { ENGINE_VERSION } from '../chemistry';
import { ExportLogEntry } from '../records/schema';
import { isoWithOffset, newId } from '../records/time';
import { getDb, notifyChange } from '../store/connection';

export async function logExport(kind: ExportLogEntry['kind'], fileName: string, sampleIds: string[]): Promise<void> {
  const e = ExportLogEntry.parse({ id: newId('export'), at: isoWithOffset(), kind, fileName, sampleIds, engineVersion: ENGINE_VERSION });
  await (await getDb()).put('exportLog', e);
  notifyChange({ store: 'exportLog', ids: [e.id] });
}

export async function listExportLog(): Promise<ExportLogEntry[]> {
  return (await (await getDb()).getAll('exportLog')).sort((a, b) => (a.at < b.at ? 1 : -1));
}
