// Scale drill (npm run test:scale): two app servers and two workers on one private MariaDB and
// one object store, as behind a load balancer. Sessions, share links and the sign-in throttle
// work across servers; twenty jobs run once each; SIGTERM on a server finishes the request in
// flight; SIGTERM on a busy worker hands its job to the other worker at once; every log line is
// JSON and none holds a secret.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import http from 'node:http';
import { sql } from 'drizzle-orm';
import { startStack, type AppServer, type Stack } from '../../scripts/stack';
import { HttpClient } from '../support/http-client';
import { smallLog, smallPlan, uploadLog, waitForReduction } from '../support/reduced-test';

let stack: Stack;
let a: AppServer, b: AppServer;
const secrets: string[] = [];

async function signedInOn(server: AppServer, email: string): Promise<HttpClient> {
  const c = new HttpClient(server.url);
  if (!(await c.signIn(email, stack.password))) throw new Error(`could not sign in as ${email} on ${server.name}`);
  return c;
}

async function db() {
  const { getDb } = await import('../../src/db/client.server');
  return getDb();
}

async function rows<T>(query: ReturnType<typeof sql>): Promise<T[]> {
  const [r] = (await (await db()).execute(query)) as unknown as [T[]];
  return r;
}

beforeAll(async () => {
  // a long lease, so a job handed back is told apart from one whose lease ran out
  stack = await startStack({ servers: 2, workers: 2, env: { WORKER_LEASE_SECONDS: '60', WORKER_POLL_MS: '100' } });
  [a, b] = stack.servers as [AppServer, AppServer];
  secrets.push(stack.password, stack.env.AUTH_SECRET!);
}, 300_000);

afterAll(async () => {
  const { closeDb } = await import('../../src/db/client.server');
  await closeDb();
  await stack?.stop();
}, 120_000);

describe('two app servers', () => {
  it('are both ready', async () => {
    for (const s of [a, b]) expect((await fetch(`${s.url}/api/ready`)).status).toBe(200);
  });

  it('accept a session made on the other one', async () => {
    const onA = await signedInOn(a, 'engineer@example.com');
    secrets.push(
      ...onA
        .cookieHeader()
        .split('; ')
        .map((c) => c.split('=').slice(1).join('=')),
    );
    const onB = onA.on(b.url);
    expect((await onB.json('/api/tests')).status).toBe(200);
    const page = await onB.fetch('/');
    expect(page.status).toBe(200);
  });

  it('open a share link made on the other one', async () => {
    const engineer = await signedInOn(a, 'engineer@example.com');
    const qa = await signedInOn(a, 'qa@example.com');
    const made = await engineer.json('/api/tests', {
      method: 'POST',
      json: { name: 'Shared across', plan: smallPlan() },
    });
    const link = await qa.json(`/api/tests/${made.body.id}/share-links`, { method: 'POST', json: {} });
    expect(link.status).toBe(201);
    const token: string = link.body.url.split('/share/')[1];
    secrets.push(token);
    const inspector = new HttpClient(b.url);
    const record = await inspector.json(`/api/share/${token}`);
    expect(record.status).toBe(200);
    expect((await inspector.fetch(`/share/${token}`)).status).toBe(200);
  });

  // an account no other check in this file signs in with: the lock holds it for the rest of the run
  it('count failed sign-ins for one e-mail across both (the throttle lives in MariaDB)', async () => {
    const email = 'admin@example.com';
    for (const [server, n] of [
      [a, 3],
      [b, 2],
    ] as const)
      for (let i = 0; i < n; i++)
        expect(await new HttpClient(server.url).signIn(email, 'wrong-password-x')).toBe(false);
    // five failures in all: the sixth attempt waits, even with the right password, on either server
    expect(await new HttpClient(b.url).signIn(email, stack.password)).toBe(false);
  });
});

