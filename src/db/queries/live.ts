// Live sessions, their chunks and events (DESIGN 8). Events are inserted with INSERT IGNORE on
// (session, ordinal): two app servers deriving the same events from the same bytes store one row.
import { and, asc, desc, eq, gt, inArray, or, sql } from 'drizzle-orm';
import type { Conn } from '../client.server';
import {
  liveChunks,
  liveEvents,
  liveSessions,
  liveWarningMails,
  type LiveEventType,
  type LiveSessionStatus,
} from '../schema';
import { insertedId } from './inserted-id';

export async function insertLiveSession(db: Conn, testId: number, openedBy: number, plan: unknown): Promise<number> {
  return insertedId(await db.insert(liveSessions).values({ testId, openedBy, plan }).$returningId());
}

export const findLiveSession = (db: Conn, id: number) =>
  db.query.liveSessions.findFirst({ where: eq(liveSessions.id, id) });

/** The session row locked for this transaction (SELECT … FOR UPDATE). */
export async function lockLiveSession(db: Conn, id: number) {
  const [row] = await db.select().from(liveSessions).where(eq(liveSessions.id, id)).for('update');
  return row;
}

export const findOpenLiveSession = (db: Conn, testId: number) =>
  db.query.liveSessions.findFirst({ where: and(eq(liveSessions.testId, testId), eq(liveSessions.status, 'open')) });

/** The newest session of a test, open or not. */
export const findLatestLiveSession = (db: Conn, testId: number) =>
  db.query.liveSessions.findFirst({ where: eq(liveSessions.testId, testId), orderBy: desc(liveSessions.id) });

export async function updateLiveSession(
  db: Conn,
  id: number,
  patch: Partial<{
    status: LiveSessionStatus;
    nextChunk: number;
    bytes: number;
    rows: number;
    sha256: string;
    logId: number;
    reductionId: number;
    finishedAt: Date;
  }>,
) {
  await db.update(liveSessions).set(patch).where(eq(liveSessions.id, id));
}

export const listLiveChunks = (db: Conn, sessionId: number) =>
  db.select().from(liveChunks).where(eq(liveChunks.sessionId, sessionId)).orderBy(asc(liveChunks.n));

export const findLiveChunk = (db: Conn, sessionId: number, n: number) =>
  db.query.liveChunks.findFirst({ where: and(eq(liveChunks.sessionId, sessionId), eq(liveChunks.n, n)) });

export async function insertLiveChunk(
  db: Conn,
  c: { sessionId: number; n: number; bytes: number; rows: number; sha256: string; objectKey: string },
) {
  await db.insert(liveChunks).values(c);
}

export async function deleteLiveChunks(db: Conn, sessionId: number) {
  await db.delete(liveChunks).where(eq(liveChunks.sessionId, sessionId));
}

export interface NewLiveEvent {
  ordinal: number;
  type: LiveEventType;
  data: Record<string, unknown>;
}

/** Insert events that are not stored yet; answers the ordinals this call inserted. */
export async function insertLiveEvents(db: Conn, sessionId: number, events: readonly NewLiveEvent[]) {
  if (!events.length) return [];
  const have = await db
    .select({ ordinal: liveEvents.ordinal })
    .from(liveEvents)
    .where(
      and(
        eq(liveEvents.sessionId, sessionId),
        inArray(
          liveEvents.ordinal,
          events.map((e) => e.ordinal),
        ),
      ),
    );
  const stored = new Set(have.map((r) => r.ordinal));
  const fresh = events.filter((e) => !stored.has(e.ordinal));
  if (fresh.length)
    await db
      .insert(liveEvents)
      .ignore()
      .values(fresh.map((e) => ({ sessionId, ordinal: e.ordinal, type: e.type, data: e.data })));
  return fresh.map((e) => e.ordinal);
}

export async function maxLiveEventOrdinal(db: Conn, sessionId: number): Promise<number> {
  const [row] = await db
    .select({ n: sql<number | null>`max(${liveEvents.ordinal})` })
    .from(liveEvents)
    .where(eq(liveEvents.sessionId, sessionId));
  return Number(row?.n ?? 0);
}

/**
 * Events of a test's sessions after the cursor (session, ordinal), in order: what an event
 * stream sends next. A cursor of (0, 0) starts at the first event of `fromSession` and later ones.
 */
export async function liveEventsAfter(
  db: Conn,
  testId: number,
  cursor: { sessionId: number; ordinal: number },
  limit = 200,
) {
  return db
    .select({
      sessionId: liveEvents.sessionId,
      ordinal: liveEvents.ordinal,
      type: liveEvents.type,
      data: liveEvents.data,
    })
    .from(liveEvents)
    .innerJoin(liveSessions, eq(liveSessions.id, liveEvents.sessionId))
    .where(
      and(
        eq(liveSessions.testId, testId),
        or(
          gt(liveEvents.sessionId, cursor.sessionId),
          and(eq(liveEvents.sessionId, cursor.sessionId), gt(liveEvents.ordinal, cursor.ordinal)),
        ),
      ),
    )
    .orderBy(asc(liveEvents.sessionId), asc(liveEvents.ordinal))
    .limit(limit);
}

/** Claim the e-mail of a (gauge, code) warning for a session: true the first time only. */
export async function claimWarningMail(db: Conn, sessionId: number, gaugeId: string, code: string): Promise<boolean> {
  const [res] = await db
    .insert(liveWarningMails)
    .ignore()
    .values({ sessionId, gaugeId: gaugeId.slice(0, 60), code });
  return (res as { affectedRows?: number }).affectedRows === 1;
}
