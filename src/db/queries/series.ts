// Where a test's stored time history is: one indexed read, so a series request that the cache
// or the browser can answer costs no more than a one-row read.
import { and, eq } from 'drizzle-orm';
import type { Db } from '../client.server';
import { reductions, tests } from '../schema';

export interface SeriesSourceRow {
  testExists: boolean;
  reductionId: number | null;
  status: string | null;
  seriesKey: string | null;
  /** whether the reduction is the test's current one */
  current: boolean;
}

/** The test's current reduction, or the named reduction when it belongs to the test. */
export async function findSeriesSource(db: Db, testId: number, reductionId: number | null): Promise<SeriesSourceRow> {
  const [row] = await db
    .select({
      currentReductionId: tests.currentReductionId,
      reductionId: reductions.id,
      status: reductions.status,
      seriesKey: reductions.seriesKey,
    })
    .from(tests)
    .leftJoin(
      reductions,
      and(
        eq(reductions.testId, tests.id),
        reductionId === null ? eq(reductions.id, tests.currentReductionId) : eq(reductions.id, reductionId),
      ),
    )
    .where(eq(tests.id, testId))
    .limit(1);
  if (!row) return { testExists: false, reductionId: null, status: null, seriesKey: null, current: false };
  return {
    testExists: true,
    reductionId: row.reductionId,
    status: row.status,
    seriesKey: row.seriesKey,
    current: row.reductionId !== null && row.reductionId === row.currentReductionId,
  };
}
