// The upload outbox: a courier that only reports "received" when the office has confirmed it.
// Every batch carries an Idempotency-Key, so a retry after a lost answer never makes a second copy.
// Rules (README "Getting records to the office" says what the office server must allow):
// - redirects are failures, never followed (redirect: 'manual'): a 3xx would otherwise turn the
//   batch into a body-less GET elsewhere, or post the records to another origin;
// - received = a 2xx other than 204/205, from the configured address, whose body does not report a
//   failure ({"ok":false}, {"success":false}, {"status":"error"}, a non-empty "error"). A 204 is not
//   a confirmation: a catch-all route, a preflight handler or a proxy answers 204 without storing
//   anything, and an office endpoint that stored a batch can say so in a 200/201;
// - Retry-After (seconds or an HTTP date) is honoured; otherwise back-off with jitter;
// - the whole selection goes as one batch: one multipart/form-data POST with every file, or (for
//   pre-signed storage) one PUT per file, and the batch counts as received only when all are.
import type { OutboxItem, Settings } from '../records/schema';
import { isoWithOffset, newId } from '../records/time';
import { getDb, notifyChange } from '../store/connection';
import { loadSchemas, toStoreError } from '../store/records';

export interface BatchFile {
  fileName: string;
  contentType: string;
  body: string;
}

export interface EnqueueInput {
  /** a label for the batch, e.g. "bankside_2026-06-14" */
  fileName: string;
  sampleIds: string[];
  /** every file of the selection (samples, values, meter checks, titrations) */
  files?: BatchFile[];
  /** a single file (older callers) */
  contentType?: string;
  body?: string;
}

export async function enqueueUpload(input: EnqueueInput): Promise<OutboxItem> {
  const files = input.files ?? [{ fileName: input.fileName, contentType: input.contentType ?? 'text/csv', body: input.body ?? '' }];
  const item = (await loadSchemas()).OutboxItem.parse({
    id: newId('upload'),
    idempotencyKey: newId('batch'),
    createdAt: isoWithOffset(),
    status: 'queued',
    attempts: 0,
    fileName: input.fileName,
    contentType: files.length === 1 ? files[0]!.contentType : 'multipart/form-data',
    body: '',
    sampleIds: input.sampleIds,
    files,
  });
  try {
    await (await getDb()).put('outbox', item);
  } catch (e) {
    throw toStoreError(e);
  }
  notifyChange({ store: 'outbox', ids: [item.id] });
  return item;
}

/** The files of a batch (an item queued by an older version carries one file in body). */
export function filesOf(item: OutboxItem): BatchFile[] {
  return item.files ?? [{ fileName: item.fileName, contentType: item.contentType, body: item.body }];
}

export async function listOutbox(): Promise<OutboxItem[]> {
  return (await (await getDb()).getAll('outbox')).sort((a, b) => (a.createdAt < b.createdAt ? 1 : -1));
}

async function put(item: OutboxItem): Promise<void> {
  await (await getDb()).put('outbox', (await loadSchemas()).OutboxItem.parse(item));
  notifyChange({ store: 'outbox', ids: [item.id] });
}

/**
 * Wait before the next try, with jitter so many phones coming back online do not hit the office
 * at once: half of 5 s × 2^(n−1) (capped at 1 h) plus a random share of the other half.
 */
export function backoffMs(attempts: number, random: () => number = Math.random): number {
  const base = Math.min(3600_000, 5_000 * 2 ** Math.max(0, attempts - 1));
  return Math.round(base / 2 + (random() * base) / 2);
}

/** Retry-After as milliseconds from now (delta seconds or an HTTP date), capped at 6 h; undefined when absent or unreadable. */
export function retryAfterMs(header: string | null, now: number): number | undefined {
  if (!header) return undefined;
  const h = header.trim();
  const ms = /^\d+$/.test(h) ? Number(h) * 1000 : Date.parse(h) - now;
  return Number.isFinite(ms) ? Math.min(6 * 3600_000, Math.max(0, ms)) : undefined;
}

/** Whether a response body says the office did NOT take the batch, and its words if so. */
export function bodyReportsFailure(text: string): string | undefined {
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch {
    return undefined;
  }
  if (!json || typeof json !== 'object' || Array.isArray(json)) return undefined;
  const o = json as Record<string, unknown>;
  const words = typeof o.message === 'string' ? o.message : typeof o.error === 'string' ? o.error : '';
  const failed =
    o.ok === false ||
    o.success === false ||
    o.accepted === false ||
    (typeof o.status === 'string' && /^(error|fail(ed|ure)?|rejected)$/i.test(o.status)) ||
    (o.error !== undefined && o.error !== null && o.error !== false && o.error !== '');
  return failed ? words || 'the office server reported a failure' : undefined;
}

export interface DrainOptions {
  office: Settings['office'];
  fetchImpl?: typeof fetch;
  now?: () => number;
  random?: () => number;
  timeoutMs?: number;
  /** ignore nextAttemptAt and refusals (the crew pressed "Send now") */
  force?: boolean;
  /** this app's origin, for the words shown when the office server is not set up for it (CORS) */
  origin?: string;
}

