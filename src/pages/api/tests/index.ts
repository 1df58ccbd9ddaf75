import { getDb } from '../../../db/client.server';
import { listTests } from '../../../db/queries/tests';
import { testCreateBody, testFilter } from '../../../server/api/schemas';
import { endpoint, json, readJson, requirePermission, zodToAppError } from '../../../server/http';
import { readPage } from '../../../server/pagination';
import { createTestFromPlan } from '../../../server/plans.server';

/** GET /api/tests?status=logging,reduced&vesselId=&limit=&offset= — every role. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const s = ctx.url.searchParams;
  const f = testFilter.safeParse({
    status: s.get('status')?.split(',').filter(Boolean),
    vesselId: s.get('vesselId') ?? undefined,
  });
  if (!f.success) throw zodToAppError(f.error);
  const page = readPage(ctx.url);
  return json({ ...(await listTests(getDb(), { ...f.data, ...page })), ...page });
});

/** POST /api/tests {name, plan} — engineer; the plan's vessel and material are created or matched. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'plan');
  const body = await readJson(ctx.request, testCreateBody);
  const id = await createTestFromPlan(user, body.name, body.plan, body.vesselId);
  return json({ id }, 201);
});
