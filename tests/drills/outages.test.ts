// Drills: MariaDB, object storage and the mail server stop while people work. The client gets
// 503 (never 500), nothing is lost or half-written, and everything recovers when the service
// returns — without restarting the app.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createHash } from 'node:crypto';
import { readdirSync } from 'node:fs';
import {
  createTest,
  journeyLog,
  reducedTest,
  reviewedTest,
  signBody,
  uploadLog,
  waitForReduction,
  type Crew,
} from '../support/journey';
import { stopProcess } from '../support/processes';
import { holdTestLock, jsonOf, startStack, until, type Stack } from './stack';
import { bigJourneyLog, crewOf, objectCount, slowUpload } from './support';

let stack: Stack;
let crew: Crew;
let worker: ReturnType<Stack['worker']>;

beforeAll(async () => {
  stack = await startStack('outages');
  crew = await crewOf(stack);
  worker = stack.worker('w-outages');
});
afterAll(async () => {
  await stack?.close();
});

async function auditActions(testId: number): Promise<string[]> {
  return (
    await stack.sql<{ action: string }>('SELECT action FROM audit_events WHERE test_id = ? ORDER BY id', [testId])
  ).map((r) => r.action);
}

async function chainOk(testId: number) {
  const admin = await stack.signedIn('admin@example.com');
  return (await admin.json(`/api/tests/${testId}/audit/verify`)).body.ok as boolean;
}

describe('MariaDB stops', () => {
  it('mid-upload: the client gets 503, no log row and no object are left, and the pool recovers', async () => {
    const { testId } = await reducedTest(crew, 'DB stops mid-upload');
    const logsBefore = await objectCount(stack, `tests/${testId}/logs/`);
    const up = slowUpload(stack, crew.technician, testId, bigJourneyLog());
    await new Promise((r) => setTimeout(r, 500)); // the header is checked; bytes are streaming to storage
    await stack.stopDb();
    up.finish();
    const res = await up.response;
    expect(res.status).toBe(503);
    expect(res.body.error!.code).toBe('unavailable');
    await stack.startDb();
    // the same app process answers again, from a pool that reconnected by itself
    expect(stack.app.exitCode).toBeNull();
    await until(
      'the app to reach MariaDB again',
      async () => (await crew.engineer.json(`/api/tests/${testId}`)).status === 200,
    );
    const t = (await crew.engineer.json(`/api/tests/${testId}`)).body;
    expect(t.status).toBe('reduced');
    expect(t.logCount).toBe(1);
    expect(await objectCount(stack, `tests/${testId}/logs/`)).toBe(logsBefore);
    expect(await auditActions(testId)).not.toContain('slow.csv');
    expect((await auditActions(testId)).filter((a) => a === 'log-uploaded')).toHaveLength(1);
    // and the upload works now
    expect((await uploadLog(crew.technician, testId, journeyLog(3))).status).toBe(201);
    expect(await chainOk(testId)).toBe(true);
  });

  it('mid-release: the client gets 503; the test stays reviewed with no release half-written', async () => {
    const { testId, reductionId } = await reviewedTest(crew, 'DB stops mid-release');
    const lock = await holdTestLock(stack, testId); // a slow transaction ahead of the release
    let early: unknown = null;
    const release = crew.qa.json(`/api/tests/${testId}/release`, { method: 'POST', json: signBody(reductionId) });
    void release.then((r) => (early = r));
    await until('the release to wait inside its transaction', async () => {
      if (early) throw new Error(`the release answered before it reached the lock: ${JSON.stringify(early)}`);
      return (await lock.waiting()) === 1;
    });
    await stack.stopDb();
    const res = await release;
    expect(res.status).toBe(503);
    await lock.release().catch(() => undefined); // its connection is gone with the server
    await stack.startDb();
    await until(
      'the app to reach MariaDB again',
      async () => (await crew.qa.json(`/api/tests/${testId}`)).status === 200,
    );
    expect((await crew.qa.json(`/api/tests/${testId}`)).body.status).toBe('reviewed');
    expect(await stack.sql('SELECT * FROM release_snapshots WHERE test_id = ?', [testId])).toEqual([]);
    expect(await stack.sql("SELECT * FROM signatures WHERE test_id = ? AND kind = 'release'", [testId])).toEqual([]);
    expect(await auditActions(testId)).not.toContain('test-released');
    expect(await chainOk(testId)).toBe(true);
    // the same release, again, goes through
    const again = await crew.qa.json(`/api/tests/${testId}/release`, { method: 'POST', json: signBody(reductionId) });
    expect(again.status).toBe(201);
  });
});