export interface DrainReport {
  sent: number;
  queued: number;
  failed: number;
}

/** The request for one file: PUT to a pre-signed storage URL (one object per file). */
export function putRequestFor(item: OutboxItem, file: BatchFile, office: Settings['office']): { url: string; init: RequestInit } {
  const key = `${item.idempotencyKey}-${file.fileName}`;
  const url = office.endpoint.includes('{key}') ? office.endpoint.replace('{key}', encodeURIComponent(key)) : office.endpoint;
  return { url, init: { method: 'PUT', headers: { 'Content-Type': file.contentType }, body: file.body, redirect: 'manual' } };
}

/** The request for a whole batch to an office endpoint: one multipart/form-data POST, one part per file. */
export function postRequestFor(item: OutboxItem, office: Settings['office']): { url: string; init: RequestInit } {
  const files = filesOf(item);
  const form = new FormData();
  for (const f of files) form.append('file', new Blob([f.body], { type: f.contentType }), f.fileName);
  // Content-Type (with its boundary) is set by fetch from the FormData.
  const headers: Record<string, string> = {
    'Idempotency-Key': item.idempotencyKey,
    'X-Bankside-File': files.map((f) => f.fileName).join(', '),
    'X-Bankside-Samples': String(item.sampleIds.length),
  };
  if (office.token) headers.Authorization = `Bearer ${office.token}`;
  return { url: office.endpoint, init: { method: 'POST', headers, body: form, redirect: 'manual' } };
}

type Outcome = { ok: true } | { ok: false; retry: boolean; problem: NonNullable<OutboxItem['problem']>; reason: string; status?: number; retryAfter?: number };

const sameAddress = (a: string, b: string) => {
  try {
    const x = new URL(a);
    const y = new URL(b);
    x.hash = '';
    y.hash = '';
    return x.href === y.href;
  } catch {
    return a === b;
  }
};

/** Send one request and judge the answer by the rules at the top of this file. */
async function sendOne(url: string, init: RequestInit, opts: DrainOptions, fetchImpl: typeof fetch, timeoutMs: number): Promise<Outcome> {
  const now = opts.now ?? Date.now;
  const ctrl = new AbortController();
  const timer = setTimeout(() => ctrl.abort(), timeoutMs);
  try {
    let res: Response;
    try {
      res = await fetchImpl(url, { ...init, redirect: 'manual', signal: ctrl.signal });
    } catch (e) {
      if (ctrl.signal.aborted) return { ok: false, retry: true, problem: 'timeout', reason: `no answer within ${Math.round(timeoutMs / 1000)} s` };
      return await networkFailure(url, e, fetchImpl, opts.origin);
    }
    const text = await res.text().catch(() => '');
    if (res.type === 'opaqueredirect' || (res.status >= 300 && res.status < 400)) {
      const to = res.headers.get('location');
      return {
        ok: false,
        retry: true,
        problem: 'redirect',
        status: res.status || undefined,
        reason: `the office address answered with a redirect${res.status ? ` (${res.status})` : ''}${to ? ` to ${to}` : ''}; it was not followed, so nothing was received. Ask the office for the final upload address and set it in Settings`,
      } as Outcome;
    }
    if (res.url && !sameAddress(res.url, url)) {
      return { ok: false, retry: true, problem: 'redirect', reason: `the answer came from ${res.url}, not the configured address; nothing counts as received` };
    }
    const retryAfter = retryAfterMs(res.headers.get('retry-after'), now());
    const snippet = text.slice(0, 200);
    if (res.ok) {
      if (res.status === 204 || res.status === 205) {
        return { ok: false, retry: false, problem: 'not-confirmed', status: res.status, reason: `the office answered ${res.status} (no content) without confirming receipt. Ask the office: their server must answer 200 or 201 once the batch is stored, e.g. {"ok":true}` };
      }
      const failure = bodyReportsFailure(text);
      if (failure) return { ok: false, retry: true, problem: 'server-error', status: res.status, reason: `the office server answered ${res.status} but reported a failure: ${failure.slice(0, 200)}`, ...(retryAfter !== undefined ? { retryAfter } : {}) };
      return { ok: true };
    }
    if (res.status >= 500 || res.status === 408 || res.status === 429) {
      return { ok: false, retry: true, problem: 'server-error', status: res.status, reason: `office server error ${res.status}${res.statusText ? ` ${res.statusText}` : ''}${snippet ? `: ${snippet}` : ''}`, ...(retryAfter !== undefined ? { retryAfter } : {}) };
    }
    return { ok: false, retry: false, problem: 'refused', status: res.status, reason: `refused by the office (${res.status}${res.statusText ? ` ${res.statusText}` : ''}${snippet ? `: ${snippet}` : ''}). Check the office address and token in Settings, then send again` };
  } finally {
    clearTimeout(timer);
  }
}

