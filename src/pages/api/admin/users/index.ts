import { getDb } from '../../../../db/client.server';
import { listUsers } from '../../../../db/queries/users';
import { inviteUser } from '../../../../server/accounts.server';
import { inviteBody } from '../../../../server/api/schemas';
import { endpoint, json, readJson, requirePermission } from '../../../../server/http';

/** GET /api/admin/users — every account (admin). */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'users');
  return json({ items: await listUsers(getDb()) });
});

/**
 * POST /api/admin/users {email, name, role} — admin: a new account; the person gets an e-mail
 * with a one-time link to choose their own password (no administrator ever knows it).
 */
export const POST = endpoint(async (ctx) => {
  const admin = requirePermission(ctx, 'users');
  const body = await readJson(ctx.request, inviteBody);
  return json({ id: await inviteUser(admin, body), invited: true }, 201);
});
