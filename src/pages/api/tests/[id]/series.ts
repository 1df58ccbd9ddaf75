import { endpoint, idParam, requirePermission } from '../../../../server/http';
import { seriesResponse } from '../../../../server/series.server';

/** GET /api/tests/{id}/series?from&to&points&channels&reduction — min/max per bucket, compact columns. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  return seriesResponse(ctx.request, ctx.url, idParam(ctx.params.id, 'test'));
});
