// Runs one reduction job: claims it from the MariaDB queue, streams its logs from object
// storage through the engine, renews its lease on a timer and reports progress, and stores the
// result — or fails the job with a clear message (bad input: for good; an internal fault: retried
// up to max_attempts; storage or the database not answering: put back with back-off, without
// using up an attempt).
import { inArray } from 'drizzle-orm';
import { getDb } from '../../db/client.server';
import {
  claimNextReduction,
  completeReduction,
  failReduction,
  heartbeatReduction,
  type GaugeResultInput,
  type RosetteResultInput,
} from '../../db/queries/reductions';
import { logFiles, type Reduction } from '../../db/schema';
import { ENGINE_VERSION, parsePlan, reduceLog } from '../../lib/reduction';
import { InputError, isInputError } from '../../lib/reduction/errors';
import type { ReductionResult } from '../../lib/reduction/types';
import { getConfig } from '../../config.server';
import { describeFault, isTransientFault } from '../faults.server';
import { getObjectStream, putObject } from '../storage.server';
import { backoffDelayMs, MAX_TRANSIENT_FAILURES } from './backoff.server';
import { startLeaseTimer } from './lease.server';

class LeaseLost extends Error {}

/** The log ids a reduction covers, in upload order. */
async function logsOf(job: Reduction) {
  const ids = job.parameters.logIds;
  if (!ids.length) return [];
  const rows = await getDb().select().from(logFiles).where(inArray(logFiles.id, ids));
  return ids.map((id) => rows.find((r) => r.id === id)).filter((r): r is NonNullable<typeof r> => !!r);
}

/** An object's bytes, opened only when the engine reaches that segment. */
async function* lazyObject(key: string): AsyncIterable<Uint8Array> {
  const stream = await getObjectStream(key);
  for await (const chunk of stream) yield chunk as Uint8Array;
}

function gaugeRows(result: ReductionResult): GaugeResultInput[] {
  return result.gauges.map((g) => ({
    gaugeId: g.id,
    channel: g.channel,
    angleDeg: g.angleDeg,
    measuredSlope: g.measuredSlope,
    predictedSlope: g.predictedSlope,
    ratio: g.ratio,
    deviation: g.deviation,
    ciLow: g.slopeCI95?.[0] ?? null,
    ciHigh: g.slopeCI95?.[1] ?? null,
    rSquared: g.rSquared,
    unloadingSlope: g.unloadingSlope,
    hysteresis: g.hysteresis,
    zeroShift: g.zeroShift,
    peakStrain: g.peakStrain,
    effectiveThickness: g.effectiveThickness,
    flags: g.flags,
    outcome: g.outcome,
  }));
}

function rosetteRows(result: ReductionResult): RosetteResultInput[] {
  return result.rosettes.map((r) => ({
    rosetteId: r.id,
    principalStrain1: r.principalStrains[0],
    principalStrain2: r.principalStrains[1],
    principalAngleDeg: r.principalAngleDeg,
    principalStress1: r.principalStresses[0],
    principalStress2: r.principalStresses[1],
    vonMises: r.vonMises,
    flags: r.flags,
  }));
}

export interface JobHooks {
  /** called as soon as a job is claimed (the worker remembers it to give it back on shutdown) */
  onClaimed?: (reductionId: number) => void;
  /** called after a job is stored (e-mail notices); failures here never fail the job */
  onFinished?: (
    job: Reduction,
    outcome: 'done' | 'failed',
    detail: { result?: ReductionResult; error?: string },
  ) => Promise<void>;
}

