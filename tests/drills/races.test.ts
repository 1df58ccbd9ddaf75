// Drills: two people (or a person and a worker) change one test at the same moment. Each race
// ends in one consistent outcome: exactly one of the two wins, the loser is told why (409), and
// the stored record — status, signatures, frozen record, logs, audit chain — agrees with itself.
// To make the moment real, the drill holds the test row's lock (as a slow transaction would),
// lets both requests queue behind it, then lets go.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  journeyLog,
  journeyPlan,
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
let worker: ReturnType<Stack['worker']> | null = null;

beforeAll(async () => {
  stack = await startStack('races');
  crew = await crewOf(stack);
  worker = stack.worker('w-races');
});
afterAll(async () => {
  if (worker) await stopProcess(worker.child);
  await stack?.close();
});

/** The stored record agrees with itself, whichever side won. */
async function expectConsistent(testId: number) {
  const [test] = await stack.sql<{ status: string; current_reduction_id: number }>(
    'SELECT status, current_reduction_id FROM tests WHERE id = ?',
    [testId],
  );
  const actions = (
    await stack.sql<{ action: string }>('SELECT action FROM audit_events WHERE test_id = ?', [testId])
  ).map((r) => r.action);
  const releases = await stack.sql<{ reduction_id: number }>(
    "SELECT reduction_id FROM signatures WHERE test_id = ? AND kind = 'release'",
    [testId],
  );
  const snaps = await stack.sql<{ reduction_id: number; body: unknown }>(
    'SELECT reduction_id, body FROM release_snapshots WHERE test_id = ?',
    [testId],
  );
  if (test!.status === 'released') {
    expect(releases).toHaveLength(1);
    expect(snaps).toHaveLength(1);
    expect(actions.filter((a) => a === 'test-released')).toHaveLength(1);
    expect(snaps[0]!.reduction_id).toBe(test!.current_reduction_id);
    expect(releases[0]!.reduction_id).toBe(test!.current_reduction_id);
    const frozen = jsonOf<{ record: { logs: unknown[]; dispositionHistory: unknown[]; reduction: { id: number } } }>(
      snaps[0]!.body,
    ).record;
    const logs = await stack.sql('SELECT id FROM log_files WHERE test_id = ?', [testId]);
    const dispositions = await stack.sql('SELECT id FROM dispositions WHERE reduction_id = ?', [
      test!.current_reduction_id,
    ]);
    expect(frozen.logs).toHaveLength(logs.length);
    expect(frozen.dispositionHistory).toHaveLength(dispositions.length);
    expect(frozen.reduction.id).toBe(test!.current_reduction_id);
    const open = await stack.sql("SELECT id FROM reductions WHERE test_id = ? AND status IN ('queued', 'running')", [
      testId,
    ]);
    expect(open).toEqual([]);
  } else {
    expect(releases).toEqual([]);
    expect(snaps).toEqual([]);
    expect(actions).not.toContain('test-released');
  }
  const admin = await stack.signedIn('admin@example.com');
  expect((await admin.json(`/api/tests/${testId}/audit/verify`)).body.ok).toBe(true);
  return test!.status;
}

/** Fire `first`, let it queue behind the lock, then `second`, then let both go. */
async function race<A, B>(testId: number, first: () => Promise<A>, second: () => Promise<B>) {
  const lock = await holdTestLock(stack, testId);
  const a = first();
  await until('the first request to queue', async () => (await lock.waiting()) >= 1);
  const b = second();
  await until('the second request to queue', async () => (await lock.waiting()) >= 2);
  await lock.release();
  return Promise.all([a, b]);
}

/** Race `change` against `rel`, `change` queued first or second; answers [change's, rel's]. */
async function raceInOrder<T>(testId: number, changeFirst: boolean, change: () => Promise<T>, rel: () => Promise<T>) {
  if (changeFirst) return race(testId, change, rel);
  const [r, c] = await race(testId, rel, change);
  return [c, r] as const;
}

const release = (testId: number, reductionId: number) => () =>
  crew.qa.json(`/api/tests/${testId}/release`, { method: 'POST', json: signBody(reductionId) });

