import { and, asc, desc, eq, gt, gte, isNull, like, lte, sql, type SQL } from 'drizzle-orm';
import type { Conn } from '../client.server';
import { auditChainHeads, auditEvents, type AuditEvent } from '../schema';
import { GENESIS_HASH, auditRowHash, type ChainedContent } from './audit-chain';
import { transaction } from './transaction';

export interface AuditInput {
  userId?: number | null;
  actor: string;
  action: string;
  testId?: number | null;
  details?: Record<string, unknown>;
}

/** What the hash covers of a stored row, at place `seq` of its chain. */
const chainedContent = (r: AuditEvent, seq: number): ChainedContent => ({
  chainKey: r.chainKey,
  seq,
  at: r.at,
  userId: r.userId,
  actor: r.actor,
  action: r.action,
  testId: r.testId,
  details: r.details,
});

/** Lock the head of a chain (created on first use) and return where the next row goes. */
async function lockChainHead(tx: Conn, chainKey: number): Promise<{ lastSeq: number; lastHash: string }> {
  // ON DUPLICATE KEY takes the row's exclusive lock at once (INSERT IGNORE would take a shared
  // one first, and two appenders could deadlock upgrading it)
  await tx.execute(
    sql`INSERT INTO ${auditChainHeads} (chain_key, last_seq, last_hash) VALUES (${chainKey}, 0, ${GENESIS_HASH})
        ON DUPLICATE KEY UPDATE chain_key = chain_key`,
  );
  const [head] = await tx.select().from(auditChainHeads).where(eq(auditChainHeads.chainKey, chainKey)).for('update');
  if (!head) throw new Error(`audit chain ${chainKey} has no head`);
  return head;
}

/**
 * Append one event to its chain. Pass the transaction of the change it records, so both commit
 * together (inside it, with no savepoint); given the pool, it runs in a transaction of its own. The table has no update or delete
 * path anywhere in the code, and triggers refuse both.
 */
export async function appendAuditEvent(db: Conn, e: AuditInput): Promise<void> {
  await transaction(db, async (tx) => {
    const chainKey = e.testId ?? 0;
    const head = await lockChainHead(tx, chainKey);
    const row: ChainedContent = {
      chainKey,
      seq: head.lastSeq + 1,
      at: new Date(),
      userId: e.userId ?? null,
      actor: e.actor.slice(0, 254),
      action: e.action.slice(0, 60),
      testId: e.testId ?? null,
      details: JSON.parse(JSON.stringify(e.details ?? {})) as Record<string, unknown>,
    };
    const hash = auditRowHash(head.lastHash, row);
    await tx.insert(auditEvents).values({
      at: row.at,
      userId: row.userId,
      actor: row.actor,
      action: row.action,
      testId: row.testId,
      details: row.details,
      chainKey,
      chainSeq: row.seq,
      prevHash: head.lastHash,
      hash,
    });
    await tx
      .update(auditChainHeads)
      .set({ lastSeq: row.seq, lastHash: hash })
      .where(eq(auditChainHeads.chainKey, chainKey));
  });
}

/**
 * Give rows written before the chain existed their place in it, oldest first (the triggers allow
 * this once per row: only the hash columns of a row without a hash may be set). Returns how many.
 */
export async function sealUnchainedAuditRows(db: Conn): Promise<number> {
  let sealed = 0;
  for (;;) {
    const batch = await db
      .select()
      .from(auditEvents)
      .where(isNull(auditEvents.hash))
      .orderBy(asc(auditEvents.id))
      .limit(200);
    if (!batch.length) return sealed;
    for (const r of batch) {
      await transaction(db, async (tx) => {
        const head = await lockChainHead(tx, r.chainKey);
        const seq = head.lastSeq + 1;
        const hash = auditRowHash(head.lastHash, chainedContent(r, seq));
        await tx
          .update(auditEvents)
          .set({ chainSeq: seq, prevHash: head.lastHash, hash })
          .where(and(eq(auditEvents.id, r.id), isNull(auditEvents.hash)));
        await tx
          .update(auditChainHeads)
          .set({ lastSeq: seq, lastHash: hash })
          .where(eq(auditChainHeads.chainKey, r.chainKey));
      });
      sealed++;
    }
  }
}

