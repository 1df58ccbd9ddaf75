import { z } from 'zod';
import { getDb } from '../../../db/client.server';
import { listTests } from '../../../db/queries/tests';
import { testStatuses } from '../../../lib/domain';
import { endpoint, json, readJson, requirePermission, zodToAppError } from '../../../server/http';
import { readPage } from '../../../server/pagination';
import { createTestFromPlan } from '../../../server/plans.server';

const filterSchema = z.object({
  status: z.array(z.enum(testStatuses)).optional(),
  vesselId: z.coerce.number().int().positive().optional(),
});

/** GET /api/tests?status=logging,reduced&vesselId=&limit=&offset= — every role. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const s = ctx.url.searchParams;
  const f = filterSchema.safeParse({
    status: s.get('status')?.split(',').filter(Boolean),
    vesselId: s.get('vesselId') ?? undefined,
  });
  if (!f.success) throw zodToAppError(f.error);
  const page = readPage(ctx.url);
  return json({ ...(await listTests(getDb(), { ...f.data, ...page })), ...page });
});

const createBody = z.object({
  name: z.string().trim().min(1, 'give the test a name').max(200),
  plan: z.unknown().refine((p) => p !== undefined, 'is required (the test plan, DESIGN 4.1)'),
  vesselId: z.number().int().positive().optional(),
});

/** POST /api/tests {name, plan} — engineer; the plan's vessel and material are created or matched. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'plan');
  const body = await readJson(ctx.request, createBody);
  const id = await createTestFromPlan(user, body.name, body.plan, body.vesselId);
  return json({ id }, 201);
});
