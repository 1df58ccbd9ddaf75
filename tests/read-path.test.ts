// The read path many viewers share: the series cache with ETags and compact columns, response
// compression, PDF reports rendered once per record version, request ids, readiness and metrics.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import http from 'node:http';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import type { ChildProcess } from 'node:child_process';
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { decodeSeries } from '../src/lib/series-encoding';
import { Client, baseUrl, signedIn } from './support/http';
import { startWorker, stopProcess } from './support/processes';
import { createReducedTest, waitForReduction } from './support/reduced-test';

interface RawAnswer {
  status: number;
  headers: http.IncomingHttpHeaders;
  /** the bytes as they came over the wire (compressed or not) */
  wire: Buffer;
}

/** GET without the decompression fetch does, so the bytes on the wire can be counted. */
function rawGet(client: Client | null, path: string, headers: Record<string, string> = {}): Promise<RawAnswer> {
  const url = new URL(path, baseUrl());
  return new Promise((resolve, reject) => {
    const req = http.get(
      url,
      { headers: { ...(client ? { cookie: client.cookieHeader() } : {}), ...headers } },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () =>
          resolve({ status: res.statusCode ?? 0, headers: res.headers, wire: Buffer.concat(chunks) }),
        );
        res.on('error', reject);
      },
    );
    req.on('error', reject);
  });
}

function bodyText(a: RawAnswer): string {
  const enc = a.headers['content-encoding'];
  if (enc === 'br') return brotliDecompressSync(a.wire).toString('utf8');
  if (enc === 'gzip') return gunzipSync(a.wire).toString('utf8');
  return a.wire.toString('utf8');
}

async function metricValue(name: string): Promise<number> {
  const text = await (await fetch(`${baseUrl()}/api/metrics`)).text();
  const line = text.split('\n').find((l) => l.startsWith(`${name} `));
  return line ? Number(line.split(' ')[1]) : NaN;
}

let engineer: Client, technician: Client, qa: Client, admin: Client;
let worker: ChildProcess;
let testId: number;
let reductionId: number;

beforeAll(async () => {
  worker = startWorker(inject('env'), 'w-read-path');
  [engineer, technician, qa, admin] = await Promise.all([
    signedIn('engineer@example.com'),
    signedIn('technician@example.com'),
    signedIn('qa@example.com'),
    signedIn('admin@example.com'),
  ]);
  ({ testId, reductionId } = await createReducedTest(engineer, technician, 'Read path'));
  expect((await waitForReduction(engineer, reductionId)).status).toBe('done');
});
afterAll(async () => {
  await stopProcess(worker);
});

