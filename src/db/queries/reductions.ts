import { and, desc, eq, gt, inArray, isNull, lt, lte, or, sql } from 'drizzle-orm';
import type { Conn } from '../client.server';
import { gaugeResults, logFiles, reductions, rosetteResults, tests, type Reduction } from '../schema';
import { appendAuditEvent } from './audit';
import { insertedId } from './inserted-id';
import { transaction } from './transaction';

export async function queueReduction(
  db: Conn,
  r: { testId: number; plan: unknown; logIds: number[]; queuedBy: number | null },
) {
  return insertedId(
    await db
      .insert(reductions)
      .values({
        testId: r.testId,
        parameters: { plan: r.plan, logIds: r.logIds },
        queuedBy: r.queuedBy,
        status: 'queued',
      })
      .$returningId(),
  );
}

export const findReduction = (db: Conn, id: number) => db.query.reductions.findFirst({ where: eq(reductions.id, id) });

export const listReductions = (db: Conn, testId: number) =>
  db
    .select({
      id: reductions.id,
      status: reductions.status,
      progress: reductions.progress,
      attempts: reductions.attempts,
      engineVersion: reductions.engineVersion,
      error: reductions.error,
      superseded: reductions.superseded,
      createdAt: reductions.createdAt,
      startedAt: reductions.startedAt,
      finishedAt: reductions.finishedAt,
    })
    .from(reductions)
    .where(eq(reductions.testId, testId))
    .orderBy(desc(reductions.id));

/**
 * Claim the oldest job that is queued, or running with a lease that ran out (its worker died),
 * with SELECT … FOR UPDATE SKIP LOCKED so concurrent workers never claim the same row.
 */
export async function claimNextReduction(db: Conn, workerId: string, leaseSeconds: number): Promise<Reduction | null> {
  return transaction(db, async (tx) => {
    const now = new Date();
    const [job] = await tx
      .select()
      .from(reductions)
      .where(
        or(
          and(eq(reductions.status, 'queued'), or(isNull(reductions.notBefore), lte(reductions.notBefore, now))),
          and(eq(reductions.status, 'running'), lt(reductions.leaseUntil, now)),
        ),
      )
      .orderBy(reductions.id)
      .limit(1)
      .for('update', { skipLocked: true });
    if (!job) return null;
    if (job.attempts >= job.maxAttempts) {
      await tx
        .update(reductions)
        .set({
          status: 'failed',
          error: job.error ?? `Stopped after ${job.attempts} attempts: the worker kept stopping before it finished.`,
          finishedAt: now,
          leaseOwner: null,
          leaseUntil: null,
        })
        .where(eq(reductions.id, job.id));
      return null;
    }
    const leaseUntil = new Date(now.getTime() + leaseSeconds * 1000);
    await tx
      .update(reductions)
      .set({
        status: 'running',
        leaseOwner: workerId,
        leaseUntil,
        attempts: job.attempts + 1,
        startedAt: now,
        progress: 0,
      })
      .where(eq(reductions.id, job.id));
    return { ...job, status: 'running', leaseOwner: workerId, leaseUntil, attempts: job.attempts + 1, startedAt: now };
  });
}

/** The job is running under this worker's lease, and the lease has not run out. */
const leaseHeld = (id: number, workerId: string) =>
  and(
    eq(reductions.id, id),
    eq(reductions.leaseOwner, workerId),
    eq(reductions.status, 'running'),
    gt(reductions.leaseUntil, new Date()),
  );

/** Extend the lease without touching progress (the worker's lease timer); false when the job is no longer ours. */
export async function renewLease(db: Conn, id: number, workerId: string, leaseSeconds: number): Promise<boolean> {
  const [res] = await db
    .update(reductions)
    .set({ leaseUntil: new Date(Date.now() + leaseSeconds * 1000) })
    .where(leaseHeld(id, workerId));
  return res.affectedRows > 0;
}

/** Report progress and extend the lease; false when this worker no longer holds the job. */
export async function heartbeatReduction(
  db: Conn,
  id: number,
  workerId: string,
  progress: number,
  leaseSeconds: number,
): Promise<boolean> {
  const [res] = await db
    .update(reductions)
    .set({ progress: Math.max(0, Math.min(1, progress)), leaseUntil: new Date(Date.now() + leaseSeconds * 1000) })
    .where(leaseHeld(id, workerId));
  return res.affectedRows > 0;
}