/**
 * fetch rejected without an answer: either there is no connection, or the office server answered
 * but the browser withheld the answer because the server does not allow this app's origin (CORS).
 * A no-cors probe tells them apart: it reaches a server that is there, whatever its CORS headers.
 */
async function networkFailure(url: string, e: unknown, fetchImpl: typeof fetch, origin?: string): Promise<Outcome> {
  const offline = typeof navigator !== 'undefined' && navigator.onLine === false;
  if (!offline) {
    const reachable = await fetchImpl(url, { method: 'GET', mode: 'no-cors', cache: 'no-store', credentials: 'omit' }).then(
      () => true,
      () => false,
    );
    if (reachable) {
      return {
        ok: false,
        retry: true,
        problem: 'cors',
        reason: `office server not set up for this app: the server is there, but the browser withheld its answer, most likely because it does not allow this app (CORS). Tell the office to allow origin ${origin ?? 'of this app'}, methods POST, PUT and OPTIONS, and headers Content-Type, Authorization, Idempotency-Key, X-Bankside-File, X-Bankside-Samples`,
      };
    }
  }
  return { ok: false, retry: true, problem: 'no-connection', reason: `no connection${e instanceof Error && e.message ? ` (${e.message})` : ''}; it goes by itself when there is signal` };
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
      nextAttemptAt: new Date(now() + timeoutMs * Math.max(1, filesOf(item).length) + 5_000).toISOString(),
    };
    await put(attempt);
    let outcome: Outcome = { ok: true };
    const delivered = new Set(item.delivered ?? []);
    if (opts.office.method === 'PUT') {
      for (const file of filesOf(item)) {
        if (delivered.has(file.fileName)) continue;
        const { url, init } = putRequestFor(item, file, opts.office);
        outcome = await sendOne(url, init, opts, fetchImpl, timeoutMs);
        if (!outcome.ok) break;
        delivered.add(file.fileName);
      }
    } else {
      const { url, init } = postRequestFor(item, opts.office);
      outcome = await sendOne(url, init, opts, fetchImpl, timeoutMs);
    }
    const progress = delivered.size > 0 ? { delivered: [...delivered] } : {};
    if (outcome.ok) {
      await put({ ...attempt, ...progress, status: 'sent', sentAt: isoWithOffset(new Date(now())), lastError: undefined, problem: undefined, lastStatus: undefined, nextAttemptAt: undefined });
      report.sent++;
    } else if (outcome.retry) {
      const wait = outcome.retryAfter ?? backoffMs(attempt.attempts, opts.random);
      await put({ ...attempt, ...progress, status: 'queued', lastError: outcome.reason, problem: outcome.problem, lastStatus: outcome.status, nextAttemptAt: new Date(now() + wait).toISOString() });
      report.queued++;
    } else {
      await put({ ...attempt, ...progress, status: 'failed', lastError: outcome.reason, problem: outcome.problem, lastStatus: outcome.status, nextAttemptAt: undefined });
      report.failed++;
    }
  }
  return report;
}

/** When the next queued batch is due (ms since epoch), for the in-app retry timer; undefined when nothing waits. */
export function nextDueAt(items: OutboxItem[]): number | undefined {
  let next: number | undefined;
  for (const i of items) {
    if (i.status !== 'queued' && i.status !== 'sending') continue;
    const t = i.nextAttemptAt ? Date.parse(i.nextAttemptAt) : 0;
    if (next === undefined || t < next) next = t;
  }
  return next;
}

/** The status of a batch in plain words: what happened, and what (if anything) to do. */
export function statusWords(item: OutboxItem): string {
  if (item.status === 'sent') return '✓ Received by the office';
  if (item.status === 'sending') return 'Sending…';
  const when = item.nextAttemptAt ? new Date(item.nextAttemptAt).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit', second: '2-digit' }) : '';
  const again = item.status === 'queued' && when ? ` Tries again by itself at ${when}.` : '';
  switch (item.problem) {
    case 'server-error': return `Office server error${item.lastStatus ? ` (${item.lastStatus})` : ''}: not received yet.${again} If it lasts, tell the office their upload service is failing.`;
    case 'timeout': return `The office did not answer in time: not received yet.${again}`;
    case 'no-connection': return `No connection: waits for signal.${again}`;
    case 'cors': return `Office server not set up for this app (CORS): not received.${again} Tell the office what the README says their server must allow.`;
    case 'redirect': return `Not received: the office address redirects elsewhere.${again} Ask the office for the final upload address.`;
    case 'not-confirmed': return '✗ Not confirmed by the office: kept here. Ask the office to confirm receipt (200 or 201), then Send now.';
    case 'refused': return `✗ Refused by the office${item.lastStatus ? ` (${item.lastStatus})` : ''}: check the address and token in Settings, then Send now.`;
    default: return item.status === 'failed' ? '✗ Not received: Send now to try again.' : `Queued: waits for signal.${again}`;
  }
}
