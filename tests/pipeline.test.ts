// Data pipeline over HTTP as the roles would use it: plans, uploads to the S3 fake, the
// reduction queue with real worker processes, results and the decimated series.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import { createHash } from 'node:crypto';
import { ListObjectsV2Command } from '@aws-sdk/client-s3';
import { eq, sql } from 'drizzle-orm';
import type { ChildProcess } from 'node:child_process';
import { Client, signedIn } from './support/http';
import { lameOuterStrainPerMPa, makeHydrotestCsv, writeHydrotestCsv } from './support/hydrotest-log';
import { startWorker, stopProcess } from './support/processes';
import { decodeSeries } from '../src/lib/series-encoding';

const geometry = { insideDiameter: 1000, wallThickness: 10, E: 200_000, nu: 0.3, testPressure: 2 };

const plan = {
  units: 'SI',
  vessel: { shape: 'cylinder', ends: 'closed', insideDiameter: 1000, wallThickness: 10, length: 4000 },
  material: { name: 'pipeline-test steel', elasticModulus: 200_000, poissonRatio: 0.3, yieldStrength: 260 },
  model: 'lame',
  testPressure: 2,
  columns: { time: 'time_s', pressure: 'P [MPa]' },
  gauges: [
    {
      id: 'H1',
      kind: 'uniaxial',
      channels: ['SG1'],
      angleDeg: 90,
      gaugeFactor: 2,
      instrumentGaugeFactor: 2,
      transverseSensitivity: 0,
      distanceToDiscontinuity: 1500,
    },
    {
      id: 'A1',
      kind: 'uniaxial',
      channels: ['SG2'],
      angleDeg: 0,
      gaugeFactor: 2,
      instrumentGaugeFactor: 2,
      transverseSensitivity: 0,
      distanceToDiscontinuity: 1500,
    },
    {
      id: 'H2',
      kind: 'uniaxial',
      channels: ['SG3'],
      angleDeg: 90,
      gaugeFactor: 2,
      instrumentGaugeFactor: 2,
      transverseSensitivity: 0,
      distanceToDiscontinuity: 1500,
    },
  ],
  // an extra field the engine does not know: the plan must round-trip exactly anyway
  remarks: 'invented integration-test vessel',
};

const channels = [
  { name: 'SG1', angleDeg: 90 },
  { name: 'SG2', angleDeg: 0 },
  { name: 'SG3', angleDeg: 90, scale: 0.85 }, // reads 15 % low
];
const smallLog = makeHydrotestCsv({ ...geometry, channels });

let engineer: Client;
let technician: Client;
let techToken: string;
const workers: ChildProcess[] = [];

async function db() {
  const { getDb } = await import('../src/db/client.server');
  return getDb();
}

async function createTest(name: string, p: unknown = plan): Promise<number> {
  const r = await engineer.json('/api/tests', { method: 'POST', json: { name, plan: p } });
  expect(r.status).toBe(201);
  return r.body.id;
}

function upload(client: Client, testId: number, body: string | Buffer | ReadableStream, filename = 'log.csv') {
  const form = new FormData();
  form.append('file', new Blob([body as BlobPart], { type: 'text/csv' }), filename);
  return client.json(`/api/tests/${testId}/logs`, { method: 'POST', body: form });
}

async function waitForReduction(id: number, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const r = await engineer.json(`/api/reductions/${id}`);
    if (r.body.status === 'done' || r.body.status === 'failed') return r.body;
    if (Date.now() > deadline) throw new Error(`reduction ${id} still ${r.body.status} after ${timeoutMs} ms`);
    await new Promise((res) => setTimeout(res, 100));
  }
}

async function objectCount(prefix: string): Promise<number> {
  const { getS3 } = await import('../src/server/storage.server');
  const out = await getS3().send(new ListObjectsV2Command({ Bucket: inject('env').S3_BUCKET, Prefix: prefix }));
  return out.KeyCount ?? 0;
}

beforeAll(async () => {
  engineer = await signedIn('engineer@example.com');
  technician = await signedIn('technician@example.com');
  const t = await technician.json('/api/account/tokens', { method: 'POST', json: { name: 'daq pc' } });
  techToken = t.body.token;
});

afterAll(async () => {
  await Promise.all(workers.map((w) => stopProcess(w)));
});