/** Fail every queued or running reduction of a test (a release keeps the reviewed one); returns their ids. */
export async function cancelOpenReductions(db: Conn, testId: number, reason: string): Promise<number[]> {
  const open = await db
    .select({ id: reductions.id })
    .from(reductions)
    .where(and(eq(reductions.testId, testId), inArray(reductions.status, ['queued', 'running'])))
    .for('update');
  if (!open.length) return [];
  await db
    .update(reductions)
    .set({ status: 'failed', error: reason, finishedAt: new Date(), leaseOwner: null, leaseUntil: null })
    .where(
      inArray(
        reductions.id,
        open.map((r) => r.id),
      ),
    );
  return open.map((r) => r.id);
}

export interface GaugeResultInput {
  gaugeId: string;
  channel: string;
  angleDeg: number;
  measuredSlope: number | null;
  predictedSlope: number;
  ratio: number | null;
  deviation: number | null;
  ciLow: number | null;
  ciHigh: number | null;
  rSquared: number | null;
  unloadingSlope: number | null;
  hysteresis: number | null;
  zeroShift: number | null;
  peakStrain: number | null;
  effectiveThickness: number | null;
  flags: string[];
  outcome: string;
}
export interface RosetteResultInput {
  rosetteId: string;
  principalStrain1: number;
  principalStrain2: number;
  principalAngleDeg: number;
  principalStress1: number;
  principalStress2: number;
  vonMises: number;
  flags: string[];
}

/**
 * Store a finished job in one transaction that first locks the test row, then the job: only if
 * this worker still holds an unexpired lease (so a job is never done twice, and a worker that lost
 * its lease cannot complete late), and never on a released test (the job fails instead, and the
 * released record keeps the reduction that was signed). Marks older done reductions superseded and
 * writes the audit event. Returns whether it was stored and whether it is the test's newest.
 */
export async function completeReduction(
  db: Conn,
  o: {
    id: number;
    testId: number;
    workerId: string;
    engineVersion: string;
    result: unknown;
    seriesKey: string;
    gauges: GaugeResultInput[];
    rosettes: RosetteResultInput[];
    audit: { actor: string; details: Record<string, unknown> };
    summary: { verdict: 'conforms' | 'flagged' | 'incomplete'; flaggedCount: number; logIds: number[] };
  },
): Promise<{ stored: boolean; current: boolean; refused?: 'lease' | 'released' }> {
  return transaction(db, async (tx) => {
    // Lock the test row first: completions of one test's reductions run one after another, so
    // marking older ones superseded never deadlocks with a second worker doing the same, and a
    // release (which takes the same lock) comes wholly before or wholly after.
    const [test] = await tx
      .select({ id: tests.id, status: tests.status })
      .from(tests)
      .where(eq(tests.id, o.testId))
      .for('update');
    const [job] = await tx.select().from(reductions).where(eq(reductions.id, o.id)).for('update');
    if (
      !job ||
      job.status !== 'running' ||
      job.leaseOwner !== o.workerId ||
      !job.leaseUntil ||
      job.leaseUntil.getTime() <= Date.now()
    )
      return { stored: false, current: false, refused: 'lease' as const };
    if (!test || test.status === 'released') {
      await tx
        .update(reductions)
        .set({
          status: 'failed',
          error: 'The test was released while this reduction ran; the released record keeps the reviewed reduction.',
          finishedAt: new Date(),
          leaseOwner: null,
          leaseUntil: null,
        })
        .where(eq(reductions.id, o.id));
      await appendAuditEvent(tx, {
        actor: o.audit.actor,
        action: 'reduction-discarded',
        testId: o.testId,
        details: { ...o.audit.details, reason: 'test released' },
      });
      return { stored: false, current: false, refused: 'released' as const };
    }
    if (o.gauges.length) await tx.insert(gaugeResults).values(o.gauges.map((g) => ({ ...g, reductionId: o.id })));
    if (o.rosettes.length) await tx.insert(rosetteResults).values(o.rosettes.map((r) => ({ ...r, reductionId: o.id })));
    const [newer] = await tx
      .select({ n: sql<number>`count(*)` })
      .from(reductions)
      .where(and(eq(reductions.testId, o.testId), eq(reductions.status, 'done'), sql`${reductions.id} > ${o.id}`));
    const current = Number(newer?.n ?? 0) === 0;
    await tx
      .update(reductions)
      .set({
        status: 'done',
        progress: 1,
        result: o.result,
        seriesKey: o.seriesKey,
        engineVersion: o.engineVersion,
        finishedAt: new Date(),
        leaseOwner: null,
        leaseUntil: null,
        notBefore: null,
        error: null,
        superseded: !current,
      })
      .where(eq(reductions.id, o.id));
    if (current) {
      await tx
        .update(reductions)
        .set({ superseded: true })
        .where(and(eq(reductions.testId, o.testId), eq(reductions.status, 'done'), lt(reductions.id, o.id)));
      // the newest reduction sets the test's verdict; `reduced` only when it covers every log
      const logs = await tx.select({ id: logFiles.id }).from(logFiles).where(eq(logFiles.testId, o.testId));
      const coversAll = logs.every((l) => o.summary.logIds.includes(l.id));
      const now = new Date();
      await tx
        .update(tests)
        .set({
          currentReductionId: o.id,
          verdict: o.summary.verdict,
          flaggedCount: o.summary.flaggedCount,
          status: coversAll ? 'reduced' : 'logging',
          updatedAt: now,
          lastActivityAt: now,
        })
        .where(eq(tests.id, o.testId));
      if (test.status === 'reviewed')
        await appendAuditEvent(tx, {
          actor: o.audit.actor,
          action: 'review-withdrawn',
          testId: o.testId,
          details: { reason: `reduction ${o.id} finished after the review`, reductionId: o.id },
        });
    }
    // the audit row commits with the result: a done job always has its event
    await appendAuditEvent(tx, {
      actor: o.audit.actor,
      action: 'reduction-done',
      testId: o.testId,
      details: o.audit.details,
    });
    return { stored: true, current };
  });
}

