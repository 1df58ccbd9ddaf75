import { endpoint, idParam, json, readJson, requirePermission } from '../../../../../server/http';
import { updateUserByAdmin } from '../../../../../server/accounts.server';
import { userPatchBody } from '../../../../../server/api/schemas';

/**
 * PATCH /api/admin/users/{id} {role?, disabled?} — admin. Disabling ends every session and token
 * use of the account at once; an admin can neither demote nor disable themself.
 */
export const PATCH = endpoint(async (ctx) => {
  const admin = requirePermission(ctx, 'users');
  const id = idParam(ctx.params.id, 'user');
  const patch = await readJson(ctx.request, userPatchBody);
  return json(await updateUserByAdmin(admin, id, patch));
});
