import { revokeToken } from '../../../../server/accounts.server';
import { endpoint, idParam, json, requireSessionUser } from '../../../../server/http';

/** DELETE /api/account/tokens/{id} — revoke one of the caller's own tokens (signed in, not with a token). */
export const DELETE = endpoint(async (ctx) => {
  const user = requireSessionUser(ctx);
  const id = idParam(ctx.params.id, 'API token');
  await revokeToken(user, id, false);
  return json({ id, revoked: true });
});
