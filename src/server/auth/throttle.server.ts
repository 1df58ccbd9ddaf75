// Slows down repeated failed sign-ins for one e-mail: after FREE_FAILURES failures within the
// window, further attempts are refused until a wait that doubles with each failure has passed.
// Kept in memory per server process; a restart clears it (documented in DEVELOPERS.md).

const FREE_FAILURES = 5;
const WINDOW_MS = 15 * 60_000;
const BASE_WAIT_MS = 30_000;
const MAX_WAIT_MS = 15 * 60_000;

interface Entry {
  failures: number;
  lastFailureAt: number;
}
const entries = new Map<string, Entry>();

const key = (email: string) => email.trim().toLowerCase();

/** Milliseconds the caller must still wait before another attempt for this e-mail (0: go on). */
export function signInWaitMs(email: string, now = Date.now()): number {
  const e = entries.get(key(email));
  if (!e || now - e.lastFailureAt > WINDOW_MS) return 0;
  if (e.failures < FREE_FAILURES) return 0;
  const wait = Math.min(BASE_WAIT_MS * 2 ** (e.failures - FREE_FAILURES), MAX_WAIT_MS);
  return Math.max(0, e.lastFailureAt + wait - now);
}

export function recordSignInFailure(email: string, now = Date.now()): void {
  const k = key(email);
  const e = entries.get(k);
  if (!e || now - e.lastFailureAt > WINDOW_MS) entries.set(k, { failures: 1, lastFailureAt: now });
  else entries.set(k, { failures: e.failures + 1, lastFailureAt: now });
  if (entries.size > 10_000) entries.delete(entries.keys().next().value!);
}

export function clearSignInFailures(email: string): void {
  entries.delete(key(email));
}
