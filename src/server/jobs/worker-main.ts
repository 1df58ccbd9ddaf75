// `npm run worker`: a reduction worker process. Several may run, on one machine or several;
// they share the MariaDB queue (FOR UPDATE SKIP LOCKED + leases). SIGINT/SIGTERM: give back the
// current job at once, then exit (worker-lifecycle.server.ts). Logs are JSON lines.
import { hostname } from 'node:os';
import { getConfig } from '../../config.server';
import { runNextReduction } from './reduction-job.server';
import { reductionNotices } from './notices.server';
import { deliverDueMail } from '../outbox.server';
import { assertSafeToStart } from '../startup-checks.server';
import { createPollPause } from './backoff.server';
import { installWorkerShutdown, logJobOutcome, workerLogger } from './worker-lifecycle.server';

assertSafeToStart('worker');
const config = getConfig();
const pause = createPollPause({ pollMs: config.WORKER_POLL_MS, maxMs: config.WORKER_RETRY_MAX_SECONDS * 1000 });
const workerId = process.env.WORKER_ID || `${hostname()}-${process.pid}`;
const log = workerLogger(workerId);
let current: number | null = null;
const shutdown = installWorkerShutdown({ workerId, log, currentJob: () => current });

log.info({ leaseSeconds: config.WORKER_LEASE_SECONDS, pollMs: config.WORKER_POLL_MS }, 'reduction worker started');
let lastMailAt = 0;
while (!shutdown.isStopping()) {
  if (Date.now() - lastMailAt >= config.WORKER_POLL_MS) {
    lastMailAt = Date.now();
    await deliverDueMail().catch((err: unknown) => log.error({ err }, 'outbox delivery failed'));
  }
  try {
    const startedAt = performance.now();
    const handled = await runNextReduction(workerId, {
      ...reductionNotices,
      onClaimed: (id) => {
        current = id;
      },
    });
    current = null;
    pause.ok();
    if (handled !== null) {
      await logJobOutcome(log, workerId, handled, startedAt);
      continue;
    }
  } catch (err) {
    log.error({ err }, 'queue error (will retry)');
    pause.failed();
  }
  await new Promise((r) => setTimeout(r, pause.next()));
}
