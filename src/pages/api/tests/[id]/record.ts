import { endpoint, idParam, json, requirePermission } from '../../../../server/http';
import { loadTestRecord, recordView } from '../../../../server/record.server';

/** GET /api/tests/{id}/record — the whole record: result with dispositions, signatures, logs. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  return json(recordView(await loadTestRecord(idParam(ctx.params.id, 'test'))));
});
