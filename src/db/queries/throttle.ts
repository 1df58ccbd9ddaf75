// Counters of failed sign-ins and signature passwords, in MariaDB so every app server shares
// them and a restart keeps them. One row per key (an e-mail, a client address, or both).
import { inArray, lt, sql } from 'drizzle-orm';
import type { Conn } from '../client.server';
import { signInThrottle } from '../schema';

export type ThrottleKind = 'email' | 'address' | 'pair';

export function readThrottleCounters(db: Conn, keyHashes: string[]) {
  return db.select().from(signInThrottle).where(inArray(signInThrottle.keyHash, keyHashes));
}

/** Count one failure for each key; a counter idle longer than `windowMs` starts again at 1. */
export async function countThrottleFailure(
  db: Conn,
  keys: { keyHash: string; kind: ThrottleKind }[],
  windowMs: number,
  now = new Date(),
) {
  const stale = new Date(now.getTime() - windowMs);
  for (const k of keys)
    await db
      .insert(signInThrottle)
      .values({ keyHash: k.keyHash, kind: k.kind, failures: 1, lastFailureAt: now })
      .onDuplicateKeyUpdate({
        set: {
          failures: sql`IF(${signInThrottle.lastFailureAt} < ${stale}, 1, ${signInThrottle.failures} + 1)`,
          lastFailureAt: now,
        },
      });
  // forget counters nobody has touched for a day
  await db
    .delete(signInThrottle)
    .where(lt(signInThrottle.lastFailureAt, new Date(now.getTime() - 86_400_000)))
    .limit(100);
}

export async function clearThrottleCounters(db: Conn, keyHashes: string[]) {
  if (keyHashes.length) await db.delete(signInThrottle).where(inArray(signInThrottle.keyHash, keyHashes));
}
