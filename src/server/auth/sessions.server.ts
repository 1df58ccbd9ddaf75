// Ending sessions: a sign-out anywhere ends every session of that account at once (the session
// epoch every request compares, src/server/auth/request-user.server.ts).
import { inTransaction } from '../../db/client.server';
import { bumpSessionEpoch, findUserById } from '../../db/queries/users';
import { audit } from '../audit.server';

export async function endSessionsOnSignOut(userId: number): Promise<void> {
  if (!Number.isSafeInteger(userId) || userId <= 0) return;
  await inTransaction(async (tx) => {
    const user = await findUserById(tx, userId);
    if (!user) return;
    await bumpSessionEpoch(tx, userId);
    await audit(tx, { userId, actor: user.email, action: 'signed-out', details: { sessionsEnded: 'all' } });
  });
}
