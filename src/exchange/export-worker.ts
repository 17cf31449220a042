// The export worker: reads the selection from IndexedDB, writes the file in chunks with the same
// export functions the page uses (export-stream.ts), keeps each written chunk as a Blob part (so the
// whole file never sits in memory as one string), reports progress after every chunk and stops at the
// next chunk when cancelled. It lives as long as the page, so its derived-result cache stays warm.
/// <reference lib="webworker" />
import { exportParts } from './export-stream';
import { calibrationsFor, selectSamples } from './selection';
import { listSites } from '../store/records';
import type { ExportReply, ExportRequest } from './export-job';

declare const self: DedicatedWorkerGlobalScope;

const cancelled = new Set<number>();
const post = (m: ExportReply) => self.postMessage(m);
/** let queued messages (a cancel) in between chunks */
const breathe = () => new Promise<void>((r) => setTimeout(r, 0));

const TYPES: Record<ExportRequest['kind'], string> = {
  'csv-wide': 'text/csv',
  'csv-long': 'text/csv',
  'csv-titrations': 'text/csv',
  'csv-calibrations': 'text/csv',
  geojson: 'application/geo+json',
};

async function run(req: ExportRequest): Promise<void> {
  const { id } = req;
  try {
    const samples = await selectSamples(req.selection);
    const sites = await listSites();
    const calibrations = req.kind === 'csv-calibrations' ? await calibrationsFor(samples) : undefined;
    const parts: Blob[] = [];
    post({ id, type: 'progress', done: 0, total: samples.length });
    for (const part of exportParts({ kind: req.kind, samples, sites, settings: req.settings, profile: req.profile, bom: req.bom, ...(calibrations ? { calibrations } : {}) })) {
      if (part.text) parts.push(new Blob([part.text]));
      post({ id, type: 'progress', done: part.done, total: part.total });
      await breathe();
      if (cancelled.has(id)) {
        cancelled.delete(id);
        parts.length = 0;
        post({ id, type: 'cancelled' });
        return;
      }
    }
    post({ id, type: 'done', blob: new Blob(parts, { type: TYPES[req.kind] }), sampleIds: samples.map((s) => s.id) });
  } catch (e) {
    post({ id, type: 'error', message: e instanceof Error ? e.message : String(e) });
  } finally {
    cancelled.delete(id);
  }
}

self.onmessage = (ev: MessageEvent<ExportRequest | { type: 'cancel'; id: number }>) => {
  const m = ev.data;
  if (m.type === 'cancel') cancelled.add(m.id);
  else void run(m);
};
