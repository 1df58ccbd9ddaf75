import { pdfResponse } from '../../../../server/exports.server';
import { endpoint, idParam, requirePermission } from '../../../../server/http';
import { loadTestRecord } from '../../../../server/record.server';

/** GET /api/tests/{id}/export.pdf — the report (DRAFT on every page until released). */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  return pdfResponse(await loadTestRecord(idParam(ctx.params.id, 'test')), ctx.request);
});
