import { csvResponse } from '../../../../server/exports.server';
import { endpoint, idParam, requirePermission } from '../../../../server/http';
import { loadTestRecord } from '../../../../server/record.server';

/** GET /api/tests/{id}/export.csv — the pass/flag summary (DRAFT until released). */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  return csvResponse(await loadTestRecord(idParam(ctx.params.id, 'test')));
});
