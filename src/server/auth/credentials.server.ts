// Checks an e-mail and password for the Auth.js credentials provider, and the password a
// signature asks for again. Both are throttled by the same counters (throttle.server.ts).
// Sign-in gives the same generic failure for an unknown e-mail, a wrong password, a disabled
// or not yet activated account, or a throttled attempt: the caller learns nothing about which.
import { getDb, inTransaction } from '../../db/client.server';
import { findUserByEmail, findUserById, markSignedIn } from '../../db/queries/users';
import { audit } from '../audit.server';
import { AppError, errors } from '../errors';
import type { RequestUser } from '../http';
import { currentClientAddress } from '../request-context.server';
import { verifyPassword } from './passwords.server';
import { recordThrottleFailure, recordThrottleSuccess, throttleWait } from './throttle.server';

export interface SignedInUser {
  id: string;
  email: string;
  name: string;
  role: string;
  /** the account's session epoch at sign-in: a later sign-out anywhere ends this session */
  epoch: number;
}

export async function checkCredentials(emailRaw: unknown, passwordRaw: unknown): Promise<SignedInUser | null> {
  if (typeof emailRaw !== 'string' || typeof passwordRaw !== 'string') return null;
  const email = emailRaw.trim().toLowerCase();
  if (!email || email.length > 254 || passwordRaw.length > 1024) return null;
  const db = getDb();
  const address = currentClientAddress();
  const user = await findUserByEmail(db, email);
  const subject = { email, address, userId: user?.id ?? null };
  const wait = await throttleWait(db, subject);
  if (wait.waitMs > 0) {
    await audit(db, {
      userId: user?.id ?? null,
      actor: email,
      action: 'sign-in-throttled',
      details: { counter: wait.counter, address },
    });
    return null;
  }
  const ok = await verifyPassword(passwordRaw, user?.passwordHash ?? null);
  if (!user || !ok || user.disabled) {
    await inTransaction(async (tx) => {
      await recordThrottleFailure(tx, subject);
      await audit(tx, { userId: user?.id ?? null, actor: email, action: 'sign-in-failed', details: { address } });
    });
    return null;
  }
  await inTransaction(async (tx) => {
    await recordThrottleSuccess(tx, { ...subject, userId: user.id });
    await markSignedIn(tx, user.id);
    await audit(tx, { userId: user.id, actor: user.email, action: 'sign-in', details: { address } });
  });
  return { id: String(user.id), email: user.email, name: user.name, role: user.role, epoch: user.sessionEpoch };
}

/**
 * The signer's password, asked again before a review or a release (DESIGN 5): 401 when wrong,
 * 429 while throttled, counted like a failed sign-in. Resolves when it is right.
 */
export async function confirmSignerPassword(user: RequestUser, password: string, what: string): Promise<void> {
  const db = getDb();
  const address = currentClientAddress();
  const subject = { email: user.email, address, userId: user.id };
  const wait = await throttleWait(db, subject);
  if (wait.waitMs > 0) throw errors.throttled(wait.waitMs);
  const row = await findUserById(db, user.id);
  const ok = await verifyPassword(password, row?.passwordHash ?? null);
  if (!row || row.disabled || !ok) {
    await inTransaction(async (tx) => {
      await recordThrottleFailure(tx, subject);
      await audit(tx, { userId: user.id, actor: user.email, action: 'signature-refused', details: { what, address } });
    });
    throw new AppError('wrong-password');
  }
  await recordThrottleSuccess(db, { ...subject, userId: user.id });
}
