import { getDb } from '../../../../db/client.server';
import { listReductions } from '../../../../db/queries/reductions';
import { endpoint, idParam, json, requirePermission } from '../../../../server/http';
import { loadTest } from '../../../../server/plans.server';
import { queueTestReduction } from '../../../../server/reductions.server';

/** GET /api/tests/{id}/reductions — every reduction of the test, newest first. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const id = idParam(ctx.params.id, 'test');
  await loadTest(id);
  return json({ items: await listReductions(getDb(), id) });
});

/** POST /api/tests/{id}/reductions — technician+; queues a reduction of every log with the current plan. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'upload', { tokenWrite: 'upload' });
  const id = await queueTestReduction(user, idParam(ctx.params.id, 'test'));
  return json({ id }, 202, { location: `/api/reductions/${id}` });
});
