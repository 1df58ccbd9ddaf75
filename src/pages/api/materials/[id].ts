import { getDb } from '../../../db/client.server';
import { findMaterial } from '../../../db/queries/vessels';
import { materialPatchBody } from '../../../server/api/schemas';
import { editMaterial } from '../../../server/catalog.server';
import { errors } from '../../../server/errors';
import { endpoint, idParam, json, readJson, requirePermission } from '../../../server/http';

export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const m = await findMaterial(getDb(), idParam(ctx.params.id, 'material'));
  if (!m) throw errors.notFound('material');
  return json(m);
});

export const PATCH = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'plan');
  const id = idParam(ctx.params.id, 'material');
  const patch = await readJson(ctx.request, materialPatchBody);
  await editMaterial(user, id, patch);
  return json(await findMaterial(getDb(), id));
});
