// Upload against real HTTP servers on loopback, started by the test: success, 5xx with Retry-After,
// redirects of every kind (never followed), 204 and bodies that report failure (not received),
// timeout, connection refused, CORS, a lost answer retried, and pre-signed PUT with per-file progress.
// HTTP status semantics: RFC 9110 (read); Retry-After: RFC 9110 §10.2.3 (read).
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createServer, type IncomingMessage, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { backoffMs, bodyReportsFailure, drainOutbox, enqueueUpload, listOutbox, nextDueAt, retryAfterMs, statusWords, type BatchFile } from '../../src/exchange/outbox';
import { freshDb } from '../store/helpers';

interface Answer {
  status: number;
  headers?: Record<string, string>;
  body?: string;
  /** store the batch before answering (a real office would) */
  store?: boolean;
  /** destroy the socket instead of answering */
  drop?: boolean;
  delayMs?: number;
}

async function readBody(req: IncomingMessage): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const c of req) chunks.push(c as Buffer);
  return Buffer.concat(chunks);
}

/** An office server that stores each batch once per Idempotency-Key, answering as told. */
function officeServer() {
  const stored = new Map<string, Array<{ name: string; text: string }>>();
  const putObjects = new Map<string, string>();
  const seen: Array<{ method: string; url: string; key: string; auth: string }> = [];
  let answers: Answer[] = [];
  let fallback: Answer = { status: 201, headers: { 'Content-Type': 'application/json' }, body: '{"ok":true}', store: true };
  const server: Server = createServer(async (req, res) => {
    const body = await readBody(req);
    const key = String(req.headers['idempotency-key'] ?? '');
    seen.push({ method: req.method ?? '', url: req.url ?? '', key, auth: String(req.headers.authorization ?? '') });
    const a = answers.shift() ?? fallback;
    if (a.store ?? a.status < 300) {
      if (req.method === 'PUT') putObjects.set(req.url ?? '', body.toString('utf8'));
      else if (req.method === 'POST' && !stored.has(key)) {
        const form = await new Request('http://office.test/', { method: 'POST', headers: req.headers as Record<string, string>, body: new Uint8Array(body) }).formData();
        const files: Array<{ name: string; text: string }> = [];
        for (const v of form.getAll('file')) if (typeof v !== 'string') files.push({ name: v.name, text: await v.text() });
        stored.set(key, files);
      }
    }
    if (a.drop) return void req.socket.destroy();
    const send = () => res.writeHead(a.status, a.headers ?? {}).end(a.body ?? '');
    if (a.delayMs) setTimeout(send, a.delayMs);
    else send();
  });
  return {
    stored,
    putObjects,
    seen,
    answer: (...xs: Answer[]) => (answers = xs),
    setFallback: (a: Answer) => (fallback = a),
    listen: () => new Promise<string>((r) => server.listen(0, '127.0.0.1', () => r(`http://127.0.0.1:${(server.address() as AddressInfo).port}`))),
    close: () => new Promise<void>((r) => { server.closeAllConnections(); server.close(() => r()); }),
  };
}

let office: ReturnType<typeof officeServer>;
let elsewhere: ReturnType<typeof officeServer>;
let base: string;
let elsewhereBase: string;
let clock = Date.parse('2026-06-14T20:00:00Z');
const now = () => clock;

beforeEach(async () => {
  await freshDb();
  office = officeServer();
  elsewhere = officeServer();
  base = await office.listen();
  elsewhereBase = await elsewhere.listen();
});
afterEach(async () => {
  await office.close().catch(() => undefined);
  await elsewhere.close().catch(() => undefined);
});

const files: BatchFile[] = [
  { fileName: 'd_samples.csv', contentType: 'text/csv', body: 'sample_id,ph_field\r\ns1,7.8\r\n' },
  { fileName: 'd_values.csv', contentType: 'text/csv', body: 'sample_id,parameter,value\r\ns1,pH,7.8\r\n' },
  { fileName: 'd_meter_checks.csv', contentType: 'text/csv', body: 'calibration_id,pass\r\nc1,true\r\n' },
  { fileName: 'd_titrations.csv', contentType: 'text/csv', body: 'sample_id,point\r\n' },
];
const queue = () => enqueueUpload({ fileName: 'd', files, sampleIds: ['s1'] });
const opts = (over: Record<string, unknown> = {}) => ({ office: { endpoint: `${base}/upload`, token: 'tok', method: 'POST' as const }, now, timeoutMs: 500, random: () => 0.5, ...over });