describe('object storage stops', () => {
  it('during an upload: 503, no log row, the status unchanged', async () => {
    const { testId } = await reducedTest(crew, 'S3 stops during upload');
    await stack.stopS3();
    try {
      const res = await uploadLog(crew.technician, testId, journeyLog(4));
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('unavailable');
    } finally {
      await stack.startS3();
    }
    const t = (await crew.engineer.json(`/api/tests/${testId}`)).body;
    expect(t.logCount).toBe(1);
    expect(t.status).toBe('reduced');
    expect((await auditActions(testId)).filter((a) => a === 'log-uploaded')).toHaveLength(1);
  });

  it('during a reduction: the job waits and retries with back-off, then finishes once, without using up its attempts', async () => {
    const { testId } = await reducedTest(crew, 'S3 stops during reduction');
    await stack.stopS3();
    let id = 0;
    try {
      id = (await crew.technician.json(`/api/tests/${testId}/reductions`, { method: 'POST', json: {} })).body.id;
      await until('two failed tries against stopped storage', async () => {
        const [r] = await stack.sql<{ transient_failures: number }>(
          'SELECT transient_failures FROM reductions WHERE id = ?',
          [id],
        );
        return (r?.transient_failures ?? 0) >= 2;
      });
      const [mid] = await stack.sql<{ status: string; not_before: Date | null; error: string }>(
        'SELECT status, not_before, error FROM reductions WHERE id = ?',
        [id],
      );
      expect(['queued', 'running']).toContain(mid!.status);
      expect(mid!.error).toMatch(/Storage or the database did not answer/);
    } finally {
      await stack.startS3();
    }
    const done = await waitForReduction(crew.technician, id);
    expect(done.status).toBe('done');
    const [row] = await stack.sql<{ attempts: number; transient_failures: number }>(
      'SELECT attempts, transient_failures FROM reductions WHERE id = ?',
      [id],
    );
    expect(row!.attempts).toBe(1);
    expect(row!.transient_failures).toBeGreaterThanOrEqual(2);
    const events = await stack.sql<{ details: unknown }>(
      "SELECT details FROM audit_events WHERE action = 'reduction-done' AND test_id = ?",
      [testId],
    );
    expect(events.filter((e) => jsonOf<{ reductionId: number }>(e.details).reductionId === id)).toHaveLength(1);
  });

  it('during a series read: 503, not 500, and the series again once it is back', async () => {
    const { testId } = await reducedTest(crew, 'S3 stops during series read');
    await stack.stopS3();
    try {
      const res = await crew.engineer.json(`/api/tests/${testId}/series?points=200`);
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('unavailable');
    } finally {
      await stack.startS3();
    }
    expect((await crew.engineer.json(`/api/tests/${testId}/series?points=200`)).status).toBe(200);
  });
});

