// The worker renews a running job's lease on a timer, not only when the engine reports progress,
// and notices at the next renewal when the job has been taken away from it.
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { signedIn } from './support/http';
import { journeyPlan } from './support/journey';

describe('the lease timer', () => {
  it('keeps a silent job\u2019s lease alive past its length, and reports it lost once another worker has it', async () => {
    const engineer = await signedIn('engineer@example.com');
    const testId = (
      await engineer.json('/api/tests', { method: 'POST', json: { name: 'Lease timer', plan: journeyPlan } })
    ).body.id;
    const { getDb } = await import('../src/db/client.server');
    const { queueReduction } = await import('../src/db/queries/reductions');
    const { reductions } = await import('../src/db/schema');
    const { startLeaseTimer } = await import('../src/server/jobs/lease.server');
    const db = getDb();
    const id = await queueReduction(db, { testId, plan: journeyPlan, logIds: [], queuedBy: null });
    const leaseSeconds = 2;
    await db
      .update(reductions)
      .set({ status: 'running', leaseOwner: 'w-timer', leaseUntil: new Date(Date.now() + leaseSeconds * 1000) })
      .where(eq(reductions.id, id));
    const timer = startLeaseTimer(db, id, 'w-timer', leaseSeconds);
    try {
      await new Promise((r) => setTimeout(r, 3 * leaseSeconds * 1000)); // three lease lengths, no progress at all
      const [row] = await db.select().from(reductions).where(eq(reductions.id, id));
      expect(row!.leaseUntil!.getTime()).toBeGreaterThan(Date.now());
      expect(timer.lost()).toBe(false);
      await db.update(reductions).set({ leaseOwner: 'w-other' }).where(eq(reductions.id, id));
      await new Promise((r) => setTimeout(r, leaseSeconds * 1000));
      expect(timer.lost()).toBe(true);
    } finally {
      timer.stop();
      await db
        .update(reductions)
        .set({ status: 'failed', leaseOwner: null, leaseUntil: null })
        .where(eq(reductions.id, id));
    }
  });
});
