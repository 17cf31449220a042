// Upload against a real HTTP server on loopback, started by the test: success, 5xx, timeout,
// connection refused, and a lost answer retried. Nothing is lost; nothing is stored twice.
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { drainOutbox, enqueueUpload, listOutbox, backoffMs } from '../../src/exchange/outbox';
import { freshDb } from '../store/helpers';

type Mode = 'ok' | '500' | 'slow' | 'drop-after-store' | '401';

/** An office server that stores each batch once per Idempotency-Key. */
function officeServer() {
  const stored = new Map<string, string>();
  let mode: Mode = 'ok';
  let requests = 0;
  const server: Server = createServer((req, res) => {
    let body = '';
    req.on('data', (c) => (body += c));
    req.on('end', () => {
      requests++;
      const key = String(req.headers['idempotency-key'] ?? '');
      if (mode === '500') return void res.writeHead(503).end('maintenance');
      if (mode === '401') return void res.writeHead(401).end('bad token');
      if (mode === 'slow') return void setTimeout(() => res.writeHead(200).end(), 1500);
      if (!stored.has(key)) stored.set(key, body);
      if (mode === 'drop-after-store') return void req.socket.destroy(); // stored, but the answer is lost
      res.writeHead(201, { 'Content-Type': 'application/json' }).end('{"ok":true}');
    });
  });
  return {
    stored,
    get requests() { return requests; },
    setMode: (m: Mode) => (mode = m),
    listen: () => new Promise<string>((r) => server.listen(0, '127.0.0.1', () => r(`http://127.0.0.1:${(server.address() as AddressInfo).port}/upload`))),
    close: () => new Promise<void>((r) => { server.closeAllConnections(); server.close(() => r()); }),
  };
}

let office: ReturnType<typeof officeServer>;
let url: string;
let clock = Date.parse('2026-06-14T20:00:00Z');
const now = () => clock;

beforeEach(async () => {
  await freshDb();
  office = officeServer();
  url = await office.listen();
});
afterEach(async () => office.close().catch(() => undefined));

const csv = 'sample_id,ph_field\r\ns1,7.8\r\n';
const settings = () => ({ office: { endpoint: url, token: 'tok', method: 'POST' as const }, now, timeoutMs: 500 });

describe('upload outbox', () => {
  it('sends a queued batch once, marks it sent only after a 2xx, with its key and token', async () => {
    const item = await enqueueUpload({ fileName: 'day.csv', contentType: 'text/csv', body: csv, sampleIds: ['s1'] });
    expect((await listOutbox())[0]!.status).toBe('queued');
    expect(await drainOutbox(settings())).toEqual({ sent: 1, queued: 0, failed: 0 });
    expect(office.stored.get(item.idempotencyKey)).toBe(csv);
    const [after] = await listOutbox();
    expect(after!.status).toBe('sent');
    expect(await drainOutbox(settings())).toEqual({ sent: 0, queued: 0, failed: 0 });
    expect(office.requests).toBe(1);
  });

  it('5xx: stays queued with the reason and a back-off, then goes through', async () => {
    await enqueueUpload({ fileName: 'day.csv', contentType: 'text/csv', body: csv, sampleIds: ['s1'] });
    office.setMode('500');
    expect((await drainOutbox(settings())).queued).toBe(1);
    const [q] = await listOutbox();
    expect(q!.status).toBe('queued');
    expect(q!.lastError).toMatch(/503/);
    expect(Date.parse(q!.nextAttemptAt!) - clock).toBe(backoffMs(1));
    office.setMode('ok');
    expect((await drainOutbox(settings())).queued).toBe(1); // not due yet
    clock += backoffMs(1);
    expect((await drainOutbox(settings())).sent).toBe(1);
    expect(office.stored.size).toBe(1);
  });

  it('timeout and connection refused: queued, nothing lost', async () => {
    await enqueueUpload({ fileName: 'a.csv', contentType: 'text/csv', body: csv, sampleIds: ['s1'] });
    office.setMode('slow');
    await drainOutbox(settings());
    expect((await listOutbox())[0]!.lastError).toMatch(/no answer within/);
    await office.close();
    clock += 3600_000;
    await drainOutbox(settings());
    const [q] = await listOutbox();
    expect(q!.status).toBe('queued');
    expect(q!.lastError).toMatch(/no connection/);
    expect(q!.body).toBe(csv);
  });

  it('an answer lost after the office stored the batch: the retry carries the same key and makes no duplicate', async () => {
    const item = await enqueueUpload({ fileName: 'a.csv', contentType: 'text/csv', body: csv, sampleIds: ['s1'] });
    office.setMode('drop-after-store');
    await drainOutbox(settings());
    expect((await listOutbox())[0]!.status).toBe('queued');
    office.setMode('ok');
    clock += 3600_000;
    await drainOutbox(settings());
    expect((await listOutbox())[0]!.status).toBe('sent');
    expect(office.requests).toBe(2);
    expect([...office.stored.keys()]).toEqual([item.idempotencyKey]);
  });

  it('a refused token (401) is failed with what to do, and is resent only when asked', async () => {
    await enqueueUpload({ fileName: 'a.csv', contentType: 'text/csv', body: csv, sampleIds: ['s1'] });
    office.setMode('401');
    expect((await drainOutbox(settings())).failed).toBe(1);
    expect((await listOutbox())[0]!.lastError).toMatch(/401.*Check the office address and token/);
    office.setMode('ok');
    expect((await drainOutbox(settings())).sent).toBe(0);
    expect((await drainOutbox({ ...settings(), force: true })).sent).toBe(1);
  });

  it('PUT to a pre-signed storage URL names the object by the batch key', async () => {
    const item = await enqueueUpload({ fileName: 'a.csv', contentType: 'text/csv', body: csv, sampleIds: ['s1'] });
    const seen: string[] = [];
    const fetchImpl = (async (u: string, init: RequestInit) => {
      seen.push(`${init.method} ${u}`);
      return new Response(null, { status: 200 });
    }) as unknown as typeof fetch;
    await drainOutbox({ office: { endpoint: 'https://bucket.example/in/{key}?sig=abc', token: '', method: 'PUT' }, fetchImpl, now });
    expect(seen).toEqual([`PUT https://bucket.example/in/${item.idempotencyKey}-a.csv?sig=abc`]);
  });
});
