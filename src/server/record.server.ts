// A test's record as people review, export and share it: the test, its vessel and material,
// the plan, the current reduction's result with the engineers' dispositions applied, the
// signatures and the logs. One loader, so the review page, the exports and the inspector's link
// always show the same thing. A released test's record is the snapshot frozen at release
// (src/server/snapshot.server.ts), never the live vessel, material or reduction rows.
import { getDb, type Conn } from '../db/client.server';
import { listLogs } from '../db/queries/logs';
import { findReduction } from '../db/queries/reductions';
import { listDispositions, listSignatures } from '../db/queries/review';
import { findTest, findTestWithVessel } from '../db/queries/tests';
import { applyDispositions, type DispositionedGauge } from '../lib/reduction/dispositions';
import { parsePlan, type Plan } from '../lib/reduction/plan';
import type { ReductionResult, TestVerdict } from '../lib/reduction/types';
import { errors } from './errors';
import { loadFrozenRecord } from './snapshot.server';

export interface LatestDisposition {
  gaugeId: string;
  outcome: 'accepted' | 'excluded' | 'retest';
  reason: string;
  by: string;
  byEmail: string;
  at: Date;
}

type TestWithVessel = NonNullable<Awaited<ReturnType<typeof findTestWithVessel>>>;

/** The record from the live rows (inside a transaction, pass it: the release freezes this). */
export async function loadLiveRecord(testId: number, db: Conn = getDb()) {
  const row = await findTestWithVessel(db, testId);
  if (!row) throw errors.notFound('test');
  return assembleRecord(db, row);
}

/** The record people see: for a released test its frozen snapshot, otherwise the live rows. */
export async function loadTestRecord(testId: number, db: Conn = getDb()): Promise<TestRecord> {
  const row = await findTestWithVessel(db, testId);
  if (!row) throw errors.notFound('test');
  if (row.test.status === 'released') {
    const frozen = await loadFrozenRecord(db, testId);
    // a test released before snapshots existed has none: its live rows are all there is
    if (frozen) return frozen;
  }
  return assembleRecord(db, row);
}

/**
 * The stored time history of the reduction the record shows (the released one, from the frozen
 * record, for a released test), or null before any reduction finished. 404 for no such test.
 */
export async function seriesKeyOf(testId: number, db: Conn = getDb()): Promise<string | null> {
  const test = await findTest(db, testId);
  if (!test) throw errors.notFound('test');
  if (test.status === 'released') {
    const frozen = await loadFrozenRecord(db, testId);
    if (frozen) return frozen.reduction?.seriesKey ?? null;
  }
  const reduction = test.currentReductionId ? await findReduction(db, test.currentReductionId) : undefined;
  return reduction?.seriesKey ?? null;
}

async function assembleRecord(db: Conn, row: TestWithVessel) {
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
    listSignatures(db, test.id),
    listLogs(db, test.id),
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

export type TestRecord = Awaited<ReturnType<typeof assembleRecord>>;

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

/**
 * The record as the inspector's link shows it: no staff e-mail addresses and no internal error
 * text (a failed reduction says only that it failed). Names and the signed statements stay.
 */
export function shareRecordView(r: TestRecord) {
  const view = recordView(r);
  return {
    ...view,
    reduction: view.reduction
      ? {
          ...view.reduction,
          error: view.reduction.error ? 'The reduction did not finish; the engineer has the details.' : null,
        }
      : null,
    result: view.result
      ? {
          ...view.result,
          gauges: view.result.gauges.map((g) =>
            g.disposition ? { ...g, disposition: withoutEmail(g.disposition as LatestDisposition) } : g,
          ),
        }
      : null,
    dispositions: view.dispositions.map(withoutEmail),
    signatures: view.signatures.map(({ email: _email, ...s }) => s),
  };
}

function withoutEmail<T extends { byEmail?: string }>(d: T): Omit<T, 'byEmail'> {
  const { byEmail: _byEmail, ...rest } = d;
  return rest;
}
