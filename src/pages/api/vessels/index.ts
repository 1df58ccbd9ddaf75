import { getDb } from '../../../db/client.server';
import { listVessels } from '../../../db/queries/vessels';
import { vesselBody } from '../../../server/api/schemas';
import { createVessel } from '../../../server/catalog.server';
import { endpoint, json, readJson, requirePermission } from '../../../server/http';
import { readPage } from '../../../server/pagination';

/** GET /api/vessels — every role may read; geometry in SI (mm). */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const page = readPage(ctx.url);
  return json({ ...(await listVessels(getDb(), page)), ...page });
});

/** POST /api/vessels — engineer. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'plan');
  const body = await readJson(ctx.request, vesselBody);
  return json({ id: await createVessel(user, body) }, 201);
});