/**
 * Fail a job for good (bad input), put it back in the queue (an internal fault, attempts left),
 * or — for a transient fault of storage or the database — put it back to wait until `notBefore`
 * without using up an attempt (the worker backs off). 'lost' when this worker no longer holds it.
 */
export function failReduction(
  db: Conn,
  o: {
    id: number;
    workerId: string;
    error: string;
    retry: boolean;
    transient?: { notBefore: Date; giveUp: boolean };
    /** written in the same transaction when the job fails for good */
    auditWhenFailed?: { actor: string; testId: number; details: Record<string, unknown> };
  },
): Promise<'failed' | 'requeued' | 'lost'> {
  return transaction(db, async (tx) => {
    const outcome = await failOrRequeue(tx, o);
    if (outcome === 'failed' && o.auditWhenFailed)
      await appendAuditEvent(tx, { action: 'reduction-failed', ...o.auditWhenFailed });
    return outcome;
  });
}

async function failOrRequeue(
  db: Conn,
  o: { id: number; workerId: string; error: string; retry: boolean; transient?: { notBefore: Date; giveUp: boolean } },
): Promise<'failed' | 'requeued' | 'lost'> {
  const [job] = await db.select().from(reductions).where(eq(reductions.id, o.id)).for('update');
  if (!job || job.leaseOwner !== o.workerId || job.status !== 'running') return 'lost';
  const owned = and(eq(reductions.id, o.id), eq(reductions.leaseOwner, o.workerId), eq(reductions.status, 'running'));
  if (o.transient && !o.transient.giveUp) {
    const [res] = await db
      .update(reductions)
      .set({
        status: 'queued',
        error: o.error,
        leaseOwner: null,
        leaseUntil: null,
        progress: 0,
        notBefore: o.transient.notBefore,
        transientFailures: sql`${reductions.transientFailures} + 1`,
        attempts: sql`greatest(${reductions.attempts} - 1, 0)`,
      })
      .where(owned);
    return res.affectedRows > 0 ? 'requeued' : 'lost';
  }
  const retry = !o.transient && o.retry && job.attempts < job.maxAttempts;
  const [res] = await db
    .update(reductions)
    .set(
      retry
        ? { status: 'queued', error: o.error, leaseOwner: null, leaseUntil: null, progress: 0 }
        : { status: 'failed', error: o.error, finishedAt: new Date(), leaseOwner: null, leaseUntil: null },
    )
    .where(owned);
  if (!res.affectedRows) return 'lost';
  return retry ? 'requeued' : 'failed';
}

/** Give a job back to the queue at once (a worker shutting down cleanly). */
export async function releaseReduction(db: Conn, id: number, workerId: string) {
  await db
    .update(reductions)
    .set({
      status: 'queued',
      leaseOwner: null,
      leaseUntil: null,
      attempts: sql`greatest(${reductions.attempts} - 1, 0)`,
    })
    .where(and(eq(reductions.id, id), eq(reductions.leaseOwner, workerId), eq(reductions.status, 'running')));
}

export const listGaugeResults = (db: Conn, reductionId: number) =>
  db.select().from(gaugeResults).where(eq(gaugeResults.reductionId, reductionId));
export const listRosetteResults = (db: Conn, reductionId: number) =>
  db.select().from(rosetteResults).where(eq(rosetteResults.reductionId, reductionId));
export const findReductionsByIds = (db: Conn, ids: number[]) =>
  ids.length ? db.select().from(reductions).where(inArray(reductions.id, ids)) : Promise.resolve([]);