describe('races', () => {
  it('two identical uploads at once store one log, one object and one audit row', async () => {
    const testId = (
      await crew.engineer.json('/api/tests', { method: 'POST', json: { name: 'Twin uploads', plan: journeyPlan } })
    ).body.id;
    const log = journeyLog(5);
    const [a, b] = await Promise.all([
      uploadLog(crew.technician, testId, log),
      uploadLog(crew.technician, testId, log),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 201]);
    expect(a.body.id).toBe(b.body.id);
    expect(await stack.sql('SELECT id FROM log_files WHERE test_id = ?', [testId])).toHaveLength(1);
    expect(await objectCount(stack, `tests/${testId}/logs/`)).toBe(1);
    const audits = await stack.sql("SELECT id FROM audit_events WHERE test_id = ? AND action = 'log-uploaded'", [
      testId,
    ]);
    expect(audits).toHaveLength(1);
  });

  it('a release during an upload: the release stands; the upload answers 409 and leaves no object', async () => {
    const { testId, reductionId } = await reviewedTest(crew, 'Release during upload');
    const objects = await objectCount(stack, `tests/${testId}/logs/`);
    const up = slowUpload(stack, crew.technician, testId, bigJourneyLog());
    await new Promise((r) => setTimeout(r, 400)); // checked against the lock before it began streaming
    const rel = await release(testId, reductionId)();
    expect(rel.status).toBe(201);
    up.finish();
    const res = await up.response;
    expect(res.status).toBe(409);
    expect(res.body.error!.code).toBe('test-released');
    expect(await objectCount(stack, `tests/${testId}/logs/`)).toBe(objects);
    expect(await expectConsistent(testId)).toBe('released');
  });

  it.each(['disposition first', 'release first'])(
    'a release racing a disposition (%s): one wins, the record agrees',
    async (order) => {
      const { testId, reductionId } = await reviewedTest(crew, `Release vs disposition, ${order}`);
      const dispose = () =>
        crew.engineer.json(`/api/tests/${testId}/dispositions`, {
          method: 'POST',
          json: { gaugeId: 'H1', outcome: 'excluded', reason: 'bond lifted, seen on the last walk-round' },
        });
      const [d, r] = await raceInOrder(testId, order === 'disposition first', dispose, release(testId, reductionId));
      const statuses = [d.status, r.status];
      expect(statuses.filter((s) => s === 201)).toHaveLength(1);
      expect(statuses.filter((s) => s === 409)).toHaveLength(1);
      const status = await expectConsistent(testId);
      if (r.status === 201) {
        expect(status).toBe('released');
        expect(d.body.error.code).toBe('test-released');
      } else {
        expect(status).toBe('reduced'); // the disposition withdrew the review
        expect(r.body.error.code).toBe('not-reviewed');
      }
    },
  );

  it.each(['plan first', 'release first'])(
    'a release racing a plan save (%s): one wins, the record agrees',
    async (order) => {
      const { testId, reductionId } = await reviewedTest(crew, `Release vs plan, ${order}`);
      const save = () =>
        crew.engineer.json(`/api/tests/${testId}/plan`, { method: 'PUT', json: { ...journeyPlan, testPressure: 2.1 } });
      const [p, r] = await raceInOrder(testId, order === 'plan first', save, release(testId, reductionId));
      expect([p.status, r.status].filter((s) => s === 409)).toHaveLength(1);
      const status = await expectConsistent(testId);
      const [row] = await stack.sql<{ plan: unknown }>('SELECT plan FROM tests WHERE id = ?', [testId]);
      const testPressure = jsonOf<{ testPressure: number }>(row!.plan).testPressure;
      if (r.status === 201) {
        expect(status).toBe('released');
        expect(testPressure).toBe(2);
      } else {
        expect(p.status).toBe(200);
        expect(status).toBe('logging');
        expect(testPressure).toBe(2.1);
      }
    },
  );

  it.each(['reduction first', 'release first'])(
    'a release racing a finishing reduction (%s): the released record keeps the signed reduction',
    async (order) => {
      const { testId, reductionId } = await reviewedTest(crew, `Release vs reduction, ${order}`);
      await stopProcess(worker!.child); // the next reduction must finish exactly when we say
      worker = null;
      const queued = await crew.technician.json(`/api/tests/${testId}/reductions`, { method: 'POST', json: {} });
      const next = queued.body.id as number;
      let late: ReturnType<Stack['worker']> | null = null;
      const finish = async () => {
        late = stack.worker(`w-late-${order.split(' ')[0]}`);
        return late;
      };
      const lock = await holdTestLock(stack, testId);
      let rel: Promise<{ status: number; body: { error?: { code: string } } }>;
      if (order === 'reduction first') {
        await finish();
        await until('the finished reduction to queue', async () => (await lock.waiting()) >= 1, 60_000);
        rel = release(testId, reductionId)();
        await until('the release to queue', async () => (await lock.waiting()) >= 2);
      } else {
        rel = release(testId, reductionId)();
        await until('the release to queue', async () => (await lock.waiting()) >= 1);
        await finish();
        await until('the finished reduction to queue', async () => (await lock.waiting()) >= 2, 60_000);
      }
      await lock.release();
      const r = await rel;
      const job = await waitForReduction(crew.engineer, next);
      const status = await expectConsistent(testId);
      if (r.status === 201) {
        // the release came first: the late result is not attached to the released test
        expect(status).toBe('released');
        expect(job.status).toBe('failed');
        expect(job.error).toMatch(/released/);
        const [t] = await stack.sql<{ current_reduction_id: number }>(
          'SELECT current_reduction_id FROM tests WHERE id = ?',
          [testId],
        );
        expect(t!.current_reduction_id).toBe(reductionId);
      } else {
        // the reduction came first: it withdrew the review, so there was nothing signed to release
        expect(job.status).toBe('done');
        expect(status).toBe('reduced');
        expect(['not-reviewed', 'stale-reduction']).toContain(r.body.error!.code);
      }
      if (late) await stopProcess((late as ReturnType<Stack['worker']>).child);
      worker = stack.worker('w-races');
    },
  );
});
