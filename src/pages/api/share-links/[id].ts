import { endpoint, idParam, json, requireRole, roleSets } from '../../../server/http';
import { revokeLink } from '../../../server/share.server';

/** DELETE /api/share-links/{id} — qa: revoke; the link answers 410 from now on. */
export const DELETE = endpoint(async (ctx) => {
  const user = requireRole(ctx, ...roleSets.qa);
  const id = idParam(ctx.params.id, 'share link');
  await revokeLink(user, id);
  return json({ id, revoked: true });
});
