// A test's record as people review, export and share it: the test, its vessel and material,
// the plan, the current reduction's result with the engineers' dispositions applied, the
// signatures and the logs. One loader, so the review page, the exports and the inspector's link
// always show the same thing.
import { getDb } from '../db/client.server';
import { listLogs } from '../db/queries/logs';
import { findReduction } from '../db/queries/reductions';
import { listDispositions, listSignatures } from '../db/queries/review';
import { findTestWithVessel } from '../db/queries/tests';
import { applyDispositions, type DispositionedGauge } from '../lib/reduction/dispositions';
import { parsePlan, type Plan } from '../lib/reduction/plan';
import type { ReductionResult, TestVerdict } from '../lib/reduction/types';
import { errors } from './errors';

export interface LatestDisposition {
  gaugeId: string;
  outcome: 'accepted' | 'excluded' | 'retest';
  reason: string;
  by: string;
  byEmail: string;
  at: Date;
}

export async function loadTestRecord(testId: number) {
  const db = getDb();
  const row = await findTestWithVessel(db, testId);
  if (!row) throw errors.notFound('test');
  const { test } = row;
  let plan: Plan | null = null;
  try {
    plan = parsePlan(test.plan);
  } catch {
    plan = null;
  }
  const reduction = test.currentReductionId ? await findReduction(db, test.currentReductionId) : undefined;
  const result = reduction?.status === 'done' ? (reduction.result as ReductionResult) : null;
  const [allDispositions, signatures, logs] = await Promise.all([
    reduction ? listDispositions(db, reduction.id) : Promise.resolve([]),
    listSignatures(db, testId),
    listLogs(db, testId),
  ]);
  const latest = new Map<string, LatestDisposition>();
  for (const d of allDispositions)
    latest.set(d.gaugeId, {
      gaugeId: d.gaugeId,
      outcome: d.outcome,
      reason: d.reason,
      by: d.by,
      byEmail: d.byEmail,
      at: d.createdAt,
    });
  let verdict: TestVerdict | null = null;
  let gauges: DispositionedGauge[] = [];
  if (result) {
    const applied = applyDispositions(result, [...latest.values()]);
    verdict = applied.verdict;
    gauges = applied.gauges;
  }
  const openFlags = gauges.filter((g) => g.outcome === 'flagged' && !latest.has(g.id)).map((g) => g.id);
  const reductionLogIds = reduction?.parameters.logIds ?? [];
  return {
    test,
    vessel: row.vessel,
    material: row.material,
    owner: row.owner,
    plan,
    reduction: reduction ?? null,
    result,
    gauges,
    verdict,
    dispositions: [...latest.values()],
    dispositionHistory: allDispositions,
    signatures,
    logs,
    reducedLogs: logs.filter((l) => reductionLogIds.includes(l.id)),
    openFlags,
  };
}

export type TestRecord = Awaited<ReturnType<typeof loadTestRecord>>;

/** The serialisable view of a record for the API, the share link and the islands. */
export function recordView(r: TestRecord) {
  return {
    test: {
      id: r.test.id,
      name: r.test.name,
      status: r.test.status,
      verdict: r.verdict ?? r.test.verdict,
      flaggedCount: r.test.flaggedCount,
      createdAt: r.test.createdAt,
      lastActivityAt: r.test.lastActivityAt,
    },
    vessel: r.vessel,
    material: r.material,
    plan: r.plan,
    reduction: r.reduction
      ? {
          id: r.reduction.id,
          status: r.reduction.status,
          progress: r.reduction.progress,
          engineVersion: r.reduction.engineVersion,
          finishedAt: r.reduction.finishedAt,
          error: r.reduction.error,
        }
      : null,
    result: r.result ? { ...r.result, gauges: r.gauges, verdict: r.verdict } : null,
    dispositions: r.dispositions,
    signatures: r.signatures.map((s) => ({
      kind: s.kind,
      name: s.name,
      email: s.email,
      at: s.createdAt,
      reductionId: s.reductionId,
      statement: s.statement,
    })),
    logs: r.logs.map((l) => ({
      id: l.id,
      filename: l.filename,
      sha256: l.sha256,
      sizeBytes: l.sizeBytes,
      rows: l.rows,
      timeStart: l.timeStart,
      timeEnd: l.timeEnd,
      createdAt: l.createdAt,
    })),
    openFlags: r.openFlags,
  };
}
