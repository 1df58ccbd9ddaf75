// Drills: a reduction worker is killed mid-job, and another is frozen until its lease runs out.
// Either way the job is done exactly once, by a worker that held the lease, and a late
// completion from a worker that lost its lease is refused.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTest, journeyLog, uploadLog, waitForReduction, type Crew } from '../support/journey';
import { stopProcess } from '../support/processes';
import { jsonOf, startStack, until, type Stack } from './stack';
import { crewOf } from './support';

let stack: Stack;
let crew: Crew;

beforeAll(async () => {
  stack = await startStack('workers');
  crew = await crewOf(stack);
});
afterAll(async () => {
  await stack?.close();
});

/** A test with a log long enough that a reduction runs for several seconds. */
async function longJob(name: string): Promise<{ testId: number; reductionId: number }> {
  const testId = await createTest(crew, name);
  const log = journeyLog(0, { rateHz: 200, holdSeconds: 300, rampSeconds: 60 });
  expect((await uploadLog(crew.technician, testId, log)).status).toBe(201);
  const q = await crew.technician.json(`/api/tests/${testId}/reductions`, { method: 'POST', json: {} });
  return { testId, reductionId: q.body.id };
}

const job = async (id: number) =>
  (
    await stack.sql<{ status: string; lease_owner: string | null; attempts: number }>(
      'SELECT status, lease_owner, attempts FROM reductions WHERE id = ?',
      [id],
    )
  )[0]!;

async function doneEvents(testId: number, reductionId: number) {
  const rows = await stack.sql<{ details: unknown }>(
    "SELECT details FROM audit_events WHERE action = 'reduction-done' AND test_id = ?",
    [testId],
  );
  return rows
    .map((r) => jsonOf<{ reductionId: number; worker: string }>(r.details))
    .filter((d) => d.reductionId === reductionId);
}

describe('reduction workers', () => {
  it('a worker killed mid-job: another takes the job when the lease runs out and does it once', async () => {
    const { testId, reductionId } = await longJob('Worker killed');
    const doomed = stack.worker('w-killed');
    await until('the job to start', async () => (await job(reductionId)).status === 'running');
    doomed.child.kill('SIGKILL');
    const rescuer = stack.worker('w-rescuer');
    try {
      const done = await waitForReduction(crew.engineer, reductionId, 90_000);
      expect(done.status).toBe('done');
      expect(done.attempts).toBe(2);
      const events = await doneEvents(testId, reductionId);
      expect(events).toHaveLength(1);
      expect(events[0]!.worker).toBe('w-rescuer');
      expect((await crew.engineer.json(`/api/tests/${testId}`)).body.status).toBe('reduced');
    } finally {
      await stopProcess(rescuer.child);
    }
  });

  it('a lease that runs out while its worker still runs: the late completion is refused', async () => {
    const { testId, reductionId } = await longJob('Lease runs out');
    const frozen = stack.worker('w-frozen');
    await until('the job to start', async () => (await job(reductionId)).status === 'running');
    frozen.child.kill('SIGSTOP'); // a long GC pause, a swapped-out VM: the worker is alive but silent
    const lease = Number(stack.env.WORKER_LEASE_SECONDS) * 1000;
    await new Promise((r) => setTimeout(r, lease + 500));
    const other = stack.worker('w-other');
    try {
      const done = await waitForReduction(crew.engineer, reductionId, 90_000);
      expect(done.status).toBe('done');
      frozen.child.kill('SIGCONT'); // it wakes up and carries on with the job it no longer holds
      await until('the frozen worker to notice', async () => /lost the lease on reduction/.test(frozen.log()), 60_000);
      const events = await doneEvents(testId, reductionId);
      expect(events).toHaveLength(1);
      expect(events[0]!.worker).toBe('w-other');
      const rows = await stack.sql<{ n: number }>('SELECT COUNT(*) AS n FROM gauge_results WHERE reduction_id = ?', [
        reductionId,
      ]);
      expect(Number(rows[0]!.n)).toBe(2); // one result per gauge: stored once
      expect((await job(reductionId)).status).toBe('done');
    } finally {
      frozen.child.kill('SIGCONT');
      await Promise.all([stopProcess(frozen.child), stopProcess(other.child)]);
    }
  });
});
