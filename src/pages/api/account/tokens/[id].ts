import { getDb } from '../../../../db/client.server';
import { revokeApiToken } from '../../../../db/queries/users';
import { auditBy } from '../../../../server/audit.server';
import { errors } from '../../../../server/errors';
import { endpoint, idParam, json, requireUser } from '../../../../server/http';

/** DELETE /api/account/tokens/{id} — revoke one of the caller's own tokens. */
export const DELETE = endpoint(async (ctx) => {
  const user = requireUser(ctx);
  const id = idParam(ctx.params.id, 'API token');
  if (!(await revokeApiToken(getDb(), user.id, id))) throw errors.notFound('active API token of yours');
  await auditBy(user, 'api-token-revoked', null, { tokenId: id });
  return json({ id, revoked: true });
});
