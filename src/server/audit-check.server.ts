// Checking the record end to end: a test's audit hash chain (every row links to the one before
// and still has the content it was written with), and for a released test its frozen record
// against the SHA-256 stored with it.
import { getDb, type Conn } from '../db/client.server';
import { listAuditChainKeys, verifyAuditChain, type ChainCheck } from '../db/queries/audit';
import { findReleaseSnapshot } from '../db/queries/review';
import { snapshotHash } from './snapshot.server';

export interface TestAuditCheck extends ChainCheck {
  /** the frozen record of a released test: its stored SHA-256 and whether the body still matches */
  snapshot: { sha256: string; ok: boolean } | null;
}

/** GET /api/tests/{id}/audit/verify: the test's chain and, once released, its frozen record. */
export async function checkTestAudit(testId: number, db: Conn = getDb()): Promise<TestAuditCheck> {
  const chain = await verifyAuditChain(db, testId);
  const snap = await findReleaseSnapshot(db, testId);
  const snapshot = snap ? { sha256: snap.sha256, ok: snapshotHash(snap.body) === snap.sha256 } : null;
  return { ...chain, ok: chain.ok && (snapshot?.ok ?? true), snapshot };
}

/** Every chain of the trail (the audit page's full check): the broken ones, and how many rows. */
export async function checkWholeAudit(db: Conn = getDb()) {
  const keys = await listAuditChainKeys(db);
  let rows = 0;
  const broken: ({ chainKey: number } & ChainCheck)[] = [];
  for (const k of keys) {
    const c = await verifyAuditChain(db, k);
    rows += c.rows;
    if (!c.ok) broken.push({ chainKey: k, ...c });
  }
  return { ok: broken.length === 0, chains: keys.length, rows, broken };
}
