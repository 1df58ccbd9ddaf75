// Who is making this request: a Bearer API token, or the Auth.js session cookie.
// The role always comes from the database, so a role change or a disabled account takes
// effect at once rather than when the JWT expires.
import { getSession } from 'auth-astro/server';
import { getDb } from '../../db/client.server';
import { findUserById, findUserByTokenHash, touchApiToken } from '../../db/queries/users';
import { AppError } from '../errors';
import type { RequestUser } from '../http';
import { hashToken } from './tokens.server';

/** Resolve the caller; throws 401 for a Bearer token that is unknown or revoked. */
export async function resolveRequestUser(request: Request): Promise<RequestUser | null> {
  const header = request.headers.get('authorization');
  if (header && /^bearer\s+/i.test(header)) {
    const token = header.replace(/^bearer\s+/i, '').trim();
    const found = token ? await findUserByTokenHash(getDb(), hashToken(token)) : undefined;
    if (!found) throw new AppError('invalid-token');
    void touchApiToken(getDb(), found.tokenId).catch(() => undefined);
    const u = found.user;
    return { id: u.id, email: u.email, name: u.name, role: u.role, via: 'token' };
  }
  const session = (await getSession(request)) as { uid?: string } | null;
  const uid = Number(session?.uid);
  if (!session || !Number.isSafeInteger(uid) || uid <= 0) return null;
  const u = await findUserById(getDb(), uid);
  if (!u || u.disabled) return null;
  return { id: u.id, email: u.email, name: u.name, role: u.role, via: 'session' };
}
