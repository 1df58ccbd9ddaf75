import { revokeToken } from '../../../../server/accounts.server';
import { endpoint, idParam, json, requirePermission } from '../../../../server/http';

/** DELETE /api/admin/tokens/{id} — admin: revoke anyone's API token at once. */
export const DELETE = endpoint(async (ctx) => {
  const admin = requirePermission(ctx, 'users');
  const id = idParam(ctx.params.id, 'API token');
  await revokeToken(admin, id, true);
  return json({ id, revoked: true });
});
