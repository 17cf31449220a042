// The page's side of the export worker: start an export, hear its progress, cancel it.
import type { MethodProfile } from '../chemistry';
import type { Settings } from '../records/schema';
import type { StreamedExportKind } from './export-stream';
import type { Selection } from './selection';

export interface ExportRequest {
  type: 'export';
  id: number;
  kind: StreamedExportKind;
  selection: Selection;
  settings: Pick<Settings, 'activityModel' | 'conductanceFactor'>;
  profile?: MethodProfile;
  bom: boolean;
}

export type ExportReply =
  | { id: number; type: 'progress'; done: number; total: number }
  | { id: number; type: 'done'; blob: Blob; sampleIds: string[] }
  | { id: number; type: 'cancelled' }
  | { id: number; type: 'error'; message: string };

export type ExportOutcome = { status: 'done'; blob: Blob; sampleIds: string[] } | { status: 'cancelled' };

export interface ExportJob {
  result: Promise<ExportOutcome>;
  cancel(): void;
}

let worker: Worker | null = null;
let nextId = 1;
const pending = new Map<number, { onProgress: (done: number, total: number) => void; resolve: (o: ExportOutcome) => void; reject: (e: Error) => void }>();

function getWorker(): Worker {
  if (worker) return worker;
  const w = new Worker(new URL('./export-worker.ts', import.meta.url), { type: 'module', name: 'bankside-export' });
  w.onmessage = (ev: MessageEvent<ExportReply>) => {
    const m = ev.data;
    const p = pending.get(m.id);
    if (!p) return;
    if (m.type === 'progress') return p.onProgress(m.done, m.total);
    pending.delete(m.id);
    if (m.type === 'done') p.resolve({ status: 'done', blob: m.blob, sampleIds: m.sampleIds });
    else if (m.type === 'cancelled') p.resolve({ status: 'cancelled' });
    else p.reject(new Error(m.message));
  };
  w.onerror = (ev) => {
    ev.preventDefault();
    for (const p of pending.values()) p.reject(new Error(`The export stopped: ${ev.message || 'worker error'}`));
    pending.clear();
    w.terminate();
    worker = null;
  };
  worker = w;
  return w;
}

/** Run an export off the main thread. Progress arrives after each chunk; cancel() stops it at the next one. */
export function startExport(req: Omit<ExportRequest, 'type' | 'id'>, onProgress: (done: number, total: number) => void = () => {}): ExportJob {
  const id = nextId++;
  const w = getWorker();
  const result = new Promise<ExportOutcome>((resolve, reject) => pending.set(id, { onProgress, resolve, reject }));
  w.postMessage({ ...req, type: 'export', id } satisfies ExportRequest);
  return { result, cancel: () => w.postMessage({ type: 'cancel', id }) };
}