describe('the mail server stops', () => {
  it('keeps the message in the outbox and the worker sends it once SMTP is back', async () => {
    const { testId } = await reducedTest(crew, 'SMTP stops');
    await stack.stopSmtp();
    let linkId = 0;
    try {
      const made = await crew.qa.json(`/api/tests/${testId}/share-links`, {
        method: 'POST',
        json: { email: 'inspector@example.com' },
      });
      expect(made.status).toBe(201);
      linkId = made.body.id;
      await until('a failed delivery attempt', async () => {
        const [m] = await stack.sql<{ last_error: string | null }>(
          "SELECT last_error FROM outbox WHERE test_id = ? AND to_address = 'inspector@example.com'",
          [testId],
        );
        return !!m?.last_error;
      });
      const [pending] = await stack.sql<{ status: string; last_error: string }>(
        "SELECT status, last_error FROM outbox WHERE test_id = ? AND to_address = 'inspector@example.com'",
        [testId],
      );
      expect(pending!.status).toBe('pending');
      expect(pending!.last_error).toBeTruthy();
    } finally {
      await stack.startSmtp();
    }
    await until(
      'the worker to deliver the kept message',
      async () =>
        (
          await stack.sql<{ status: string }>(
            "SELECT status FROM outbox WHERE test_id = ? AND to_address = 'inspector@example.com'",
            [testId],
          )
        )[0]?.status === 'sent',
      30_000,
    );
    expect(readdirSync(stack.mailDir).filter((f) => f.endsWith('.eml')).length).toBeGreaterThan(0);
    expect(linkId).toBeGreaterThan(0);
  });
});

afterAll(async () => {
  if (worker) await stopProcess(worker.child);
});

describe('a live session meets an outage', () => {
  const put = (testId: number, sessionId: number, n: number, body: Buffer) =>
    crew.technician.json(`/api/tests/${testId}/live/${sessionId}/chunks/${n}`, {
      method: 'PUT',
      body: new Uint8Array(body),
      headers: { 'content-type': 'text/csv' },
    });

  it('storage and then MariaDB stop between chunks: 503 each time, the retried chunk is taken, the log is whole', async () => {
    const testId = await createTest(crew, 'live session through outages');
    const log = Buffer.from(journeyLog());
    const chunks: Buffer[] = [];
    for (let i = 0; i < log.length; i += 2048) chunks.push(log.subarray(i, i + 2048));
    const open = await crew.technician.json(`/api/tests/${testId}/live`, { method: 'POST' });
    expect(open.status).toBe(201);
    const sessionId = open.body.sessionId as number;
    const third = Math.floor(chunks.length / 3);
    for (let n = 1; n <= third; n++) expect((await put(testId, sessionId, n, chunks[n - 1]!)).status).toBe(201);

    await stack.stopS3();
    try {
      const r = await put(testId, sessionId, third + 1, chunks[third]!);
      expect(r.status).toBe(503);
      expect(r.body.error.code).toBe('unavailable');
    } finally {
      await stack.startS3();
    }
    expect((await put(testId, sessionId, third + 1, chunks[third]!)).status).toBe(201);
    for (let n = third + 2; n <= 2 * third; n++)
      expect((await put(testId, sessionId, n, chunks[n - 1]!)).status).toBe(201);

    await stack.stopDb();
    try {
      const r = await put(testId, sessionId, 2 * third + 1, chunks[2 * third]!);
      expect(r.status).toBe(503);
    } finally {
      await stack.startDb();
    }
    await until('the app to reach MariaDB again', async () => {
      const r = await put(testId, sessionId, 2 * third + 1, chunks[2 * third]!);
      if (r.status !== 503 && r.status !== 201) throw new Error(`chunk answered ${r.status}`);
      return r.status === 201;
    });
    for (let n = 2 * third + 2; n <= chunks.length; n++)
      expect((await put(testId, sessionId, n, chunks[n - 1]!)).status).toBe(201);

    const done = await crew.technician.json(`/api/tests/${testId}/live/${sessionId}/finish`, { method: 'POST' });
    expect(done.status).toBe(201);
    const logs = (await crew.engineer.json(`/api/tests/${testId}/logs`)).body.items;
    expect(logs).toHaveLength(1);
    expect(logs[0].sha256).toBe(createHash('sha256').update(log).digest('hex'));
    const stored = await stack.sql<{ n: number }>('SELECT n FROM live_chunks WHERE session_id = ? ORDER BY n', [
      sessionId,
    ]);
    expect(stored.map((r) => r.n)).toEqual(chunks.map((_, i) => i + 1));
    expect((await waitForReduction(crew.technician, done.body.reductionId)).status).toBe('done');
    expect(await chainOk(testId)).toBe(true);
  });
});