describe('the time-history series', () => {
  it('answers compact columns, compressed by Accept-Encoding, with an ETag naming the reduction and window', async () => {
    const path = `/api/tests/${testId}/series?points=400`;
    const plain = await rawGet(engineer, path);
    expect(plain.status).toBe(200);
    expect(plain.headers['content-encoding']).toBeUndefined();
    const br = await rawGet(engineer, path, { 'accept-encoding': 'gzip, br' });
    const gz = await rawGet(engineer, path, { 'accept-encoding': 'gzip' });
    expect(br.headers['content-encoding']).toBe('br');
    expect(gz.headers['content-encoding']).toBe('gzip');
    expect(br.wire.length).toBeLessThan(plain.wire.length / 2);
    expect(bodyText(br)).toBe(plain.wire.toString('utf8'));
    expect(bodyText(gz)).toBe(plain.wire.toString('utf8'));
    expect(br.headers.vary).toMatch(/accept-encoding/i);

    const s = decodeSeries(JSON.parse(plain.wire.toString('utf8')));
    expect(s.reductionId).toBe(reductionId);
    expect(s.channels).toEqual(['pressure', 'SG1', 'SG2', 'SG3']);
    expect(s.t.length).toBeGreaterThan(100);
    expect(Math.max(...(s.max.pressure as number[]))).toBeCloseTo(2, 3);

    const etag = plain.headers.etag!;
    expect(etag).toMatch(new RegExp(`^W/"series-${reductionId}-`));
    expect(br.headers.etag).toBe(etag);
    expect((await rawGet(engineer, `/api/tests/${testId}/series?points=401`)).headers.etag).not.toBe(etag);
    const again = await rawGet(engineer, path, { 'if-none-match': etag });
    expect(again.status).toBe(304);
    expect(again.wire.length).toBe(0);
  });

  it('lets the browser keep a named reduction for a long time, and revalidate the current one', async () => {
    const current = await rawGet(engineer, `/api/tests/${testId}/series?points=300`);
    expect(current.headers['cache-control']).toBe('private, no-cache');
    const named = await rawGet(engineer, `/api/tests/${testId}/series?points=300&reduction=${reductionId}`);
    expect(named.status).toBe(200);
    expect(named.headers['cache-control']).toMatch(/^private, max-age=31536000/);
    expect(named.headers.etag).toBe(current.headers.etag);
    // a reduction of another test, or none at all
    const other = await createReducedTest(engineer, technician, 'Read path, other');
    await waitForReduction(engineer, other.reductionId);
    expect((await rawGet(engineer, `/api/tests/${testId}/series?reduction=${other.reductionId}`)).status).toBe(404);
    expect((await rawGet(engineer, `/api/tests/999999/series`)).status).toBe(404);
    expect((await rawGet(null, `/api/tests/${testId}/series`)).status).toBe(401);
  });

  it('serves a share link the current reduction only, always revalidated', async () => {
    const made = await qa.json(`/api/tests/${testId}/share-links`, { method: 'POST', json: {} });
    expect(made.status).toBe(201);
    const token = made.body.url.split('/share/')[1];
    const shared = await rawGet(null, `/api/share/${token}/series?points=300&reduction=${reductionId}`);
    expect(shared.status).toBe(200);
    expect(shared.headers['cache-control']).toBe('private, no-cache');
    expect(shared.headers.etag).toMatch(new RegExp(`^W/"series-${reductionId}-`));
    expect(
      (await rawGet(null, `/api/share/${token}/series?points=300`, { 'if-none-match': shared.headers.etag! })).status,
    ).toBe(304);
    // a newer reduction makes the old one unavailable through the link
    const q = await technician.json(`/api/tests/${testId}/reductions`, { method: 'POST', json: {} });
    await waitForReduction(engineer, q.body.id);
    expect((await rawGet(null, `/api/share/${token}/series?reduction=${reductionId}`)).status).toBe(404);
    const now = await rawGet(null, `/api/share/${token}/series?points=300`, { 'if-none-match': shared.headers.etag! });
    expect(now.status).toBe(200);
    expect(now.headers.etag).toMatch(new RegExp(`^W/"series-${q.body.id}-`));
    reductionId = q.body.id;
  });
});

describe('JSON compression', () => {
  it('compresses a JSON answer over a few KB and leaves a small one alone', async () => {
    const big = await rawGet(engineer, `/api/reductions/${reductionId}`, { 'accept-encoding': 'br;q=0.5, gzip' });
    expect(big.status).toBe(200);
    expect(big.headers['content-encoding']).toBe('gzip');
    expect(JSON.parse(bodyText(big)).result.gauges).toHaveLength(3);
    const small = await rawGet(null, '/api/health', { 'accept-encoding': 'gzip, br' });
    expect(small.headers['content-encoding']).toBeUndefined();
    expect(JSON.parse(small.wire.toString('utf8')).ok).toBe(true);
  });
});

