import { endpoint, idParam, json, requirePermission } from '../../../server/http';
import { revokeLink } from '../../../server/share.server';

/** DELETE /api/share-links/{id} — qa: revoke; the link answers 410 from now on. */
export const DELETE = endpoint(async (ctx) => {
  const user = requirePermission(ctx, 'share');
  const id = idParam(ctx.params.id, 'share link');
  await revokeLink(user, id);
  return json({ id, revoked: true });
});