describe('upload outbox: what counts as received', () => {
  it('the whole selection goes as one batch (one POST, every file), marked sent only after a confirming 2xx', async () => {
    const item = await queue();
    expect((await listOutbox())[0]!.status).toBe('queued');
    expect(await drainOutbox(opts())).toEqual({ sent: 1, queued: 0, failed: 0 });
    expect(office.seen).toHaveLength(1);
    expect(office.seen[0]).toMatchObject({ method: 'POST', url: '/upload', key: item.idempotencyKey, auth: 'Bearer tok' });
    expect(office.stored.get(item.idempotencyKey)).toEqual(files.map((f) => ({ name: f.fileName, text: f.body })));
    const [after] = await listOutbox();
    expect(after!.status).toBe('sent');
    expect(statusWords(after!)).toBe('✓ Received by the office');
    expect(await drainOutbox(opts())).toEqual({ sent: 0, queued: 0, failed: 0 });
    expect(office.seen).toHaveLength(1);
  });

  it.each([301, 302, 303, 307, 308])('a %i redirect is a failure: never followed, nothing reaches the other address', async (code) => {
    await queue();
    office.answer({ status: code, headers: { Location: `${elsewhereBase}/steal` }, store: false });
    expect(await drainOutbox(opts())).toEqual({ sent: 0, queued: 1, failed: 0 });
    expect(elsewhere.seen).toHaveLength(0);
    const [q] = await listOutbox();
    expect(q!.status).toBe('queued');
    expect(q!.problem).toBe('redirect');
    expect(q!.lastError).toMatch(new RegExp(`redirect \\(${code}\\) to ${elsewhereBase}/steal; it was not followed, so nothing was received`));
    expect(statusWords(q!)).toMatch(/^Not received: the office address redirects elsewhere\. Tries again by itself at .*Ask the office for the final upload address\.$/);
  });

  it('204 is not a confirmation (failed, with what to ask the office); a body reporting failure is not received', async () => {
    await queue();
    office.answer({ status: 204 });
    expect((await drainOutbox(opts())).failed).toBe(1);
    let [q] = await listOutbox();
    expect([q!.status, q!.problem, q!.lastStatus]).toEqual(['failed', 'not-confirmed', 204]);
    expect(q!.lastError).toMatch(/must answer 200 or 201/);
    office.answer({ status: 200, headers: { 'Content-Type': 'application/json' }, body: '{"ok":false,"message":"disk full"}', store: false });
    expect((await drainOutbox(opts({ force: true }))).queued).toBe(1);
    [q] = await listOutbox();
    expect([q!.status, q!.problem]).toEqual(['queued', 'server-error']);
    expect(q!.lastError).toMatch(/answered 200 but reported a failure: disk full/);
    office.answer({ status: 200, body: '{"status":"error"}', store: false });
    expect((await drainOutbox(opts({ force: true }))).queued).toBe(1);
    office.answer({ status: 200, body: '' });
    expect((await drainOutbox(opts({ force: true }))).sent).toBe(1);
  });

  it('bodyReportsFailure reads the usual shapes and nothing else', () => {
    expect(bodyReportsFailure('{"ok":false}')).toBeDefined();
    expect(bodyReportsFailure('{"success":false,"error":"bad token"}')).toBe('bad token');
    expect(bodyReportsFailure('{"status":"error","message":"x"}')).toBe('x');
    expect(bodyReportsFailure('{"error":"quota"}')).toBe('quota');
    expect(bodyReportsFailure('{"ok":true,"error":null}')).toBeUndefined();
    expect(bodyReportsFailure('{"status":"stored"}')).toBeUndefined();
    expect(bodyReportsFailure('stored, thanks')).toBeUndefined();
    expect(bodyReportsFailure('[]')).toBeUndefined();
  });
});

