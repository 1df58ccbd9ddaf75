// Password hashing with bcryptjs. bcrypt's compare is constant-time over the hash; for an
// unknown e-mail, or an invited account that has no password yet, we still compare against a
// dummy hash so every path takes the same time.
import bcrypt from 'bcryptjs';

const COST = 11;
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', COST);

/** The stored hash of an invited account that has not chosen its password yet. */
export const NO_PASSWORD = '';

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

/** True when `password` matches `hash`; with no usable hash, spends the same time and answers false. */
export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  const usable = !!hash && hash.startsWith('$2');
  const ok = await bcrypt.compare(password, usable ? hash : DUMMY_HASH);
  return usable && ok;
}
