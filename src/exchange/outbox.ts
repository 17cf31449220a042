// The upload outbox: exports wait in IndexedDB until the office has confirmed them (2xx).
// Every batch carries an Idempotency-Key, so a retry after a lost answer never makes a second copy.
import type { OutboxItem, Settings } from '../records/schema';
import { isoWithOffset, newId } from '../records/time';
import { getDb, notifyChange } from '../store/connection';
import { loadSchemas, toStoreError } from '../store/records';

export interface EnqueueInput {
  fileName: string;
  contentType: string;
  body: string;
  sampleIds: string[];
}

export async function enqueueUpload(input: EnqueueInput): Promise<OutboxItem> {
  const item = (await loadSchemas()).OutboxItem.parse({
    id: newId('upload'),
    idempotencyKey: newId('batch'),
    createdAt: isoWithOffset(),
    status: 'queued',
    attempts: 0,
    ...input,
  });
  try {
    await (await getDb()).put('outbox', item);
  } catch (e) {
    throw toStoreError(e);
  }
  notifyChange({ store: 'outbox', ids: [item.id] });
  return item;
}

export async function listOutbox(): Promise<OutboxItem[]> {
  return (await (await getDb()).getAll('outbox')).sort((a, b) => (a.createdAt < b.createdAt ? 1 : -1));
}

async function put(item: OutboxItem): Promise<void> {
  await (await getDb()).put('outbox', (await loadSchemas()).OutboxItem.parse(item));
  notifyChange({ store: 'outbox', ids: [item.id] });
}

/** Wait before the next try: 30 s, 1 min, 2 min … capped at 1 h. */
export function backoffMs(attempts: number): number {
  return Math.min(3600_000, 30_000 * 2 ** Math.max(0, attempts - 1));
}

export interface DrainOptions {
  office: Settings['office'];
  fetchImpl?: typeof fetch;
  now?: () => number;
  timeoutMs?: number;
  /** ignore nextAttemptAt (the crew pressed "Send now") */
  force?: boolean;
}

export interface DrainReport {
  sent: number;
  queued: number;
  failed: number;
}

/** The request for one batch: POST to an office endpoint, or PUT to a pre-signed storage URL. */
export function requestFor(item: OutboxItem, office: Settings['office']): { url: string; init: RequestInit } {
  const key = `${item.idempotencyKey}-${item.fileName}`;
  if (office.method === 'PUT') {
    // Object storage: the object name is fixed by the batch key, so a retry overwrites itself.
    const url = office.endpoint.includes('{key}') ? office.endpoint.replace('{key}', encodeURIComponent(key)) : office.endpoint;
    return { url, init: { method: 'PUT', headers: { 'Content-Type': item.contentType }, body: item.body } };
  }
  const headers: Record<string, string> = {
    'Content-Type': item.contentType,
    'Idempotency-Key': item.idempotencyKey,
    'X-Bankside-File': item.fileName,
    'X-Bankside-Samples': String(item.sampleIds.length),
  };
  if (office.token) headers.Authorization = `Bearer ${office.token}`;
  return { url: office.endpoint, init: { method: 'POST', headers, body: item.body } };
}

let draining: Promise<DrainReport> | null = null;

/**
 * Send what is due. Runs one batch at a time and one drain at a time per tab; a batch left
 * "sending" by a page that died is retried with the same key after the timeout.
 */
export function drainOutbox(opts: DrainOptions): Promise<DrainReport> {
  if (!draining) draining = drain(opts).finally(() => (draining = null));
  return draining;
}

async function drain(opts: DrainOptions): Promise<DrainReport> {
  const now = opts.now ?? Date.now;
  const fetchImpl = opts.fetchImpl ?? fetch.bind(globalThis);
  const timeoutMs = opts.timeoutMs ?? 30_000;
  const report: DrainReport = { sent: 0, queued: 0, failed: 0 };
  if (!opts.office.endpoint) return report;
  const items = (await listOutbox()).sort((a, b) => (a.createdAt < b.createdAt ? -1 : 1));
  for (const item of items) {
    if (item.status === 'sent') continue;
    const due = opts.force || !item.nextAttemptAt || Date.parse(item.nextAttemptAt) <= now();
    const stuck = item.status === 'sending' && item.nextAttemptAt !== undefined && Date.parse(item.nextAttemptAt) <= now();
    if (item.status === 'sending' && !stuck && !opts.force) continue;
    if (item.status === 'failed' && !opts.force) {
      report.failed++;
      continue;
    }
    if (!due) {
      report.queued++;
      continue;
    }
    const attempt: OutboxItem = {
      ...item,
      status: 'sending',
      attempts: item.attempts + 1,
      nextAttemptAt: new Date(now() + timeoutMs + 5_000).toISOString(),
    };
    await put(attempt);
    const { url, init } = requestFor(item, opts.office);
    const ctrl = new AbortController();
    const timer = setTimeout(() => ctrl.abort(), timeoutMs);
    let outcome: { ok: true } | { ok: false; retry: boolean; reason: string };
    try {
      const res = await fetchImpl(url, { ...init, signal: ctrl.signal });
      if (res.ok) outcome = { ok: true };
      else {
        const text = (await res.text().catch(() => '')).slice(0, 200);
        const retry = res.status >= 500 || res.status === 408 || res.status === 429;
        outcome = { ok: false, retry, reason: `office answered ${res.status} ${res.statusText}${text ? `: ${text}` : ''}` };
      }
    } catch (e) {
      const aborted = ctrl.signal.aborted;
      outcome = { ok: false, retry: true, reason: aborted ? `no answer within ${Math.round(timeoutMs / 1000)} s` : `no connection (${e instanceof Error ? e.message : String(e)})` };
    } finally {
      clearTimeout(timer);
    }
    if (outcome.ok) {
      await put({ ...attempt, status: 'sent', sentAt: isoWithOffset(new Date(now())), lastError: undefined, nextAttemptAt: undefined });
      report.sent++;
    } else if (outcome.retry) {
      await put({ ...attempt, status: 'queued', lastError: outcome.reason, nextAttemptAt: new Date(now() + backoffMs(attempt.attempts)).toISOString() });
      report.queued++;
    } else {
      await put({ ...attempt, status: 'failed', lastError: `${outcome.reason}. Check the office address and token in Settings, then send again.`, nextAttemptAt: undefined });
      report.failed++;
    }
  }
  return report;
}