describe('tests and plans', () => {
  it('creates a test from a plan (engineer) and refuses technicians and anonymous callers', async () => {
    const id = await createTest('Plan round trip');
    expect((await technician.json('/api/tests', { method: 'POST', json: { name: 'x', plan } })).status).toBe(403);
    expect((await new Client().json('/api/tests', { method: 'POST', json: { name: 'x', plan } })).status).toBe(401);
    const t = await technician.json(`/api/tests/${id}`);
    expect(t.status).toBe(200);
    expect(t.body.status).toBe('draft');
    expect(t.body.vessel.insideDiameterMm).toBe(1000);
    expect(t.body.material.name).toBe('pipeline-test steel');
  });

  it('round-trips the plan exactly through GET and PUT, and lists every problem of a bad one', async () => {
    const id = await createTest('Plan PUT');
    const got = await engineer.fetch(`/api/tests/${id}/plan`).then((r) => r.text());
    expect(got).toBe(JSON.stringify(plan));
    const changed = { ...plan, testPressure: 2.2, gauges: plan.gauges.slice(0, 2) };
    expect((await engineer.json(`/api/tests/${id}/plan`, { method: 'PUT', json: changed })).status).toBe(200);
    expect(await engineer.fetch(`/api/tests/${id}/plan`).then((r) => r.text())).toBe(JSON.stringify(changed));
    // technician may not edit a plan
    expect((await technician.json(`/api/tests/${id}/plan`, { method: 'PUT', json: changed })).status).toBe(403);
    const bad = {
      ...plan,
      vessel: { ...plan.vessel, wallThickness: -3 },
      material: { ...plan.material, poissonRatio: 0.7 },
    };
    const r = await engineer.json(`/api/tests/${id}/plan`, { method: 'PUT', json: bad });
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('invalid-plan');
    const paths = r.body.error.details.issues.map((i: { path: string }) => i.path);
    expect(paths).toEqual(expect.arrayContaining(['vessel.wallThickness', 'material.poissonRatio']));
    // the stored plan is untouched
    expect(await engineer.fetch(`/api/tests/${id}/plan`).then((r) => r.text())).toBe(JSON.stringify(changed));
  });

  it('refuses a gauge id over 60 characters or outside the safe set with a 422, creating nothing', async () => {
    const before = (await engineer.json('/api/tests?limit=1')).body.total;
    for (const id of ['H'.repeat(61), '=1+2', '@SUM(A1)']) {
      const bad = { ...plan, gauges: [{ ...plan.gauges[0], id }] };
      const r = await engineer.json('/api/tests', {
        method: 'POST',
        json: { name: `bad id ${id.slice(0, 5)}`, plan: bad },
      });
      expect(r.status).toBe(422);
      expect(r.body.error.code).toBe('invalid-plan');
      expect(r.body.error.details.issues[0].path).toBe('gauges[0].id');
    }
    expect((await engineer.json('/api/tests?limit=1')).body.total).toBe(before);
  });

  it('pages lists and answers 404 for an unknown test', async () => {
    const r = await engineer.json('/api/tests?limit=1&offset=0');
    expect(r.status).toBe(200);
    expect(r.body.items).toHaveLength(1);
    expect(r.body.total).toBeGreaterThanOrEqual(2);
    expect((await engineer.json('/api/tests/999999')).status).toBe(404);
    expect((await engineer.json('/api/tests?limit=5000')).status).toBe(400);
  });
});

describe('log upload', () => {
  let testId: number;
  beforeAll(async () => {
    testId = await createTest('Upload checks');
  });

  it('takes a multipart upload with an API token, records sha256 and rows, and returns the same log for the same bytes', async () => {
    const viaToken = Client.withToken(techToken);
    const first = await upload(viaToken, testId, smallLog);
    expect(first.status).toBe(201);
    expect(first.body.sha256).toBe(createHash('sha256').update(smallLog).digest('hex'));
    expect(first.body.rows).toBe(smallLog.trim().split('\n').length - 1);
    expect(first.body.timeStart).toBe(0);
    const again = await upload(viaToken, testId, smallLog);
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(first.body.id);
    expect(await objectCount(`tests/${testId}/logs/`)).toBe(1);
    const t = await engineer.json(`/api/tests/${testId}`);
    expect(t.body.status).toBe('logging');
  });

  it('takes a raw text/csv body too', async () => {
    const other = smallLog.replace('time_s,', 'time_s,').concat('\n');
    const r = await technician.json(`/api/tests/${testId}/logs`, {
      method: 'POST',
      body: other,
      headers: { 'content-type': 'text/csv' },
    });
    expect(r.status).toBe(201);
  });

  it('answers 422 for garbage and for a missing column, leaving nothing behind', async () => {
    const before = await objectCount(`tests/${testId}/logs/`);
    const logsBefore = (await engineer.json(`/api/tests/${testId}/logs`)).body.items.length;
    const garbage = await upload(technician, testId, Buffer.from([0, 159, 146, 150, 0, 1, 2, 3, 255, 254]));
    expect(garbage.status).toBe(422);
    expect(garbage.body.error.code).toBe('not-delimited-text');
    const missing = await upload(technician, testId, smallLog.replace('SG2', 'SGX'));
    expect(missing.status).toBe(422);
    expect(missing.body.error.code).toBe('missing-column');
    expect(missing.body.error.message).toContain("'SG2'");
    expect(missing.body.error.details.line).toBe(1);
    expect(await objectCount(`tests/${testId}/logs/`)).toBe(before);
    expect((await engineer.json(`/api/tests/${testId}/logs`)).body.items.length).toBe(logsBefore);
  });

  it('answers 413 past the size limit, leaving nothing behind', async () => {
    const before = await objectCount(`tests/${testId}/logs/`);
    const lines: string[] = [];
    writeHydrotestCsv({ ...geometry, channels, rateHz: 50, holdSeconds: 600 }, (l) => lines.push(l));
    let text = lines.join('\n');
    while (text.length < 50 * 1024 * 1024) text += '\n' + lines.slice(1, 200_000).join('\n');
    const r = await upload(technician, testId, text);
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe('too-large');
    expect(await objectCount(`tests/${testId}/logs/`)).toBe(before);
  });
});

