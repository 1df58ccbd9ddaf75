import { getDb } from '../../../../db/client.server';
import { listAllApiTokens } from '../../../../db/queries/users';
import { endpoint, json, requirePermission } from '../../../../server/http';

/** GET /api/admin/tokens — admin: every account's API tokens (never the tokens themselves). */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'users');
  return json({ items: await listAllApiTokens(getDb()) });
});
