// Password hashing with bcryptjs. bcrypt's compare is constant-time over the hash; for an
// unknown e-mail we still compare against a dummy hash so both paths take the same time.
import bcrypt from 'bcryptjs';

const COST = 11;
const DUMMY_HASH = bcrypt.hashSync('not-a-real-password', COST);

export function hashPassword(password: string): Promise<string> {
  return bcrypt.hash(password, COST);
}

/** True when `password` matches `hash`; with no hash, spends the same time and answers false. */
export async function verifyPassword(password: string, hash: string | null): Promise<boolean> {
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  return hash !== null && ok;
}
