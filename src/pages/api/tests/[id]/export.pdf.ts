import { pdfResponse } from '../../../../server/exports.server';
import { endpoint, idParam, requireRole, roleSets } from '../../../../server/http';
import { loadTestRecord } from '../../../../server/record.server';

/** GET /api/tests/{id}/export.pdf — the report (DRAFT on every page until released). */
export const GET = endpoint(async (ctx) => {
  requireRole(ctx, ...roleSets.anyone);
  return pdfResponse(await loadTestRecord(idParam(ctx.params.id, 'test')));
});
