import { getDb } from '../../../../db/client.server';
import { findReduction } from '../../../../db/queries/reductions';
import { endpoint, idParam, json, requirePermission } from '../../../../server/http';
import { loadTest } from '../../../../server/plans.server';
import { readSeries } from '../../../../server/series.server';

/** GET /api/tests/{id}/series?from&to&points — pressure and every channel, min/max per bucket. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const test = await loadTest(idParam(ctx.params.id, 'test'));
  const reduction = test.currentReductionId ? await findReduction(getDb(), test.currentReductionId) : undefined;
  return json(await readSeries(reduction?.seriesKey ?? null, ctx.url));
});
