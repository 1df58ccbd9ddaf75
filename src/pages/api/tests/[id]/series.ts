import { endpoint, idParam, json, requirePermission } from '../../../../server/http';
import { seriesKeyOf } from '../../../../server/record.server';
import { readSeries } from '../../../../server/series.server';

/** GET /api/tests/{id}/series?from&to&points — pressure and every channel, min/max per bucket. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  return json(await readSeries(await seriesKeyOf(idParam(ctx.params.id, 'test')), ctx.url));
});
