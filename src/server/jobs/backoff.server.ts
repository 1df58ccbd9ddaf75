// Back-off for the reduction worker: a transient fault (storage or database not answering)
// puts a job back to wait 2^n times the base delay, halved-to-full at random ("equal jitter"),
// so many workers do not retry in step; and the worker's own poll loop waits longer while the
// queue itself cannot be read.

/** Milliseconds to wait after the `failures`-th consecutive transient fault (0-based). */
export function backoffDelayMs(failures: number, baseMs: number, maxMs: number, random: () => number = Math.random) {
  const ceiling = Math.min(maxMs, baseMs * 2 ** Math.max(0, failures));
  return Math.round(ceiling / 2 + (random() * ceiling) / 2);
}

/** After this many transient faults in a row a job fails for good, with the last fault's message. */
export const MAX_TRANSIENT_FAILURES = 10;

/**
 * The worker loop's pause between polls: the poll interval while all is well, growing with
 * jittered back-off while the queue cannot be read (MariaDB down), back to normal on success.
 */
export function createPollPause(o: { pollMs: number; maxMs: number }) {
  let errors = 0;
  return {
    ok() {
      errors = 0;
    },
    failed() {
      errors++;
    },
    next(): number {
      return errors === 0 ? o.pollMs : Math.max(o.pollMs, backoffDelayMs(errors - 1, o.pollMs, o.maxMs));
    },
  };
}
