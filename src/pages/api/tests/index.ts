import { getDb } from '../../../db/client.server';
import { listTests } from '../../../db/queries/tests';
import { testCreateBody, testListQuery } from '../../../server/api/schemas';
import { endpoint, json, readJson, requirePermission, zodToAppError } from '../../../server/http';
import { createTestFromPlan } from '../../../server/plans.server';

/** GET /api/tests?status=logging,reduced&vesselId=&limit=&offset= — every role. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const q = testListQuery.safeParse(Object.fromEntries(ctx.url.searchParams));
  if (!q.success) throw zodToAppError(q.error);
  const { status, vesselId, limit, offset } = q.data;
  const page = { limit, offset };
  return json({ ...(await listTests(getDb(), { status, vesselId, ...page })), ...page });
});

/** POST /api/tests {name, plan} — engineer; the plan's vessel and material are created or matched. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'plan');
  const body = await readJson(ctx.request, testCreateBody);
  const id = await createTestFromPlan(user, body.name, body.plan, body.vesselId);
  return json({ id }, 201);
});
