// Counts for readiness and metrics: the reduction queue, job durations, the outbox backlog,
// and which migrations the database has applied. Cheap aggregates on indexed columns.
import { and, eq, inArray, isNotNull, sql } from 'drizzle-orm';
import type { Db } from '../client.server';
import { outbox, reductions } from '../schema';

/** Jobs waiting and running, and the age of the oldest waiting one (seconds, 0 when none). */
export async function reductionQueueDepth(
  db: Db,
): Promise<{ queued: number; running: number; oldestQueuedSeconds: number }> {
  const rows = await db
    .select({
      status: reductions.status,
      n: sql<number>`count(*)`,
      oldest: sql<number | null>`timestampdiff(second, min(${reductions.createdAt}), utc_timestamp())`,
    })
    .from(reductions)
    .where(inArray(reductions.status, ['queued', 'running']))
    .groupBy(reductions.status);
  const of = (s: string) => rows.find((r) => r.status === s);
  return {
    queued: Number(of('queued')?.n ?? 0),
    running: Number(of('running')?.n ?? 0),
    oldestQueuedSeconds: Math.max(0, Number(of('queued')?.oldest ?? 0)),
  };
}

export interface DurationHistogram {
  status: 'done' | 'failed';
  /** cumulative counts, one per bound in `bounds` */
  buckets: number[];
  count: number;
  sumSeconds: number;
}

/**
 * Durations of every finished job's last attempt (claim to finish), as cumulative counts per
 * upper bound in seconds. Rows are never deleted, so the counts only grow, as a histogram's must.
 */
export async function reductionDurationHistogram(db: Db, bounds: readonly number[]): Promise<DurationHistogram[]> {
  const seconds = sql`timestampdiff(microsecond, ${reductions.startedAt}, ${reductions.finishedAt}) / 1e6`;
  const rows = await db
    .select({
      status: reductions.status,
      n: sql<number>`count(*)`,
      sum: sql<number>`coalesce(sum(${seconds}), 0)`,
      ...Object.fromEntries(bounds.map((b, i) => [`b${i}`, sql<number>`sum(${seconds} <= ${b})`])),
    })
    .from(reductions)
    .where(
      and(
        inArray(reductions.status, ['done', 'failed']),
        isNotNull(reductions.startedAt),
        isNotNull(reductions.finishedAt),
      ),
    )
    .groupBy(reductions.status);
  return rows.map((r) => {
    const rec = r as unknown as Record<string, unknown>;
    return {
      status: r.status as 'done' | 'failed',
      buckets: bounds.map((_, i) => Number(rec[`b${i}`] ?? 0)),
      count: Number(r.n),
      sumSeconds: Number(r.sum),
    };
  });
}

/** Messages not sent yet (waiting or backing off). */
export async function outboxBacklog(db: Db): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`count(*)` })
    .from(outbox)
    .where(eq(outbox.status, 'pending'));
  return Number(row?.n ?? 0);
}

/** `created_at` (the migration folder's timestamp) of the newest migration the database has applied. */
export async function newestAppliedMigrationMillis(db: Db): Promise<number | null> {
  try {
    const [rows] = (await db.execute(sql`select max(created_at) as newest from __drizzle_migrations`)) as unknown as [
      { newest: number | string | null }[],
    ];
    const v = rows[0]?.newest;
    return v === null || v === undefined ? null : Number(v);
  } catch (err) {
    // a database that was never migrated has no migrations table
    const code = (err as { code?: string; cause?: { code?: string } }).cause?.code ?? (err as { code?: string }).code;
    if (code === 'ER_NO_SUCH_TABLE') return null;
    throw err;
  }
}