describe('two workers', () => {
  it('run twenty jobs once each', async () => {
    const engineer = await signedInOn(a, 'engineer@example.com');
    const technician = await signedInOn(b, 'technician@example.com');
    const ids: number[] = [];
    for (let t = 0; t < 4; t++) {
      const made = await engineer.json('/api/tests', {
        method: 'POST',
        json: { name: `Queue ${t}`, plan: smallPlan() },
      });
      expect((await uploadLog(technician, made.body.id, smallLog())).status).toBe(201);
      for (let j = 0; j < 5; j++) {
        const via = (t + j) % 2 ? technician : technician.on(a.url);
        const q = await via.json(`/api/tests/${made.body.id}/reductions`, { method: 'POST', json: {} });
        expect(q.status).toBe(202);
        ids.push(q.body.id);
      }
    }
    for (const id of ids) expect((await waitForReduction(engineer, id, 120_000)).status).toBe('done');
    const done = await rows<{ rid: number; n: number; worker: string }>(
      sql`select json_value(details, '$.reductionId') as rid, count(*) as n, min(json_value(details, '$.worker')) as worker
          from audit_events where action = 'reduction-done' group by rid`,
    );
    const mine = done.filter((r) => ids.includes(Number(r.rid)));
    expect(mine).toHaveLength(20);
    expect(mine.every((r) => Number(r.n) === 1)).toBe(true);
    expect(new Set(mine.map((r) => r.worker))).toEqual(new Set(['worker-1', 'worker-2']));
    const attempts = await rows<{ attempts: number }>(
      sql`select attempts from reductions where id in (${sql.join(
        ids.map((i) => sql`${i}`),
        sql`, `,
      )})`,
    );
    expect(attempts.every((r) => Number(r.attempts) === 1)).toBe(true);
  }, 180_000);

  it('hand a job back at once on SIGTERM, and the other worker finishes it', async () => {
    const engineer = await signedInOn(a, 'engineer@example.com');
    const technician = await signedInOn(a, 'technician@example.com');
    const made = await engineer.json('/api/tests', { method: 'POST', json: { name: 'Long job', plan: smallPlan() } });
    expect((await uploadLog(technician, made.body.id, smallLog({ rateHz: 400, holdSeconds: 150 }))).status).toBe(201);
    const q = await technician.json(`/api/tests/${made.body.id}/reductions`, { method: 'POST', json: {} });
    let owner: string | null = null;
    for (let i = 0; i < 300 && !owner; i++) {
      const [r] = await rows<{ lease_owner: string | null }>(
        sql`select lease_owner from reductions where id = ${q.body.id}`,
      );
      owner = r?.lease_owner ?? null;
      if (!owner) await new Promise((res) => setTimeout(res, 20));
    }
    expect(owner).toMatch(/^worker-[12]$/);
    const busy = stack.workers.find((w) => w.name === owner)!;
    const other = owner === 'worker-1' ? 'worker-2' : 'worker-1';
    const t0 = Date.now();
    busy.child.kill('SIGTERM');
    expect(await busy.exited).toBe(0);
    const finished = await waitForReduction(engineer, q.body.id, 60_000);
    expect(finished.status).toBe('done');
    expect(Date.now() - t0).toBeLessThan(30_000); // well inside the 60 s lease
    expect(finished.attempts).toBe(1);
    const [audit] = await rows<{ worker: string }>(
      sql`select json_value(details, '$.worker') as worker from audit_events
          where action = 'reduction-done' and json_value(details, '$.reductionId') = ${q.body.id}`,
    );
    expect(audit?.worker).toBe(other);
    expect(busy.lines.some((l) => l.includes('handed the job back'))).toBe(true);
  }, 120_000);
});

describe('a server told to stop', () => {
  it('finishes the request in flight, takes no new connection, and exits 0', async () => {
    const c = await stack.startServer('web-3');
    const technician = await signedInOn(c, 'technician@example.com');
    const token: string = (await technician.json('/api/account/tokens', { method: 'POST', json: { name: 'drill' } }))
      .body.token;
    secrets.push(token);
    const engineer = await signedInOn(c, 'engineer@example.com');
    const made = await engineer.json('/api/tests', { method: 'POST', json: { name: 'In flight', plan: smallPlan() } });
    const body = Buffer.from(smallLog());
    // a slow upload: the first part now, the rest after the SIGTERM
    const answer = new Promise<{ status: number; text: string }>((resolve, reject) => {
      const req = http.request(`${c.url}/api/tests/${made.body.id}/logs`, {
        method: 'POST',
        headers: {
          authorization: `Bearer ${token}`,
          'content-type': 'text/csv',
          'content-length': String(body.length),
        },
      });
      req.on('response', (res) => {
        let text = '';
        res.setEncoding('utf8');
        res.on('data', (d: string) => (text += d));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, text }));
      });
      req.on('error', reject);
      req.write(body.subarray(0, 70_000));
      setTimeout(() => {
        c.child.kill('SIGTERM');
        setTimeout(() => req.end(body.subarray(70_000)), 1500);
      }, 500);
    });
    await new Promise((r) => setTimeout(r, 1200));
    await expect(fetch(`${c.url}/api/health`)).rejects.toThrow(); // no longer listening
    const res = await answer;
    expect(res.status).toBe(201);
    expect(JSON.parse(res.text).rows).toBeGreaterThan(100);
    expect(await c.exited).toBe(0);
    const events = c.lines.map((l) => JSON.parse(l) as { msg: string; status?: number; route?: string });
    expect(events.some((e) => e.msg === 'draining')).toBe(true);
    expect(events.some((e) => e.route === '/api/tests/[id]/logs' && e.status === 201)).toBe(true);
    expect(events.at(-1)?.msg).toBe('stopped');
  }, 120_000);
});

// Live test events (DESIGN 8) flow to readers on both servers: when live mode lands, add here a
// check that a reader of GET …/live/events on one server receives the holds that chunks PUT on
// the other produce (Last-Event-ID replay across servers included).

describe('logs', () => {
  it('are JSON lines with a request id, route, status and duration, and never hold a secret', () => {
    const all = [...stack.servers, ...stack.workers].flatMap((p) => p.lines);
    expect(all.length).toBeGreaterThan(100);
    const parsed = all.map((l) => JSON.parse(l) as Record<string, unknown>);
    const requests = parsed.filter((p) => p.msg === 'request');
    expect(requests.length).toBeGreaterThan(50);
    for (const r of requests) {
      expect(r.reqId).toEqual(expect.any(String));
      expect(r.route).toEqual(expect.any(String));
      expect(r.status).toEqual(expect.any(Number));
      expect(r.ms).toEqual(expect.any(Number));
    }
    expect(parsed.some((p) => p.event === 'job' && p.outcome === 'done')).toBe(true);
    const text = all.join('\n');
    for (const s of secrets.filter((x) => x.length >= 8)) expect(text).not.toContain(s);
  });
});
