// Live test mode against the real server (DESIGN 8): the chunk rules, the header check at the
// first chunk that holds the header, roles and token scopes, finish through the log service (the
// same SHA-256 and the same reduction as a one-shot upload), a server restarted mid-session,
// events served by another app server, replay after a reconnect, abandon, the share link, a
// graceful shutdown with open streams, and the push script fed at speed.
import { spawn, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { appendFileSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, signedIn } from './support/http';
import { startAppServer, startWorker, stopProcess, waitForHttp } from './support/processes';
import { smallLog, smallPlan, uploadLog, waitForReduction } from './support/reduced-test';
import { reviewedTest, signBody } from './support/journey';
import { readMails, waitForMail } from './support/mail';
import { SseReader } from './support/sse';
import { freePort } from '../fake-services/ports.mjs';

let engineer: Client;
let technician: Client;
let qa: Client;
let uploadToken: string;
let readToken: string;
let worker: ChildProcess;

const LOG = smallLog();
const sha = (text: string | Buffer) => createHash('sha256').update(text).digest('hex');

/** The log cut every `size` bytes: chunks end mid-line. */
function cut(text: string, size: number): Buffer[] {
  const bytes = Buffer.from(text);
  const out: Buffer[] = [];
  for (let i = 0; i < bytes.length; i += size) out.push(bytes.subarray(i, i + size));
  return out;
}

async function newTest(name: string): Promise<number> {
  const r = await engineer.json('/api/tests', { method: 'POST', json: { name, plan: smallPlan() } });
  expect(r.status).toBe(201);
  return r.body.id;
}

async function openSession(c: Client, testId: number): Promise<number> {
  const r = await c.json(`/api/tests/${testId}/live`, { method: 'POST' });
  expect(r.status, JSON.stringify(r.body)).toBe(201);
  return r.body.sessionId;
}

const putChunk = (c: Client, testId: number, sessionId: number, n: number, body: Buffer | string) =>
  c.json(`/api/tests/${testId}/live/${sessionId}/chunks/${n}`, {
    method: 'PUT',
    body: typeof body === 'string' ? body : new Uint8Array(body),
    headers: { 'content-type': 'text/csv' },
  });

async function sendAll(c: Client, testId: number, sessionId: number, chunks: Buffer[], from = 1) {
  for (let n = from; n <= chunks.length; n++) {
    const r = await putChunk(c, testId, sessionId, n, chunks[n - 1]!);
    expect(r.status, JSON.stringify(r.body)).toBe(201);
  }
}

const finish = (c: Client, testId: number, sessionId: number) =>
  c.json(`/api/tests/${testId}/live/${sessionId}/finish`, { method: 'POST' });

async function objectCount(prefix: string): Promise<number> {
  const { getS3 } = await import('../src/server/storage.server');
  const out = await getS3().send(new ListObjectsV2Command({ Bucket: inject('env').S3_BUCKET, Prefix: prefix }));
  return out.KeyCount ?? 0;
}

/** Open the test's event stream on `c` (from the start of its newest session unless `lastEventId`). */
async function events(c: Client, testId: number, init: { lastEventId?: string; query?: string } = {}) {
  const headers: Record<string, string> = { accept: 'text/event-stream', 'accept-encoding': 'br, gzip' };
  if (init.lastEventId) headers['last-event-id'] = init.lastEventId;
  const res = await c.fetch(`/api/tests/${testId}/live/events${init.query ?? ''}`, { headers });
  expect(res.status).toBe(200);
  expect(res.headers.get('content-type')).toMatch(/^text\/event-stream/);
  expect(res.headers.get('content-encoding')).toBeNull(); // never buffered for compression
  return new SseReader(res);
}

/** Every event of a session, read from the stream until `finished`. */
async function sessionEvents(c: Client, testId: number, sessionId: number) {
  const s = await events(c, testId, { query: `?lastEventId=${sessionId}.0` });
  await s.until((r) => r.events.some((e) => e.event === 'finished' && e.id?.startsWith(`${sessionId}.`)));
  await s.close();
  return s.events.filter((e) => e.id?.startsWith(`${sessionId}.`));
}

beforeAll(async () => {
  engineer = await signedIn('engineer@example.com');
  technician = await signedIn('technician@example.com');
  qa = await signedIn('qa@example.com');
  const up = await technician.json('/api/account/tokens', {
    method: 'POST',
    json: { name: 'daq', scopes: ['upload'] },
  });
  uploadToken = up.body.token;
  const rd = await technician.json('/api/account/tokens', { method: 'POST', json: { name: 'rd', scopes: ['read'] } });
  readToken = rd.body.token;
  worker = startWorker(inject('env'), 'w-live');
});

afterAll(async () => {
  await stopProcess(worker);
});

describe('chunk rules', () => {
  it('stores consecutive chunks, answers a repeat 200, other bytes or a gap 409 with the expected number', async () => {
    const testId = await newTest('live chunk rules');
    const sessionId = await openSession(technician, testId);
    const again = await technician.json(`/api/tests/${testId}/live`, { method: 'POST' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('live-session-open');
    expect(again.body.error.details.sessionId).toBe(sessionId);

    const chunks = cut(LOG, 1500);
    const first = await putChunk(technician, testId, sessionId, 1, chunks[0]!);
    expect(first.status).toBe(201);
    expect(first.body).toMatchObject({ n: 1, bytes: 1500 });
    expect(typeof first.body.rows).toBe('number');
    const repeat = await putChunk(technician, testId, sessionId, 1, chunks[0]!);
    expect(repeat.status).toBe(200);
    expect(repeat.body).toEqual(first.body);

    const other = await putChunk(technician, testId, sessionId, 1, chunks[1]!);
    expect(other.status).toBe(409);
    expect(other.body.error.code).toBe('chunk-conflict');
    expect(other.body.error.details.expected).toBe(2);
    const gap = await putChunk(technician, testId, sessionId, 3, chunks[2]!);
    expect(gap.status).toBe(409);
    expect(gap.body.error.code).toBe('chunk-gap');
    expect(gap.body.error.details.expected).toBe(2);

    expect((await putChunk(technician, testId, sessionId, 2, chunks[1]!)).status).toBe(201);
    expect(await objectCount(`tests/${testId}/live/${sessionId}/`)).toBe(2);
  });

  it('answers 422 naming line and column at the first chunk that holds a bad header, storing nothing', async () => {
    const testId = await newTest('live bad header');
    const sessionId = await openSession(technician, testId);
    const bad = 'unit,DAQ demo\noperator,night shift\n' + LOG.replace('SG2', 'SGX');
    const preamble = await putChunk(technician, testId, sessionId, 1, bad.slice(0, 20)); // no header yet
    expect(preamble.status).toBe(201);
    const r = await putChunk(technician, testId, sessionId, 2, bad.slice(20, 2000));
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('missing-column');
    expect(r.body.error.message).toContain("'SG2'");
    expect(r.body.error.details).toMatchObject({ line: 3, column: 'SG2' });
    expect(await objectCount(`tests/${testId}/live/${sessionId}/`)).toBe(1);
    // the session still expects chunk 2
    const gap = await putChunk(technician, testId, sessionId, 3, 'x');
    expect(gap.body.error.details.expected).toBe(2);
  });

  it('refuses a chunk over the limit with 413', async () => {
    const testId = await newTest('live big chunk');
    const sessionId = await openSession(technician, testId);
    const r = await putChunk(technician, testId, sessionId, 1, Buffer.alloc(9 * 1024 * 1024, 'a'));
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe('too-large');
  });

  it('holds roles and token scopes: QA and a read token may not write, an upload token may', async () => {
    const testId = await newTest('live roles');
    const byQa = await qa.json(`/api/tests/${testId}/live`, { method: 'POST' });
    expect(byQa.status).toBe(403);
    const byRead = await Client.withToken(readToken).json(`/api/tests/${testId}/live`, { method: 'POST' });
    expect(byRead.status).toBe(403);
    expect(byRead.body.error.code).toBe('token-scope');
    const token = Client.withToken(uploadToken);
    const sessionId = await openSession(token, testId);
    expect((await putChunk(token, testId, sessionId, 1, LOG.slice(0, 900))).status).toBe(201);
    expect((await putChunk(qa, testId, sessionId, 2, LOG.slice(900, 1800))).status).toBe(403);
    // reading the events needs the read scope
    const noRead = await token.fetch(`/api/tests/${testId}/live/events`);
    expect(noRead.status).toBe(403);
    await noRead.arrayBuffer();
  });

  it('abandons a session: its chunks are deleted, it takes no more, and a new one may open', async () => {
    const testId = await newTest('live abandon');
    const sessionId = await openSession(technician, testId);
    await sendAll(technician, testId, sessionId, cut(LOG, 4000).slice(0, 2));
    expect(await objectCount(`tests/${testId}/live/${sessionId}/`)).toBe(2);
    const del = await technician.fetch(`/api/tests/${testId}/live/${sessionId}`, { method: 'DELETE' });
    expect(del.status).toBe(204);
    expect(await objectCount(`tests/${testId}/live/${sessionId}/`)).toBe(0);
    const late = await putChunk(technician, testId, sessionId, 3, 'more');
    expect(late.status).toBe(409);
    expect(late.body.error.code).toBe('live-session-closed');
    expect((await finish(technician, testId, sessionId)).status).toBe(409);
    expect((await engineer.json(`/api/tests/${testId}/logs`)).body.items).toHaveLength(0);
    await openSession(technician, testId);
  });
});

describe('release', () => {
  it('refuses to release a test while a live session is open, and a session on a released test', async () => {
    const crew = { engineer, technician, qa };
    const { testId, reductionId } = await reviewedTest(crew, 'live release');
    const sessionId = await openSession(technician, testId);
    const refused = await qa.json(`/api/tests/${testId}/release`, { method: 'POST', json: signBody(reductionId) });
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatchObject({ code: 'live-session-open', details: { sessionId } });
    const del = await technician.fetch(`/api/tests/${testId}/live/${sessionId}`, { method: 'DELETE' });
    expect(del.status).toBe(204);
    const released = await qa.json(`/api/tests/${testId}/release`, { method: 'POST', json: signBody(reductionId) });
    expect(released.status).toBe(201);
    const again = await technician.json(`/api/tests/${testId}/live`, { method: 'POST' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('test-released');
  });
});

describe('finish', () => {
  let liveTest: number;
  let liveSession: number;

  it('gives the same SHA-256, the same log and the same reduction result as a one-shot upload', async () => {
    liveTest = await newTest('live finish');
    liveSession = await openSession(technician, liveTest);
    await sendAll(technician, liveTest, liveSession, cut(LOG, 1777));
    const done = await finish(technician, liveTest, liveSession);
    expect(done.status, JSON.stringify(done.body)).toBe(201);
    const logs = (await engineer.json(`/api/tests/${liveTest}/logs`)).body.items;
    expect(logs).toHaveLength(1);
    expect(logs[0].id).toBe(done.body.logId);
    expect(logs[0].sha256).toBe(sha(LOG));
    expect(await objectCount(`tests/${liveTest}/live/${liveSession}/`)).toBe(0); // the log holds the bytes now

    // again: the same answer; the same bytes uploaded at once: the existing log
    const twice = await finish(technician, liveTest, liveSession);
    expect(twice.status).toBe(200);
    expect(twice.body).toEqual(done.body);
    const same = await uploadLog(technician, liveTest, LOG);
    expect(same.status).toBe(200);
    expect(same.body.id).toBe(done.body.logId);

    const batchTest = await newTest('live finish, batch twin');
    const up = await uploadLog(technician, batchTest, LOG);
    expect(up.body.sha256).toBe(sha(LOG));
    const q = await technician.json(`/api/tests/${batchTest}/reductions`, { method: 'POST', json: {} });
    const [live, batch] = await Promise.all([
      waitForReduction(technician, done.body.reductionId),
      waitForReduction(technician, q.body.id),
    ]);
    expect(live.status).toBe('done');
    expect(batch.status).toBe('done');
    expect(live.result).toEqual(batch.result);
  });

  it('carries on after the app server restarts mid-session, with the same events and log', async () => {
    const testId = await newTest('live restart');
    const chunks = cut(LOG, 1777);
    const k = Math.floor(chunks.length / 2);
    let server = await startAppServer(inject('env'));
    const onFirst = await signedIn('technician@example.com', undefined, server.url);
    const sessionId = await openSession(onFirst, testId);
    for (let n = 1; n <= k; n++)
      expect((await putChunk(onFirst, testId, sessionId, n, chunks[n - 1]!)).status).toBe(201);
    await server.stop();
    server = await startAppServer(inject('env'));
    try {
      const onSecond = await signedIn('technician@example.com', undefined, server.url);
      await sendAll(onSecond, testId, sessionId, chunks, k + 1);
      expect((await finish(onSecond, testId, sessionId)).status).toBe(201);
    } finally {
      await server.stop();
    }
    const logs = (await engineer.json(`/api/tests/${testId}/logs`)).body.items;
    expect(logs[0].sha256).toBe(sha(LOG));
    // the events equal those of the uninterrupted session fed the same chunks
    const strip = (list: { event: string; data: string; id: string | null }[]) =>
      list.map((e) => ({
        event: e.event,
        ordinal: e.id?.split('.')[1],
        data: e.event === 'finished' ? null : JSON.parse(e.data),
      }));
    const restarted = strip(await sessionEvents(engineer, testId, sessionId));
    const straight = strip(await sessionEvents(engineer, liveTest, liveSession));
    expect(restarted.length).toBeGreaterThan(1);
    expect(restarted).toEqual(straight);
  });
});

describe('events', () => {
  it('serves a live test from another app server than the one taking the chunks', async () => {
    const testId = await newTest('live two servers');
    const other = await startAppServer(inject('env'));
    try {
      const watcher = await signedIn('engineer@example.com', undefined, other.url);
      const sessionId = await openSession(technician, testId);
      const stream = await events(watcher, testId);
      const chunks = cut(LOG, 2500);
      // a client retrying through the balancer: the same chunk to both servers at once is stored once
      const onOther = await signedIn('technician@example.com', undefined, other.url);
      const race = await Promise.all([
        putChunk(technician, testId, sessionId, 1, chunks[0]!),
        putChunk(onOther, testId, sessionId, 1, chunks[0]!),
      ]);
      expect(race.map((r) => r.status).sort()).toEqual([200, 201]);
      await sendAll(technician, testId, sessionId, chunks, 2);
      const done = await finish(technician, testId, sessionId);
      await stream.until((r) => r.events.some((e) => e.event === 'finished'));
      await stream.close();
      const ids = stream.events.map((e) => e.id);
      expect(ids).toEqual(stream.events.map((_, i) => `${sessionId}.${i + 1}`)); // every ordinal once, in order
      expect(stream.events.some((e) => e.event === 'status')).toBe(true);
      expect(JSON.parse(stream.events.at(-1)!.data)).toMatchObject({ reductionId: done.body.reductionId });
    } finally {
      await other.stop();
    }
  });

  it('lets one of two servers win a race for a chunk number with other bytes', async () => {
    const testId = await newTest('live chunk race');
    const other = await startAppServer(inject('env'));
    try {
      const onOther = await signedIn('technician@example.com', undefined, other.url);
      const sessionId = await openSession(technician, testId);
      const mine = LOG.slice(0, 3000);
      const theirs = LOG.slice(0, 3000).replace(/\n0\.500,/, '\n0.501,');
      expect(theirs).not.toBe(mine);
      const race = await Promise.all([
        putChunk(technician, testId, sessionId, 1, mine),
        putChunk(onOther, testId, sessionId, 1, theirs),
      ]);
      expect(race.map((r) => r.status).sort()).toEqual([201, 409]);
      const loser = race.find((r) => r.status === 409)!;
      expect(loser.body.error).toMatchObject({ code: 'chunk-conflict', details: { expected: 2 } });
      // whichever won, both servers now agree on chunk 1 and go on from chunk 2
      const winner = race[0].status === 201 ? mine : theirs;
      expect((await putChunk(onOther, testId, sessionId, 1, winner)).status).toBe(200);
      expect((await putChunk(technician, testId, sessionId, 1, winner)).status).toBe(200);
      expect((await putChunk(onOther, testId, sessionId, 2, LOG.slice(3000, 6000))).status).toBe(201);
      expect((await putChunk(technician, testId, sessionId, 3, LOG.slice(6000))).status).toBe(201);
      // two finishes at once: one log, and both answers name the same log and reduction
      const finishes = await Promise.all([finish(technician, testId, sessionId), finish(onOther, testId, sessionId)]);
      expect(finishes.map((f) => f.status).sort()).toEqual([200, 201]);
      expect(finishes[0].body).toEqual(finishes[1].body);
      expect((await engineer.json(`/api/tests/${testId}/logs`)).body.items).toHaveLength(1);
    } finally {
      await other.stop();
    }
  });

  it('replays what was missed after a reconnect with Last-Event-ID, or ?lastEventId=', async () => {
    const testId = await newTest('live replay');
    const sessionId = await openSession(technician, testId);
    await sendAll(technician, testId, sessionId, cut(LOG, 3000));
    await finish(technician, testId, sessionId);
    const all = await sessionEvents(technician, testId, sessionId);
    expect(all.length).toBeGreaterThanOrEqual(4);
    const fromStart = await events(technician, testId); // no id: the newest session from its start
    await fromStart.until((r) => r.events.length >= all.length);
    await fromStart.close();
    expect(fromStart.events).toEqual(all);

    const resumed = await events(technician, testId, { lastEventId: all[1]!.id! });
    await resumed.until((r) => r.events.length >= all.length - 2);
    await resumed.close();
    expect(resumed.events).toEqual(all.slice(2));
    const polyfill = await events(technician, testId, { query: `?lastEventId=${all.at(-2)!.id}` });
    await polyfill.until((r) => r.events.length >= 1);
    await polyfill.close();
    expect(polyfill.events).toEqual(all.slice(-1));
  });

  it('e-mails each warning once per gauge and code to the engineer of the test, with the caution', async () => {
    const name = 'live warning mail';
    const testId = await newTest(name);
    const sessionId = await openSession(technician, testId);
    // every chunk sent to two servers at once: both derive the same warning, one e-mail goes out
    const other = await startAppServer(inject('env'));
    try {
      const onOther = await signedIn('technician@example.com', undefined, other.url);
      const chunks = cut(LOG, 1200);
      for (let n = 1; n <= chunks.length; n++) {
        const both = await Promise.all([
          putChunk(technician, testId, sessionId, n, chunks[n - 1]!),
          putChunk(onOther, testId, sessionId, n, chunks[n - 1]!),
        ]);
        expect(both.map((r) => r.status).sort()).toEqual([200, 201]);
      }
    } finally {
      await other.stop();
    }
    await finish(technician, testId, sessionId);
    const all = await sessionEvents(engineer, testId, sessionId);
    // H2 reads 15 % low (smallLog): its trend leaves the ±10 % band from the second loading hold
    const warnings = all.filter((e) => e.event === 'warning').map((e) => JSON.parse(e.data));
    expect(warnings.some((w) => w.gaugeId === 'H2' && w.code === 'trend-outside-band')).toBe(true);
    const mail = await waitForMail(
      inject('mailDir'),
      (m) => m.subject.includes(name) && m.subject.includes('H2') && m.subject.includes('trend-outside-band'),
    );
    expect(mail.to).toContain('engineer@example.com');
    expect(mail.text).toContain(`/tests/${testId}/logs`);
    expect(mail.text).toMatch(/test director decides whether to hold or depressurise/);
    expect(mail.text).toMatch(/at 1(\.\d+)? MPa/);
    await new Promise((r) => setTimeout(r, 1500)); // let any second message arrive, were there one
    const mails = (await readMails(inject('mailDir'))).filter(
      (m) => m.subject.startsWith('Live warning') && m.subject.includes(name),
    );
    const kinds = mails.map((m) => m.subject.replace(/^.*gauge /, ''));
    expect(new Set(kinds).size).toBe(kinds.length); // never twice for one gauge and code
    const distinct = new Set(warnings.map((w) => `${w.gaugeId} (${w.code})`));
    expect(kinds.sort()).toEqual([...distinct].sort());
  });

  it('serves the share link, and 410 once it is revoked', async () => {
    const testId = await newTest('live share');
    const sessionId = await openSession(technician, testId);
    await sendAll(technician, testId, sessionId, cut(LOG, 5000).slice(0, 2));
    const link = await qa.json(`/api/tests/${testId}/share-links`, { method: 'POST', json: {} });
    const token = link.body.url.split('/share/')[1];
    const anon = new Client();
    const res = await anon.fetch(`/api/share/${token}/live/events`);
    expect(res.status).toBe(200);
    const s = new SseReader(res);
    await s.until((r) => r.events.length >= 1);
    await s.close();
    expect(s.events[0]!.id).toBe(`${sessionId}.1`);
    expect((await qa.fetch(`/api/share-links/${link.body.id}`, { method: 'DELETE' })).status).toBeLessThan(300);
    const gone = await anon.json(`/api/share/${token}/live/events`);
    expect(gone.status).toBe(410);
  });

  it('ends the server side of a stream when the client goes away', async () => {
    const testId = await newTest('live disconnect');
    const openStreams = async () => {
      const text = await (await fetch(`${inject('baseUrl')}/api/metrics`)).text();
      return Number(/^hoopline_live_event_streams (\d+)$/m.exec(text)?.[1] ?? NaN);
    };
    const before = await openStreams();
    const streams = await Promise.all([events(engineer, testId), events(technician, testId)]);
    expect(await openStreams()).toBe(before + 2);
    await Promise.all(streams.map((s) => s.close()));
    const deadline = Date.now() + 5000;
    while ((await openStreams()) !== before && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
    expect(await openStreams()).toBe(before);
  });

  it('sends heartbeats and ends open streams at once on a graceful shutdown', async () => {
    const testId = await newTest('live shutdown');
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    const child = spawn(process.execPath, ['scripts/serve.mjs'], {
      env: { ...process.env, ...inject('env'), HOST: '127.0.0.1', PORT: String(port), LIVE_HEARTBEAT_SECONDS: '1' },
      stdio: ['ignore', 'ignore', 'inherit'],
    });
    const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
    try {
      await waitForHttp(`${url}/api/health`, 30_000);
      const watcher = await signedIn('engineer@example.com', undefined, url);
      const stream = await events(watcher, testId);
      await stream.until((r) => r.comments.includes('heartbeat'), 5000);
      const metrics = await (await fetch(`${url}/api/metrics`)).text();
      expect(metrics).toMatch(/^hoopline_live_event_streams 1$/m);
      const asked = Date.now();
      child.kill('SIGTERM');
      await stream.finished;
      expect(await exited).toBe(0);
      expect(Date.now() - asked).toBeLessThan(5000); // not the 25 s grace period
    } finally {
      await stopProcess(child);
    }
  });
});

describe('the push script against the real server', () => {
  it('sends a log that grows at speed, finishes when it goes idle, and the log has its SHA-256', async () => {
    const testId = await newTest('live push script');
    const dir = mkdtempSync(path.join(tmpdir(), 'hoopline-live-'));
    const file = path.join(dir, 'run.csv');
    try {
      writeFileSync(file, '');
      const child = spawn(
        process.execPath,
        [
          'scripts/hoopline-push.mjs',
          '--url',
          inject('baseUrl'),
          '--test',
          String(testId),
          '--file',
          file,
          '--interval',
          '0.05',
          '--idle',
          '1.5',
          '--max-chunk',
          '2048',
        ],
        { env: { ...process.env, HOOPLINE_TOKEN: uploadToken } },
      );
      let out = '';
      let err = '';
      child.stdout.on('data', (d) => (out += d));
      child.stderr.on('data', (d) => (err += d));
      const code = new Promise<number | null>((resolve) => child.on('close', resolve));
      for (const piece of cut(LOG, 3100)) {
        appendFileSync(file, piece);
        await new Promise((r) => setTimeout(r, 20));
      }
      expect(await code, err).toBe(0);
      const m = /finished: log (\d+), reduction (\d+) queued/.exec(out);
      expect(m, out).not.toBeNull();
      const logs = (await engineer.json(`/api/tests/${testId}/logs`)).body.items;
      expect(logs).toHaveLength(1);
      expect(logs[0].id).toBe(Number(m![1]));
      expect(logs[0].sha256).toBe(sha(LOG));
      expect((await waitForReduction(technician, Number(m![2]))).status).toBe('done');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
