import { getDb } from '../../../db/client.server';
import { findVessel } from '../../../db/queries/vessels';
import { editVessel } from '../../../server/catalog.server';
import { vesselPatchBody } from '../../../server/api/schemas';
import { errors } from '../../../server/errors';
import { endpoint, idParam, json, readJson, requirePermission } from '../../../server/http';

export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'read');
  const v = await findVessel(getDb(), idParam(ctx.params.id, 'vessel'));
  if (!v) throw errors.notFound('vessel');
  return json(v);
});

/** PATCH /api/vessels/{id} — engineer; the merged vessel is validated as a whole. */
export const PATCH = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'plan');
  const id = idParam(ctx.params.id, 'vessel');
  const patch = await readJson(ctx.request, vesselPatchBody);
  await editVessel(user, id, patch);
  return json(await findVessel(getDb(), id));
});
