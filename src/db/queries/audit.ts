import { and, desc, eq, gte, like, lte, type SQL } from 'drizzle-orm';
import type { Db } from '../client.server';
import { auditEvents } from '../schema';

export interface AuditInput {
  userId?: number | null;
  actor: string;
  action: string;
  testId?: number | null;
  details?: Record<string, unknown>;
}

/** Append one event. The table has no update or delete path anywhere in the code. */
export async function appendAuditEvent(db: Db, e: AuditInput): Promise<void> {
  await db.insert(auditEvents).values({
    userId: e.userId ?? null,
    actor: e.actor,
    action: e.action,
    testId: e.testId ?? null,
    details: e.details ?? {},
  });
}

export function listAuditEvents(
  db: Db,
  f: { testId?: number; action?: string; actor?: string; from?: Date; to?: Date; limit?: number; offset?: number },
) {
  const where: SQL[] = [];
  if (f.testId) where.push(eq(auditEvents.testId, f.testId));
  if (f.action) where.push(eq(auditEvents.action, f.action));
  if (f.actor) where.push(like(auditEvents.actor, `%${f.actor}%`));
  if (f.from) where.push(gte(auditEvents.at, f.from));
  if (f.to) where.push(lte(auditEvents.at, f.to));
  return db
    .select()
    .from(auditEvents)
    .where(where.length ? and(...where) : undefined)
    .orderBy(desc(auditEvents.at), desc(auditEvents.id))
    .limit(Math.min(f.limit ?? 200, 1000))
    .offset(f.offset ?? 0);
}