describe('reductions', () => {
  let testId: number;
  beforeAll(async () => {
    workers.push(startWorker(inject('env'), 'w-main'));
    testId = await createTest('Reduce with known truth');
    expect((await upload(Client.withToken(techToken), testId, smallLog)).status).toBe(201);
  });

  it('refuses a reduction before any log, and queues one after (technician)', async () => {
    const empty = await createTest('No logs yet');
    expect((await technician.json(`/api/tests/${empty}/reductions`, { method: 'POST', json: {} })).status).toBe(409);
    const q = await technician.json(`/api/tests/${testId}/reductions`, { method: 'POST', json: {} });
    expect(q.status).toBe(202);
    const done = await waitForReduction(q.body.id);
    expect(done.status).toBe('done');
    const result = done.result;
    const per = lameOuterStrainPerMPa(geometry);
    const h1 = result.gauges.find((g: { id: string }) => g.id === 'H1');
    const a1 = result.gauges.find((g: { id: string }) => g.id === 'A1');
    const h2 = result.gauges.find((g: { id: string }) => g.id === 'H2');
    expect(h1.measuredSlope).toBeCloseTo(per.hoop, 0);
    expect(h1.predictedSlope).toBeCloseTo(per.hoop, 3);
    expect(a1.measuredSlope).toBeCloseTo(per.axial, 0);
    expect(h1.outcome).toBe('in-band');
    expect(h2.ratio).toBeCloseTo(0.85, 2);
    expect(h2.flags).toContain('outside-band');
    expect(result.verdict).toBe('flagged');
    const t = await engineer.json(`/api/tests/${testId}`);
    expect(t.body.status).toBe('reduced');
    expect(t.body.flaggedCount).toBe(1);
    expect(t.body.currentReduction.id).toBe(q.body.id);
  });

  it('supersedes the previous reduction with a new one, keeping the old results', async () => {
    const first = (await engineer.json(`/api/tests/${testId}/reductions`)).body.items[0].id;
    const q = await technician.json(`/api/tests/${testId}/reductions`, { method: 'POST', json: {} });
    await waitForReduction(q.body.id);
    const old = await engineer.json(`/api/reductions/${first}`);
    expect(old.body.superseded).toBe(true);
    expect(old.body.result.gauges.length).toBe(3);
    const current = await engineer.json(`/api/reductions/${q.body.id}`);
    expect(current.body.superseded).toBe(false);
  });

  it('serves a decimated series that keeps spikes and stays well under 1 MB for a large log', async () => {
    const big = await createTest('Large log series');
    const lines: string[] = [];
    const spiky = [...channels, { name: 'SG4', angleDeg: 90, spikeAtSecond: 1234 }];
    const p = { ...plan, gauges: [...plan.gauges, { ...plan.gauges[0], id: 'H3', channels: ['SG4'] }] };
    expect((await engineer.json(`/api/tests/${big}/plan`, { method: 'PUT', json: p })).status).toBe(200);
    writeHydrotestCsv({ ...geometry, channels: spiky, rateHz: 100, holdSeconds: 300, rampSeconds: 60 }, (l) =>
      lines.push(l),
    );
    expect(lines.length).toBeGreaterThan(200_000);
    expect((await upload(technician, big, lines.join('\n'))).status).toBe(201);
    const q = await technician.json(`/api/tests/${big}/reductions`, { method: 'POST', json: {} });
    expect((await waitForReduction(q.body.id)).status).toBe('done');
    const res = await engineer.fetch(`/api/tests/${big}/series?points=2000`);
    const text = await res.text();
    expect(res.status).toBe(200);
    expect(text.length).toBeLessThan(1024 * 1024);
    const s = decodeSeries(JSON.parse(text));
    expect(s.reductionId).toBe(q.body.id);
    expect(s.t.length).toBeLessThanOrEqual(2000);
    expect(s.channels[0]).toBe('pressure');
    expect(Math.max(...(s.max.SG4 as number[]))).toBeGreaterThan(5000);
    const zoom = decodeSeries((await engineer.json(`/api/tests/${big}/series?from=1200&to=1300&points=500`)).body);
    expect(zoom.t[0]).toBeGreaterThanOrEqual(1199);
    expect(zoom.t.at(-1)).toBeLessThanOrEqual(1300);
    expect((await engineer.json(`/api/tests/${big}/series?from=10&to=5`)).status).toBe(400);
  });
});