describe('PDF reports', () => {
  it('are rendered once per record version, and again after a disposition', async () => {
    const before = await metricValue('hoopline_report_renders_total');
    const a = await engineer.fetch(`/api/tests/${testId}/export.pdf`);
    expect(a.status).toBe(200);
    const bytesA = Buffer.from(await a.arrayBuffer());
    expect(bytesA.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const version = a.headers.get('x-record-version')!;
    const b = await engineer.fetch(`/api/tests/${testId}/export.pdf`);
    expect(b.headers.get('x-record-version')).toBe(version);
    expect(Buffer.from(await b.arrayBuffer()).equals(bytesA)).toBe(true);
    const c = await engineer.fetch(`/api/tests/${testId}/export.pdf`, {
      headers: { 'if-none-match': a.headers.get('etag')! },
    });
    expect(c.status).toBe(304);
    expect(await metricValue('hoopline_report_renders_total')).toBe(before + 1);

    const { getS3 } = await import('../src/server/storage.server');
    const listed = await getS3().send(
      new ListObjectsV2Command({ Bucket: inject('env').S3_BUCKET, Prefix: `reports/tests/${testId}/` }),
    );
    expect(listed.Contents?.map((o) => o.Key)).toEqual([`reports/tests/${testId}/${version}.pdf`]);

    const d = await engineer.json(`/api/tests/${testId}/dispositions`, {
      method: 'POST',
      json: { gaugeId: 'H2', outcome: 'retest', reason: 'gauge lead re-terminated before the retest' },
    });
    expect(d.status).toBe(201);
    const e = await engineer.fetch(`/api/tests/${testId}/export.pdf`);
    expect(e.headers.get('x-record-version')).not.toBe(version);
    await e.arrayBuffer();
    expect(await metricValue('hoopline_report_renders_total')).toBe(before + 2);
  });
});

describe('request ids, readiness and metrics', () => {
  it('returns a request id on every answer, inside error bodies too, and keeps a sane incoming one', async () => {
    const res = await engineer.fetch('/api/tests/999999');
    expect(res.status).toBe(404);
    const id = res.headers.get('x-request-id');
    expect(id).toMatch(/^[\w-]{12}$/);
    expect((await res.json()).error.requestId).toBe(id);
    const kept = await fetch(`${baseUrl()}/api/health`, { headers: { 'x-request-id': 'lb-7f3a9c21' } });
    expect(kept.headers.get('x-request-id')).toBe('lb-7f3a9c21');
    const refused = await fetch(`${baseUrl()}/api/health`, { headers: { 'x-request-id': 'x y\u00e9' } });
    expect(refused.headers.get('x-request-id')).not.toBe('x y\u00e9');
    const page = await engineer.fetch('/no-such-page');
    expect(page.status).toBe(404);
    expect(await page.text()).toContain(page.headers.get('x-request-id')!);
  });

  it('is ready when the database, storage and migrations are', async () => {
    const r = await new Client().json('/api/ready');
    expect(r.status).toBe(200);
    expect(r.body).toEqual({ ready: true, db: true, storage: true, migrations: 'current', draining: false });
  });

  it('serves metrics to this machine and to an admin token, not to a proxied caller or another role', async () => {
    const local = await fetch(`${baseUrl()}/api/metrics`);
    expect(local.status).toBe(200);
    expect(local.headers.get('content-type')).toMatch(/^text\/plain/);
    const text = await local.text();
    expect(text).toMatch(
      /hoopline_http_requests_total\{method="GET",route="\/api\/tests\/\[id\]\/series",status="200"\} \d+/,
    );
    expect(text).toMatch(
      /hoopline_http_request_duration_seconds_bucket\{le="0.1",method="GET",route="\/api\/ready"\} \d+/,
    );
    expect(text).toMatch(/hoopline_reduction_queue_jobs\{status="queued"\} \d+/);
    expect(text).toMatch(/hoopline_reduction_duration_seconds_count\{status="done"\} [1-9]\d*/);
    expect(text).toMatch(/hoopline_outbox_backlog_messages \d+/);
    expect(text).toMatch(/hoopline_active_users [1-9]/);

    const proxied = { 'x-forwarded-for': '203.0.113.9' };
    expect((await fetch(`${baseUrl()}/api/metrics`, { headers: proxied })).status).toBe(401);
    const engToken = (await engineer.json('/api/account/tokens', { method: 'POST', json: { name: 'scraper?' } })).body
      .token;
    const adminToken = (await admin.json('/api/account/tokens', { method: 'POST', json: { name: 'scraper' } })).body
      .token;
    const asEngineer = await Client.withToken(engToken).fetch('/api/metrics', { headers: proxied });
    expect(asEngineer.status).toBe(403);
    const asAdmin = await Client.withToken(adminToken).fetch('/api/metrics', { headers: proxied });
    expect(asAdmin.status).toBe(200);
    expect(await asAdmin.text()).toContain('hoopline_http_requests_in_flight');
  });
});
