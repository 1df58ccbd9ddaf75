import { endpoint, idParam, json, requireRole, roleSets } from '../../../../server/http';
import { loadTestRecord, recordView } from '../../../../server/record.server';

/** GET /api/tests/{id}/record — the whole record: result with dispositions, signatures, logs. */
export const GET = endpoint(async (ctx) => {
  requireRole(ctx, ...roleSets.anyone);
  return json(recordView(await loadTestRecord(idParam(ctx.params.id, 'test'))));
});
