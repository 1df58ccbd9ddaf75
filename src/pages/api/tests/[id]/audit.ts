import { getDb } from '../../../../db/client.server';
import { listAuditEvents } from '../../../../db/queries/audit';
import { endpoint, idParam, json, requirePermission } from '../../../../server/http';
import { readPage } from '../../../../server/pagination';
import { loadTest } from '../../../../server/plans.server';

/** GET /api/tests/{id}/audit — qa, admin: every event of the test, newest first. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'audit');
  const id = idParam(ctx.params.id, 'test');
  await loadTest(id);
  const page = readPage(ctx.url);
  return json({ items: await listAuditEvents(getDb(), { testId: id, ...page }), ...page });
});
