import { and, desc, eq, inArray, lt, or, sql } from 'drizzle-orm';
import type { Db } from '../client.server';
import { auditEvents, gaugeResults, logFiles, reductions, rosetteResults, tests, type Reduction } from '../schema';
import { insertedId } from './inserted-id';

export async function queueReduction(
  db: Db,
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

export const findReduction = (db: Db, id: number) => db.query.reductions.findFirst({ where: eq(reductions.id, id) });

export const listReductions = (db: Db, testId: number) =>
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
export async function claimNextReduction(db: Db, workerId: string, leaseSeconds: number): Promise<Reduction | null> {
  return db.transaction(async (tx) => {
    const now = new Date();
    const [job] = await tx
      .select()
      .from(reductions)
      .where(or(eq(reductions.status, 'queued'), and(eq(reductions.status, 'running'), lt(reductions.leaseUntil, now))))
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

/** Report progress and extend the lease; false when this worker no longer holds the job. */
export async function heartbeatReduction(
  db: Db,
  id: number,
  workerId: string,
  progress: number,
  leaseSeconds: number,
): Promise<boolean> {
  const [res] = await db
    .update(reductions)
    .set({ progress: Math.max(0, Math.min(1, progress)), leaseUntil: new Date(Date.now() + leaseSeconds * 1000) })
    .where(and(eq(reductions.id, id), eq(reductions.leaseOwner, workerId), eq(reductions.status, 'running')));
  return res.affectedRows > 0;
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
 * Store a finished job in one transaction — only if this worker still holds it, so a job is
 * never done twice — mark the test's older done reductions superseded, and write the audit event. Returns whether
 * it was stored and whether it is the newest done reduction of its test.
 */
export async function completeReduction(
  db: Db,
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
): Promise<{ stored: boolean; current: boolean }> {
  return db.transaction(async (tx) => {
    // Lock the test row first: completions of one test's reductions run one after another, so
    // marking older ones superseded never deadlocks with a second worker doing the same.
    const [test] = await tx
      .select({ id: tests.id, status: tests.status })
      .from(tests)
      .where(eq(tests.id, o.testId))
      .for('update');
    const [job] = await tx.select().from(reductions).where(eq(reductions.id, o.id)).for('update');
    if (!job || job.status !== 'running' || job.leaseOwner !== o.workerId) return { stored: false, current: false };
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
        error: null,
        superseded: !current,
      })
      .where(eq(reductions.id, o.id));
    if (current)
      await tx
        .update(reductions)
        .set({ superseded: true })
        .where(and(eq(reductions.testId, o.testId), eq(reductions.status, 'done'), lt(reductions.id, o.id)));
    if (current && test && test.status !== 'released') {
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
    }
    // the audit row commits with the result: a done job always has its event
    await tx
      .insert(auditEvents)
      .values({ actor: o.audit.actor, action: 'reduction-done', testId: o.testId, details: o.audit.details });
    return { stored: true, current };
  });
}

/** Fail a job for good (bad input) or put it back in the queue (internal fault, attempts left). */
export async function failReduction(
  db: Db,
  o: { id: number; workerId: string; error: string; retry: boolean },
): Promise<'failed' | 'requeued' | 'lost'> {
  const job = await findReduction(db, o.id);
  if (!job || job.leaseOwner !== o.workerId || job.status !== 'running') return 'lost';
  const retry = o.retry && job.attempts < job.maxAttempts;
  await db
    .update(reductions)
    .set(
      retry
        ? { status: 'queued', error: o.error, leaseOwner: null, leaseUntil: null, progress: 0 }
        : { status: 'failed', error: o.error, finishedAt: new Date(), leaseOwner: null, leaseUntil: null },
    )
    .where(and(eq(reductions.id, o.id), eq(reductions.leaseOwner, o.workerId)));
  return retry ? 'requeued' : 'failed';
}

/** Give a job back to the queue at once (a worker shutting down cleanly). */
export async function releaseReduction(db: Db, id: number, workerId: string) {
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

export const listGaugeResults = (db: Db, reductionId: number) =>
  db.select().from(gaugeResults).where(eq(gaugeResults.reductionId, reductionId));
export const listRosetteResults = (db: Db, reductionId: number) =>
  db.select().from(rosetteResults).where(eq(rosetteResults.reductionId, reductionId));
export const findReductionsByIds = (db: Db, ids: number[]) =>
  ids.length ? db.select().from(reductions).where(inArray(reductions.id, ids)) : Promise.resolve([]);
