import { getDb } from '../../../db/client.server';
import { listMaterials } from '../../../db/queries/vessels';
import { createMaterial, materialBody } from '../../../server/catalog.server';
import { endpoint, json, readJson, requireRole, roleSets } from '../../../server/http';
import { readPage } from '../../../server/pagination';

/** GET /api/materials — every role may read. */
export const GET = endpoint(async (ctx) => {
  requireRole(ctx, ...roleSets.anyone);
  const page = readPage(ctx.url);
  return json({ ...(await listMaterials(getDb(), page)), ...page });
});

/** POST /api/materials — engineer. */
export const POST = endpoint(async (ctx) => {
  const user = requireRole(ctx, ...roleSets.engineer);
  const body = await readJson(ctx.request, materialBody);
  return json({ id: await createMaterial(user, body) }, 201);
});