describe('upload outbox: retries', () => {
  it('5xx with Retry-After: waits exactly that long, says "office server error", then goes through', async () => {
    await queue();
    office.answer({ status: 503, headers: { 'Retry-After': '7' }, body: 'maintenance', store: false });
    expect((await drainOutbox(opts())).queued).toBe(1);
    const [q] = await listOutbox();
    expect(q!.problem).toBe('server-error');
    expect(Date.parse(q!.nextAttemptAt!) - clock).toBe(7000);
    expect(statusWords(q!)).toMatch(/^Office server error \(503\): not received yet\. Tries again by itself at /);
    expect(nextDueAt(await listOutbox())).toBe(clock + 7000);
    expect((await drainOutbox(opts())).queued).toBe(1); // not due yet
    expect(office.seen).toHaveLength(1);
    clock += 7000;
    expect((await drainOutbox(opts())).sent).toBe(1);
    expect(office.stored.size).toBe(1);
  });

  it('Retry-After as an HTTP date; without it, back-off with jitter', async () => {
    expect(retryAfterMs('Sun, 14 Jun 2026 20:02:00 GMT', Date.parse('2026-06-14T20:00:00Z'))).toBe(120_000);
    expect(retryAfterMs('soon', 0)).toBeUndefined();
    expect(retryAfterMs(null, 0)).toBeUndefined();
    // half of 5 s × 2^(n−1), plus a random share of the other half; capped at 1 h
    expect(backoffMs(1, () => 0)).toBe(2500);
    expect(backoffMs(1, () => 1)).toBe(5000);
    expect(backoffMs(3, () => 0.5)).toBe(15_000);
    expect(backoffMs(30, () => 1)).toBe(3600_000);
    await queue();
    office.answer({ status: 500, store: false });
    await drainOutbox(opts({ random: () => 0.25 }));
    expect(Date.parse((await listOutbox())[0]!.nextAttemptAt!) - clock).toBe(backoffMs(1, () => 0.25));
  });

  it('timeout and connection refused: queued in plain words, nothing lost', async () => {
    await queue();
    office.answer({ status: 200, delayMs: 1500 });
    await drainOutbox(opts());
    let [q] = await listOutbox();
    expect([q!.problem, q!.lastError]).toEqual(['timeout', 'no answer within 1 s']);
    await office.close();
    clock += 3600_000;
    await drainOutbox(opts());
    [q] = await listOutbox();
    expect(q!.status).toBe('queued');
    expect(q!.problem).toBe('no-connection');
    expect(statusWords(q!)).toMatch(/^No connection: waits for signal\./);
    expect(q!.files).toEqual(files);
  });

  it('CORS: the office answers but the browser withholds it: "not set up for this app", with what to tell the office', async () => {
    await queue();
    // What a browser does when the server sends no Access-Control-Allow-Origin: the request
    // rejects with a TypeError, while a no-cors probe of the same address goes through (opaque).
    const browserLike = (async (url: string, init: RequestInit) =>
      init.mode === 'no-cors' ? fetch(url, { method: 'GET' }) : Promise.reject(new TypeError('Failed to fetch'))) as unknown as typeof fetch;
    await drainOutbox(opts({ fetchImpl: browserLike, origin: 'https://crew.example' }));
    const [q] = await listOutbox();
    expect(q!.problem).toBe('cors');
    expect(q!.lastError).toMatch(/office server not set up for this app.*allow origin https:\/\/crew\.example, methods POST, PUT and OPTIONS, and headers Content-Type, Authorization, Idempotency-Key/);
    expect(statusWords(q!)).toMatch(/^Office server not set up for this app \(CORS\)/);
    expect(office.seen.map((s) => s.method)).toEqual(['GET']); // only the probe reached it
    // no server at all: the probe fails too, so it is "no connection"
    await office.close();
    clock += 3600_000;
    await drainOutbox(opts({ fetchImpl: browserLike }));
    expect((await listOutbox())[0]!.problem).toBe('no-connection');
  });

  it('an answer lost after the office stored the batch: the retry carries the same key and makes no duplicate', async () => {
    const item = await queue();
    office.answer({ status: 201, drop: true, store: true });
    await drainOutbox(opts());
    expect((await listOutbox())[0]!.status).toBe('queued');
    clock += 3600_000;
    await drainOutbox(opts());
    expect((await listOutbox())[0]!.status).toBe('sent');
    expect(office.seen.filter((s) => s.method === 'POST').map((s) => s.key)).toEqual([item.idempotencyKey, item.idempotencyKey]);
    expect([...office.stored.keys()]).toEqual([item.idempotencyKey]);
  });

  it('a refused token (401) is failed with what to do, and is resent only when asked', async () => {
    await queue();
    office.answer({ status: 401, body: 'bad token', store: false });
    expect((await drainOutbox(opts())).failed).toBe(1);
    const [q] = await listOutbox();
    expect(q!.lastError).toMatch(/refused by the office \(401.*bad token\)\. Check the office address and token in Settings/);
    expect(statusWords(q!)).toBe('✗ Refused by the office (401): check the address and token in Settings, then Send now.');
    expect((await drainOutbox(opts())).sent).toBe(0);
    expect((await drainOutbox(opts({ force: true }))).sent).toBe(1);
  });

  it('PUT to a pre-signed storage link: one object per file named by the batch key; a retry sends only what is missing', async () => {
    const item = await queue();
    const put = { endpoint: `${base}/in/{key}?sig=abc`, token: '', method: 'PUT' as const };
    office.answer({ status: 200 }, { status: 200 }, { status: 503, store: false });
    expect((await drainOutbox(opts({ office: put }))).queued).toBe(1);
    const [q] = await listOutbox();
    expect(q!.delivered).toEqual(['d_samples.csv', 'd_values.csv']);
    clock += 3600_000;
    expect((await drainOutbox(opts({ office: put }))).sent).toBe(1);
    expect(office.seen.map((s) => `${s.method} ${s.url}`)).toEqual([
      `PUT /in/${item.idempotencyKey}-d_samples.csv?sig=abc`,
      `PUT /in/${item.idempotencyKey}-d_values.csv?sig=abc`,
      `PUT /in/${item.idempotencyKey}-d_meter_checks.csv?sig=abc`,
      `PUT /in/${item.idempotencyKey}-d_meter_checks.csv?sig=abc`,
      `PUT /in/${item.idempotencyKey}-d_titrations.csv?sig=abc`,
    ]);
    expect(office.putObjects.get(`/in/${item.idempotencyKey}-d_titrations.csv?sig=abc`)).toBe(files[3]!.body);
  });

  it('a batch queued by an older version (one file in body) still goes', async () => {
    await enqueueUpload({ fileName: 'old.csv', contentType: 'text/csv', body: 'a,b\r\n1,2\r\n', sampleIds: ['s1'] });
    expect((await drainOutbox(opts())).sent).toBe(1);
    expect([...office.stored.values()][0]).toEqual([{ name: 'old.csv', text: 'a,b\r\n1,2\r\n' }]);
  });
});
