// Who is making this request: a Bearer API token (API routes only), or the Auth.js session
// cookie. The role always comes from the database, so a role change or a disabled account takes
// effect at once; a session also carries the account's session epoch from sign-in, and any
// sign-out, disabling or new password bumps the epoch, ending every older session everywhere.
import { getSession } from 'auth-astro/server';
import { getDb } from '../../db/client.server';
import { findUserById, findUserByTokenHash, touchApiToken } from '../../db/queries/users';
import { AppError } from '../errors';
import { tokenScopes, type RequestUser, type TokenScope } from '../http';
import { hashToken } from './tokens.server';

export function parseScopes(value: string): TokenScope[] {
  return value
    .split(',')
    .map((s) => s.trim())
    .filter((s): s is TokenScope => (tokenScopes as readonly string[]).includes(s));
}

/** Resolve the caller; throws 401 for a Bearer token that is unknown, expired or revoked. */
export async function resolveRequestUser(request: Request, opts: { allowToken: boolean }): Promise<RequestUser | null> {
  const header = request.headers.get('authorization');
  if (header && /^bearer\s+/i.test(header)) {
    if (!opts.allowToken) return null;
    const token = header.replace(/^bearer\s+/i, '').trim();
    const found = token ? await findUserByTokenHash(getDb(), hashToken(token)) : undefined;
    if (!found) throw new AppError('invalid-token');
    void touchApiToken(getDb(), found.tokenId).catch(() => undefined);
    const u = found.user;
    return { id: u.id, email: u.email, name: u.name, role: u.role, via: 'token', scopes: parseScopes(found.scopes) };
  }
  const session = (await getSession(request)) as { uid?: string; epoch?: number } | null;
  const uid = Number(session?.uid);
  if (!session || !Number.isSafeInteger(uid) || uid <= 0) return null;
  const u = await findUserById(getDb(), uid);
  if (!u || u.disabled || session.epoch !== u.sessionEpoch) return null;
  return { id: u.id, email: u.email, name: u.name, role: u.role, via: 'session', scopes: null };
}
