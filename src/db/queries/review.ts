import { and, asc, desc, eq, isNull, lte, sql } from 'drizzle-orm';
import type { Conn } from '../client.server';
import {
  dispositions,
  outbox,
  releaseSnapshots,
  shareLinks,
  signatures,
  users,
  type DispositionOutcome,
} from '../schema';
import { insertedId } from './inserted-id';

export async function insertDisposition(
  db: Conn,
  d: {
    testId: number;
    reductionId: number;
    gaugeId: string;
    outcome: DispositionOutcome;
    reason: string;
    userId: number;
  },
) {
  return insertedId(await db.insert(dispositions).values(d).$returningId());
}

/** Every disposition of a reduction, oldest first, with who made it (the latest per gauge counts). */
export const listDispositions = (db: Conn, reductionId: number) =>
  db
    .select({
      id: dispositions.id,
      gaugeId: dispositions.gaugeId,
      outcome: dispositions.outcome,
      reason: dispositions.reason,
      createdAt: dispositions.createdAt,
      userId: dispositions.userId,
      by: users.name,
      byEmail: users.email,
    })
    .from(dispositions)
    .innerJoin(users, eq(users.id, dispositions.userId))
    .where(eq(dispositions.reductionId, reductionId))
    .orderBy(asc(dispositions.id));

export async function insertSignature(
  db: Conn,
  s: { testId: number; reductionId: number; kind: 'review' | 'release'; userId: number; statement: string },
) {
  return insertedId(await db.insert(signatures).values(s).$returningId());
}

export const listSignatures = (db: Conn, testId: number) =>
  db
    .select({
      id: signatures.id,
      kind: signatures.kind,
      reductionId: signatures.reductionId,
      statement: signatures.statement,
      createdAt: signatures.createdAt,
      userId: signatures.userId,
      name: users.name,
      email: users.email,
    })
    .from(signatures)
    .innerJoin(users, eq(users.id, signatures.userId))
    .where(eq(signatures.testId, testId))
    .orderBy(asc(signatures.id));

export async function insertShareLink(
  db: Conn,
  l: { testId: number; tokenHash: string; email: string | null; createdBy: number; expiresAt: Date },
) {
  return insertedId(await db.insert(shareLinks).values(l).$returningId());
}

export const findShareLinkByHash = (db: Conn, tokenHash: string) =>
  db.query.shareLinks.findFirst({ where: eq(shareLinks.tokenHash, tokenHash) });
export const findShareLink = (db: Conn, id: number) => db.query.shareLinks.findFirst({ where: eq(shareLinks.id, id) });

export const listShareLinks = (db: Conn, testId: number) =>
  db
    .select({
      id: shareLinks.id,
      email: shareLinks.email,
      createdAt: shareLinks.createdAt,
      expiresAt: shareLinks.expiresAt,
      revokedAt: shareLinks.revokedAt,
      lastUsedAt: shareLinks.lastUsedAt,
      useCount: shareLinks.useCount,
      createdBy: users.name,
    })
    .from(shareLinks)
    .innerJoin(users, eq(users.id, shareLinks.createdBy))
    .where(eq(shareLinks.testId, testId))
    .orderBy(desc(shareLinks.id));

export async function revokeShareLink(db: Conn, id: number) {
  const [res] = await db
    .update(shareLinks)
    .set({ revokedAt: new Date() })
    .where(and(eq(shareLinks.id, id), isNull(shareLinks.revokedAt)));
  return res.affectedRows > 0;
}

export async function touchShareLink(db: Conn, id: number) {
  await db
    .update(shareLinks)
    .set({ lastUsedAt: new Date(), useCount: sql`${shareLinks.useCount} + 1` })
    .where(eq(shareLinks.id, id));
}

export async function enqueueMail(
  db: Conn,
  m: { toAddress: string; subject: string; textBody: string; testId?: number | null },
) {
  return insertedId(
    await db
      .insert(outbox)
      .values({ ...m, testId: m.testId ?? null })
      .$returningId(),
  );
}

/** Messages due for (another) attempt, oldest first. */
export const listDueMail = (db: Conn, limit = 20) =>
  db
    .select()
    .from(outbox)
    .where(and(eq(outbox.status, 'pending'), lte(outbox.nextAttemptAt, new Date())))
    .orderBy(asc(outbox.id))
    .limit(limit);

/** Claim one message for sending (pending and due) by pushing its next attempt out; false if another sender has it. */
export async function claimMail(db: Conn, id: number, holdMs: number) {
  const [res] = await db
    .update(outbox)
    .set({ nextAttemptAt: new Date(Date.now() + holdMs), attempts: sql`${outbox.attempts} + 1` })
    .where(and(eq(outbox.id, id), eq(outbox.status, 'pending'), lte(outbox.nextAttemptAt, new Date())));
  return res.affectedRows > 0;
}

export async function markMailSent(db: Conn, id: number) {
  await db.update(outbox).set({ status: 'sent', sentAt: new Date(), lastError: null }).where(eq(outbox.id, id));
}

export async function markMailRetry(db: Conn, id: number, error: string, nextAttemptAt: Date, giveUp: boolean) {
  await db
    .update(outbox)
    .set({ lastError: error.slice(0, 2000), nextAttemptAt, status: giveUp ? 'failed' : 'pending' })
    .where(eq(outbox.id, id));
}

export const listOutbox = (db: Conn, limit = 200) => db.select().from(outbox).orderBy(desc(outbox.id)).limit(limit);

/** The frozen record of a released test (written once, in the release's transaction). */
export const findReleaseSnapshot = (db: Conn, testId: number) =>
  db.query.releaseSnapshots.findFirst({ where: eq(releaseSnapshots.testId, testId) });

export async function insertReleaseSnapshot(
  db: Conn,
  s: { testId: number; reductionId: number; body: unknown; sha256: string },
) {
  await db.insert(releaseSnapshots).values(s);
}
