// A running job's lease is renewed on a timer (a third of the lease), not only when the engine
// reports progress, so a slow segment or a long storage read never lets a live worker's lease
// run out. When a renewal finds the job is no longer ours (the lease ran out and another worker
// took it), the job is marked lost and the worker stops working on it.
import type { Conn } from '../../db/client.server';
import { renewLease } from '../../db/queries/reductions';

export interface LeaseTimer {
  /** whether a renewal found the job taken away */
  lost(): boolean;
  stop(): void;
}

export function startLeaseTimer(db: Conn, jobId: number, workerId: string, leaseSeconds: number): LeaseTimer {
  let lost = false;
  let busy = false;
  const timer = setInterval(
    () => {
      if (busy || lost) return;
      busy = true;
      renewLease(db, jobId, workerId, leaseSeconds)
        .then((held) => {
          if (!held) lost = true;
        })
        // the database may be away for a moment: try again next tick; the lease may still run out
        .catch(() => undefined)
        .finally(() => {
          busy = false;
        });
    },
    Math.max(250, (leaseSeconds * 1000) / 3),
  );
  timer.unref();
  return {
    lost: () => lost,
    stop: () => clearInterval(timer),
  };
}
