import { getDb } from '../../../../db/client.server';
import { listLogs } from '../../../../db/queries/logs';
import { listReductions, queueReduction } from '../../../../db/queries/reductions';
import { updateTest } from '../../../../db/queries/tests';
import { auditBy } from '../../../../server/audit.server';
import { AppError } from '../../../../server/errors';
import { endpoint, idParam, json, requirePermission } from '../../../../server/http';
import { loadTest, validatePlan } from '../../../../server/plans.server';

/** GET /api/tests/{id}/reductions — every reduction of the test, newest first. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const id = idParam(ctx.params.id, 'test');
  await loadTest(id);
  return json({ items: await listReductions(getDb(), id) });
});

/** POST /api/tests/{id}/reductions — technician+; queues a reduction of every log with the current plan. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'upload');
  const test = await loadTest(idParam(ctx.params.id, 'test'), true);
  validatePlan(test.plan);
  const db = getDb();
  const logs = await listLogs(db, test.id);
  if (!logs.length) throw new AppError('no-logs', 'Upload a log before starting a reduction.');
  const id = await queueReduction(db, {
    testId: test.id,
    plan: test.plan,
    logIds: logs.map((l) => l.id),
    queuedBy: user.id,
  });
  await updateTest(db, test.id, {});
  await auditBy(user, 'reduction-queued', test.id, { reductionId: id, logIds: logs.map((l) => l.id) });
  return json({ id }, 202, { location: `/api/reductions/${id}` });
});