describe('the queue', () => {
  it('shares 20 jobs between two workers, each done exactly once', async () => {
    await Promise.all(workers.splice(0).map((w) => stopProcess(w)));
    const id = await createTest('Twenty jobs');
    expect((await upload(technician, id, smallLog)).status).toBe(201);
    const ids: number[] = [];
    for (let i = 0; i < 20; i++)
      ids.push((await technician.json(`/api/tests/${id}/reductions`, { method: 'POST', json: {} })).body.id);
    workers.push(startWorker(inject('env'), 'w-a'), startWorker(inject('env'), 'w-b'));
    for (const r of ids) expect((await waitForReduction(r)).status).toBe('done');
    const { auditEvents, reductions } = await import('../src/db/schema');
    const d = await db();
    const events = await d.select().from(auditEvents).where(eq(auditEvents.action, 'reduction-done'));
    for (const r of ids)
      expect(events.filter((e) => (e.details as { reductionId: number }).reductionId === r)).toHaveLength(1);
    const rows = await d
      .select({ id: reductions.id, attempts: reductions.attempts })
      .from(reductions)
      .where(sql`${reductions.id} in (${sql.join(ids, sql`, `)})`);
    expect(rows.filter((r) => r.attempts !== 1)).toEqual([]);
    const byWorker = new Set(
      events
        .filter((e) => ids.includes((e.details as { reductionId: number }).reductionId))
        .map((e) => (e.details as { worker: string }).worker),
    );
    expect([...byWorker].every((w) => w === 'w-a' || w === 'w-b')).toBe(true);
    // exactly one reduction of the test is current; the other nineteen are superseded
    const current = await d
      .select({ n: sql<number>`count(*)` })
      .from(reductions)
      .where(sql`${reductions.testId} = ${id} and ${reductions.superseded} = false`);
    expect(Number(current[0]!.n)).toBe(1);
  });

  it('finishes a job whose worker was killed mid-job, after the lease runs out', async () => {
    await Promise.all(workers.splice(0).map((w) => stopProcess(w)));
    const id = await createTest('Killed worker');
    const lines: string[] = [];
    writeHydrotestCsv({ ...geometry, channels, rateHz: 200, holdSeconds: 300, rampSeconds: 60 }, (l) => lines.push(l));
    expect((await upload(technician, id, lines.join('\n'))).status).toBe(201);
    const q = await technician.json(`/api/tests/${id}/reductions`, { method: 'POST', json: {} });
    const doomed = startWorker(inject('env'), 'w-doomed');
    const deadline = Date.now() + 20_000;
    for (;;) {
      const r = await engineer.json(`/api/reductions/${q.body.id}`);
      if (r.body.status === 'running') break;
      if (r.body.status === 'done')
        throw new Error('the job finished before the worker could be killed; make the log larger');
      if (Date.now() > deadline) throw new Error('the job never started');
      await new Promise((res) => setTimeout(res, 20));
    }
    await stopProcess(doomed, 'SIGKILL');
    const rescuer = startWorker(inject('env'), 'w-rescue');
    workers.push(rescuer);
    const done = await waitForReduction(q.body.id, 60_000);
    expect(done.status).toBe('done');
    expect(done.attempts).toBe(2);
    const { auditEvents } = await import('../src/db/schema');
    const events = await (await db()).select().from(auditEvents).where(eq(auditEvents.action, 'reduction-done'));
    const mine = events.filter((e) => (e.details as { reductionId: number }).reductionId === q.body.id);
    expect(mine).toHaveLength(1);
    expect((mine[0]!.details as { worker: string }).worker).toBe('w-rescue');
  });
});
