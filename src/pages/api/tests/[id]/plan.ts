import { planBody } from '../../../../server/api/schemas';
import { endpoint, idParam, json, readJson, requirePermission } from '../../../../server/http';
import { loadTest, replacePlan } from '../../../../server/plans.server';

/** GET /api/tests/{id}/plan — the plan exactly as it was imported or last saved. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const test = await loadTest(idParam(ctx.params.id, 'test'));
  return json(test.plan, 200, { 'content-disposition': `inline; filename="test-${test.id}-plan.json"` });
});

/** PUT /api/tests/{id}/plan — engineer; the body is the plan (DESIGN 4.1). 422 lists every problem. */
export const PUT = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'plan');
  const id = idParam(ctx.params.id, 'test');
  const plan = await readJson(ctx.request, planBody);
  await replacePlan(user, id, plan);
  return json({ id, saved: true });
});
