import { checkTestAudit } from '../../../../../server/audit-check.server';
import { endpoint, idParam, json, requirePermission } from '../../../../../server/http';
import { loadTest } from '../../../../../server/plans.server';

/**
 * GET /api/tests/{id}/audit/verify — qa, admin: `{ok, rows, firstBadRow, problem, snapshot}`, the
 * test's audit hash chain checked end to end (and a released test's frozen record against its hash).
 */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'audit');
  const id = idParam(ctx.params.id, 'test');
  await loadTest(id);
  return json(await checkTestAudit(id));
});
