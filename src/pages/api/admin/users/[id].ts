import { z } from 'zod';
import { getDb } from '../../../../db/client.server';
import { findUserById, setUserRole } from '../../../../db/queries/users';
import { roles } from '../../../../db/schema';
import { auditBy } from '../../../../server/audit.server';
import { errors } from '../../../../server/errors';
import { endpoint, idParam, json, readJson, requireRole } from '../../../../server/http';

const patchBody = z.object({ role: z.enum(roles) });

/** PATCH /api/admin/users/{id} — change a role (admin). An admin cannot demote themself. */
export const PATCH = endpoint(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const id = idParam(ctx.params.id, 'user');
  const { role } = await readJson(ctx.request, patchBody);
  const db = getDb();
  const target = await findUserById(db, id);
  if (!target) throw errors.notFound('user');
  if (target.id === admin.id && role !== 'admin')
    throw errors.conflict(
      'own-role',
      'You cannot take the admin role from your own account; ask another administrator.',
    );
  await setUserRole(db, id, role);
  await auditBy(admin, 'role-changed', null, { userId: id, email: target.email, from: target.role, to: role });
  return json({ id, role });
});
