import { z } from 'zod';
import { getDb } from '../../../../db/client.server';
import { createUser, findUserByEmail, listUsers } from '../../../../db/queries/users';
import { roles } from '../../../../lib/roles';
import { auditBy } from '../../../../server/audit.server';
import { hashPassword } from '../../../../server/auth/passwords.server';
import { AppError } from '../../../../server/errors';
import { endpoint, json, readJson, requirePermission } from '../../../../server/http';

/** GET /api/admin/users — every account (admin). */
export const GET = endpoint(async (ctx) => {
  requirePermission(ctx, 'users');
  return json({ items: await listUsers(getDb()) });
});

const createBody = z.object({
  email: z.email().max(254),
  name: z.string().trim().min(1).max(120),
  role: z.enum(roles),
  password: z.string().min(10, 'at least 10 characters').max(200),
});

/** POST /api/admin/users — create an account (admin). */
export const POST = endpoint(async (ctx) => {
  const admin = requirePermission(ctx, 'users');
  const body = await readJson(ctx.request, createBody);
  const db = getDb();
  if (await findUserByEmail(db, body.email))
    throw new AppError('email-taken', 'An account with that e-mail exists already.');
  const id = await createUser(db, {
    email: body.email,
    name: body.name,
    role: body.role,
    passwordHash: await hashPassword(body.password),
  });
  await auditBy(admin, 'user-created', null, { userId: id, email: body.email, role: body.role });
  return json({ id }, 201);
});