export interface ChainCheck {
  ok: boolean;
  /** rows checked */
  rows: number;
  /** id of the first row that does not fit the chain, or null */
  firstBadRow: number | null;
  /** what is wrong, in words, or null */
  problem: string | null;
}

/** Check one chain end to end: order, links and every row's hash, then the recorded head. */
export async function verifyAuditChain(db: Conn, chainKey: number): Promise<ChainCheck> {
  let prevHash = GENESIS_HASH;
  let expectSeq = 1;
  let rows = 0;
  const bad = (id: number, problem: string): ChainCheck => ({ ok: false, rows, firstBadRow: id, problem });
  const unsealed = await db
    .select({ id: auditEvents.id })
    .from(auditEvents)
    .where(and(eq(auditEvents.chainKey, chainKey), isNull(auditEvents.chainSeq)))
    .orderBy(asc(auditEvents.id))
    .limit(1);
  if (unsealed[0]) return bad(unsealed[0].id, 'a row carries no place in the chain');
  for (;;) {
    const batch = await db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.chainKey, chainKey), gt(auditEvents.chainSeq, expectSeq - 1)))
      .orderBy(asc(auditEvents.chainSeq))
      .limit(1000);
    for (const r of batch) {
      if (r.chainSeq !== expectSeq) return bad(r.id, `row ${expectSeq} of the chain is missing`);
      if (r.prevHash !== prevHash) return bad(r.id, 'the row does not link to the row before it');
      const hash = auditRowHash(prevHash, chainedContent(r, r.chainSeq));
      if (hash !== r.hash) return bad(r.id, 'the row was changed after it was written');
      prevHash = hash;
      expectSeq++;
      rows++;
    }
    if (batch.length < 1000) break;
  }
  const [head] = await db.select().from(auditChainHeads).where(eq(auditChainHeads.chainKey, chainKey));
  const headSeq = head?.lastSeq ?? 0;
  if (headSeq !== rows || (head?.lastHash ?? GENESIS_HASH) !== prevHash)
    return { ok: false, rows, firstBadRow: null, problem: `the chain should hold ${headSeq} rows; ${rows} are there` };
  return { ok: true, rows, firstBadRow: null, problem: null };
}

/** Every chain key that has rows (for checking the whole trail). */
export async function listAuditChainKeys(db: Conn): Promise<number[]> {
  const rows = await db
    .selectDistinct({ k: auditEvents.chainKey })
    .from(auditEvents)
    .orderBy(asc(auditEvents.chainKey));
  return rows.map((r) => r.k);
}

export function listAuditEvents(
  db: Conn,
  f: { testId?: number; action?: string; actor?: string; from?: Date; to?: Date; limit?: number; offset?: number },
) {
  const where: SQL[] = [];
  if (f.testId) where.push(eq(auditEvents.testId, f.testId));
  if (f.action) where.push(eq(auditEvents.action, f.action));
  if (f.actor) where.push(like(auditEvents.actor, `%${f.actor}%`));
  if (f.from) where.push(gte(auditEvents.at, f.from));
  if (f.to) where.push(lte(auditEvents.at, f.to));
  return db
    .select({
      id: auditEvents.id,
      at: auditEvents.at,
      userId: auditEvents.userId,
      actor: auditEvents.actor,
      action: auditEvents.action,
      testId: auditEvents.testId,
      details: auditEvents.details,
      chainSeq: auditEvents.chainSeq,
      hash: auditEvents.hash,
    })
    .from(auditEvents)
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(auditEvents.at), desc(auditEvents.id))
    .limit(Math.min(f.limit ?? 200, 1000))
    .offset(f.offset ?? 0);
}
