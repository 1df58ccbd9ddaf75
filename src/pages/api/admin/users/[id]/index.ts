import { z } from 'zod';
import { getDb } from '../../../../db/client.server';
import { findUserById, setUserRole } from '../../../../db/queries/users';
import { roles } from '../../../../lib/roles';
import { auditBy } from '../../../../server/audit.server';
import { AppError, errors } from '../../../../server/errors';
import { endpoint, idParam, json, readJson, requirePermission } from '../../../../server/http';

const patchBody = z.object({ role: z.enum(roles) });

/** PATCH /api/admin/users/{id} — change a role (admin). An admin cannot demote themself. */
export const PATCH = endpoint(async (ctx) => {
  const admin = requirePermission(ctx, 'users');
  const id = idParam(ctx.params.id, 'user');
  const { role } = await readJson(ctx.request, patchBody);
  const db = getDb();
  const target = await findUserById(db, id);
  if (!target) throw errors.notFound('user');
  if (target.id === admin.id && role !== 'admin')
    throw new AppError('own-role', 'You cannot take the admin role from your own account; ask another administrator.');
  await setUserRole(db, id, role);
  await auditBy(admin, 'role-changed', null, { userId: id, email: target.email, from: target.role, to: role });
  return json({ id, role });
});