/** Claim and run one job. Resolves to the job id handled, or null when the queue is empty. */
export async function runNextReduction(workerId: string, hooks: JobHooks = {}): Promise<number | null> {
  const db = getDb();
  const { WORKER_LEASE_SECONDS: lease } = getConfig();
  const job = await claimNextReduction(db, workerId, lease);
  if (!job) return null;
  hooks.onClaimed?.(job.id);
  const actor = `worker ${workerId}`;
  const leaseTimer = startLeaseTimer(db, job.id, workerId, lease);
  try {
    const plan = parsePlan(job.parameters.plan);
    const logs = await logsOf(job);
    if (!logs.length) throw new InputError('no-data', 'The test has no logs to reduce.');
    const total = logs.reduce((s, l) => s + l.sizeBytes, 0) || 1;
    let lastBeat = Date.now();
    // set inside the progress callback, so TypeScript must not narrow it to null here
    let beating = null as Promise<void> | null;
    let lost = false;
    const onProgress = (bytesRead: number) => {
      if (lost || leaseTimer.lost()) throw new LeaseLost();
      if (Date.now() - lastBeat < 1000 || beating) return;
      lastBeat = Date.now();
      beating = heartbeatReduction(db, job.id, workerId, Math.min(0.98, bytesRead / total), lease)
        .then((held) => {
          if (!held) lost = true;
        })
        .catch(() => undefined)
        .finally(() => {
          beating = null;
        });
    };
    const { result, series } = await reduceLog(
      plan,
      logs.map((l) => lazyObject(l.objectKey)),
      { onProgress, seriesBuckets: 20_000 },
    );
    if (beating) await beating;
    if (lost || leaseTimer.lost()) throw new LeaseLost();
    const seriesKey = `reductions/${job.id}/series.json`;
    await putObject(seriesKey, JSON.stringify(series));
    const stored = await completeReduction(db, {
      id: job.id,
      testId: job.testId,
      workerId,
      engineVersion: result.engineVersion ?? ENGINE_VERSION,
      result,
      seriesKey,
      gauges: gaugeRows(result),
      rosettes: rosetteRows(result),
      audit: {
        actor,
        details: { reductionId: job.id, verdict: result.verdict, attempt: job.attempts, worker: workerId },
      },
      summary: {
        verdict: result.verdict,
        flaggedCount: result.gauges.filter((g) => g.outcome === 'flagged').length,
        logIds: job.parameters.logIds,
      },
    });
    if (stored.refused === 'released') {
      console.warn(`[${workerId}] reduction ${job.id} finished after its test was released; not stored`);
      return job.id;
    }
    if (!stored.stored) throw new LeaseLost();
    await hooks.onFinished?.(job, 'done', { result }).catch((e) => console.error('notice after reduction failed:', e));
  } catch (err) {
    if (err instanceof LeaseLost) {
      console.warn(`[${workerId}] lost the lease on reduction ${job.id}; another worker has it`);
      return job.id;
    }
    const isInput = isInputError(err);
    const transient = !isInput && isTransientFault(err);
    const message = isInput
      ? (err as Error).message
      : transient
        ? `Storage or the database did not answer while reducing (${describeFault(err)}); it is tried again later.`
        : `Internal fault while reducing: ${(err as Error).message ?? String(err)}`;
    if (!isInput) console.error(`[${workerId}] reduction ${job.id} failed:`, transient ? describeFault(err) : err);
    const c = getConfig();
    const outcome = await failReduction(db, {
      id: job.id,
      workerId,
      error: message,
      retry: !isInput,
      transient: transient
        ? {
            notBefore: new Date(
              Date.now() +
                backoffDelayMs(job.transientFailures, c.WORKER_RETRY_BASE_MS, c.WORKER_RETRY_MAX_SECONDS * 1000),
            ),
            giveUp: job.transientFailures + 1 >= MAX_TRANSIENT_FAILURES,
          }
        : undefined,
      auditWhenFailed: { actor, testId: job.testId, details: { reductionId: job.id, error: message } },
    });
    if (outcome === 'failed') {
      await hooks
        .onFinished?.(job, 'failed', { error: message })
        .catch((e) => console.error('notice after reduction failed:', e));
    }
  } finally {
    leaseTimer.stop();
  }
  return job.id;
}
