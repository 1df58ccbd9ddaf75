// Slows down guessing of passwords (sign-in and the password a signature asks for), with the
// counters in MariaDB so every app server shares them and a restart keeps them. Three counters:
//  - the e-mail together with the client address: 5 free failures, then a wait;
//  - the client address alone: 30 free failures (an office behind one NAT), so one client
//    cannot spray guesses over many e-mails;
//  - the e-mail alone: 10 free failures, so guesses spread over many addresses are slowed too —
//    but this one is skipped from an address where the account signed in successfully within 90
//    days, so an attacker cannot lock the owner out of their usual place.
// Each wait is 30 s, doubling with every further failure, at most 15 minutes; a counter that
// has been quiet for 15 minutes starts again.
import { createHash } from 'node:crypto';
import type { Conn } from '../../db/client.server';
import {
  clearThrottleCounters,
  countThrottleFailure,
  readThrottleCounters,
  type ThrottleKind,
} from '../../db/queries/throttle';
import { isKnownSignInAddress, rememberSignInAddress } from '../../db/queries/users';

export const THROTTLE = {
  windowMs: 15 * 60_000,
  baseWaitMs: 30_000,
  maxWaitMs: 15 * 60_000,
  free: { pair: 5, address: 30, email: 10 } satisfies Record<ThrottleKind, number>,
  knownAddressDays: 90,
};

export interface ThrottleSubject {
  email: string;
  address: string;
  /** the account behind the e-mail, when there is one */
  userId?: number | null;
}

const hashKey = (s: string) => createHash('sha256').update(`hoopline-throttle:${s}`, 'utf8').digest('hex');
export const addressHash = (address: string) => hashKey(`address:${address}`);

function keysOf(s: ThrottleSubject) {
  const email = s.email.trim().toLowerCase();
  return {
    pair: { keyHash: hashKey(`pair:${email}|${s.address}`), kind: 'pair' as const },
    address: { keyHash: addressHash(s.address), kind: 'address' as const },
    email: { keyHash: hashKey(`email:${email}`), kind: 'email' as const },
  };
}

/** Milliseconds a counter still makes the caller wait (0: go on). Pure, for the tests too. */
export function waitFor(kind: ThrottleKind, failures: number, lastFailureAt: Date, now: Date): number {
  const since = now.getTime() - lastFailureAt.getTime();
  if (since > THROTTLE.windowMs || failures < THROTTLE.free[kind]) return 0;
  const wait = Math.min(THROTTLE.baseWaitMs * 2 ** (failures - THROTTLE.free[kind]), THROTTLE.maxWaitMs);
  return Math.max(0, wait - since);
}

/** How long this e-mail from this address must wait, and which counter says so. */
export async function throttleWait(
  db: Conn,
  s: ThrottleSubject,
  now = new Date(),
): Promise<{ waitMs: number; counter: ThrottleKind | null }> {
  const k = keysOf(s);
  const known =
    s.userId != null &&
    (await isKnownSignInAddress(
      db,
      s.userId,
      k.address.keyHash,
      new Date(now.getTime() - THROTTLE.knownAddressDays * 86_400_000),
    ));
  const rows = await readThrottleCounters(db, [k.pair.keyHash, k.address.keyHash, k.email.keyHash]);
  let best = { waitMs: 0, counter: null as ThrottleKind | null };
  for (const r of rows) {
    if (r.kind === 'email' && known) continue;
    const w = waitFor(r.kind, r.failures, r.lastFailureAt, now);
    if (w > best.waitMs) best = { waitMs: w, counter: r.kind };
  }
  return best;
}

export async function recordThrottleFailure(db: Conn, s: ThrottleSubject, now = new Date()): Promise<void> {
  const k = keysOf(s);
  await countThrottleFailure(db, [k.pair, k.address, k.email], THROTTLE.windowMs, now);
}

/**
 * A right password: the e-mail's own counters start again and the address becomes one of the
 * account's usual places. The address counter is left to cool down by itself, so one valid
 * account cannot wipe the count of guesses made at others from the same client.
 */
export async function recordThrottleSuccess(db: Conn, s: ThrottleSubject & { userId: number }): Promise<void> {
  const k = keysOf(s);
  await clearThrottleCounters(db, [k.pair.keyHash, k.email.keyHash]);
  await rememberSignInAddress(db, s.userId, k.address.keyHash);
}
