import { getDb } from '../../../db/client.server';
import { listMaterials } from '../../../db/queries/vessels';
import { materialBody } from '../../../server/api/schemas';
import { createMaterial } from '../../../server/catalog.server';
import { endpoint, json, readJson, requirePermission } from '../../../server/http';
import { readPage } from '../../../server/pagination';

/** GET /api/materials — every role may read. */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const page = readPage(ctx.url);
  return json({ ...(await listMaterials(getDb(), page)), ...page });
});

/** POST /api/materials — engineer. */
export const POST = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'plan');
  const body = await readJson(ctx.request, materialBody);
  return json({ id: await createMaterial(user, body) }, 201);
});
