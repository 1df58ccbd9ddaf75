import { endpoint, idParam, json, requirePermission } from '../../../../../server/http';
import { sendResetByAdmin } from '../../../../../server/accounts.server';

/** POST /api/admin/users/{id}/password-reset — admin: e-mail the person a link to choose a new password. */
export const POST = endpoint(async (ctx) => {
  const admin = requirePermission(ctx, 'users');
  await sendResetByAdmin(admin, idParam(ctx.params.id, 'user'));
  return json({ sent: true }, 202);
});
