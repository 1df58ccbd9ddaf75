// Checks an e-mail and password for the Auth.js credentials provider.
// The same generic failure for an unknown e-mail, a wrong password, a disabled account or a
// throttled e-mail: the caller learns nothing about which.
import { getDb } from '../../db/client.server';
import { findUserByEmail, markSignedIn } from '../../db/queries/users';
import { audit } from '../audit.server';
import { verifyPassword } from './passwords.server';
import { clearSignInFailures, recordSignInFailure, signInWaitMs } from './throttle.server';

export interface SignedInUser {
  id: string;
  email: string;
  name: string;
  role: string;
}

export async function checkCredentials(emailRaw: unknown, passwordRaw: unknown): Promise<SignedInUser | null> {
  if (typeof emailRaw !== 'string' || typeof passwordRaw !== 'string') return null;
  const email = emailRaw.trim().toLowerCase();
  if (!email || email.length > 254 || passwordRaw.length > 1024) return null;
  const db = getDb();
  if (signInWaitMs(email) > 0) {
    await audit({ actor: email, action: 'sign-in-throttled', details: {} });
    return null;
  }
  const user = await findUserByEmail(db, email);
  const ok = await verifyPassword(passwordRaw, user?.passwordHash ?? null);
  if (!user || !ok || user.disabled) {
    recordSignInFailure(email);
    await audit({ userId: user?.id ?? null, actor: email, action: 'sign-in-failed', details: {} });
    return null;
  }
  clearSignInFailures(email);
  await markSignedIn(db, user.id);
  await audit({ userId: user.id, actor: user.email, action: 'sign-in', details: {} });
  return { id: String(user.id), email: user.email, name: user.name, role: user.role };
}
