// The record frozen at release (DESIGN 6): everything the record shows — plan, vessel, material,
// the released reduction's result with dispositions applied, signatures, logs — as canonical JSON
// with its SHA-256, written once in the release's transaction. A released test's exports, report
// page and share link read only this, so editing the vessel or material later changes nothing.
import { createHash } from 'node:crypto';
import type { Conn } from '../db/client.server';
import { findReleaseSnapshot } from '../db/queries/review';
import { canonicalJson } from '../lib/canonical-json';
import type { TestRecord } from './record.server';

const FORMAT = 1;

interface FrozenBody {
  format: number;
  frozenAt: string;
  record: unknown;
}

export function snapshotHash(body: unknown): string {
  return createHash('sha256').update(canonicalJson(body), 'utf8').digest('hex');
}

/**
 * The snapshot body of a record at release and its SHA-256. The record is the one loaded inside
 * the release's transaction (with the release signature); its status is set to `released`.
 */
export function freezeRecord(r: TestRecord, releasedAt: Date): { body: FrozenBody; sha256: string } {
  const record: TestRecord = {
    ...r,
    test: { ...r.test, status: 'released', updatedAt: releasedAt, lastActivityAt: releasedAt },
    // the plan is in the test row already; the reduction keeps only which logs it read
    reduction: r.reduction
      ? { ...r.reduction, parameters: { plan: null, logIds: r.reduction.parameters.logIds } }
      : null,
  };
  const body: FrozenBody = {
    format: FORMAT,
    frozenAt: releasedAt.toISOString(),
    record: JSON.parse(JSON.stringify(record)) as unknown,
  };
  return { body, sha256: snapshotHash(body) };
}

const date = (v: unknown): Date => new Date(v as string);
const dateOrNull = (v: unknown): Date | null => (v === null || v === undefined ? null : new Date(v as string));

/** The record back from a snapshot body, with its dates as Dates again. */
export function thawRecord(body: unknown): TestRecord {
  const b = body as FrozenBody;
  if (b?.format !== FORMAT) throw new Error(`release snapshot format ${String(b?.format)} is not known`);
  const r = structuredClone(b.record) as TestRecord;
  r.test.createdAt = date(r.test.createdAt);
  r.test.updatedAt = date(r.test.updatedAt);
  r.test.lastActivityAt = date(r.test.lastActivityAt);
  r.vessel.createdAt = date(r.vessel.createdAt);
  r.vessel.updatedAt = date(r.vessel.updatedAt);
  if (r.material) r.material.createdAt = date(r.material.createdAt);
  if (r.reduction) {
    r.reduction.createdAt = date(r.reduction.createdAt);
    r.reduction.startedAt = dateOrNull(r.reduction.startedAt);
    r.reduction.finishedAt = dateOrNull(r.reduction.finishedAt);
    r.reduction.leaseUntil = dateOrNull(r.reduction.leaseUntil);
    r.reduction.notBefore = dateOrNull(r.reduction.notBefore);
  }
  for (const d of r.dispositions) d.at = date(d.at);
  for (const g of r.gauges) {
    const d = g.disposition as { at?: unknown } | undefined;
    if (d && d.at !== undefined) d.at = date(d.at);
  }
  for (const d of r.dispositionHistory) d.createdAt = date(d.createdAt);
  for (const s of r.signatures) s.createdAt = date(s.createdAt);
  for (const l of [...r.logs, ...r.reducedLogs]) l.createdAt = date(l.createdAt);
  return r;
}

/** Thrown when a stored snapshot no longer matches its SHA-256: the record is not served. */
export class SnapshotMismatch extends Error {}

const cache = new Map<number, { sha256: string; record: TestRecord }>();
const CACHE_ENTRIES = 16;

/**
 * The frozen record of a released test, checked against its SHA-256, or null when the test has
 * none. Snapshots never change (triggers refuse it), so a checked one is kept in memory.
 */
export async function loadFrozenRecord(db: Conn, testId: number): Promise<TestRecord | null> {
  const snap = await findReleaseSnapshot(db, testId);
  if (!snap) return null;
  const hit = cache.get(testId);
  if (hit && hit.sha256 === snap.sha256) return structuredClone(hit.record);
  if (snapshotHash(snap.body) !== snap.sha256)
    throw new SnapshotMismatch(`the frozen record of test ${testId} does not match its SHA-256`);
  const record = thawRecord(snap.body);
  cache.set(testId, { sha256: snap.sha256, record });
  if (cache.size > CACHE_ENTRIES) cache.delete(cache.keys().next().value!);
  return structuredClone(record);
}
