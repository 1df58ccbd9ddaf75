// The reduction worker's structured logging and graceful shutdown, kept out of the main loop.
// On SIGTERM or SIGINT the worker hands its current job back to the queue at once (another
// worker takes it without waiting for the lease to run out), closes its pool and exits; a
// second signal exits at once.
import { format } from 'node:util';
import type { Logger } from 'pino';
import { getDb } from '../../db/client.server';
import { findReduction, releaseReduction } from '../../db/queries/reductions';
import { runShutdownHooks } from '../../lifecycle.server';
import { logger } from '../observability/logger.server';

/** The worker's logger; console output (from code shared with the app) becomes JSON lines too. */
export function workerLogger(workerId: string): Logger {
  const log = logger().child({ service: 'worker', workerId });
  console.log = console.info = (...a: unknown[]) => log.info(format(...a));
  console.warn = (...a: unknown[]) => log.warn(format(...a));
  console.error = (...a: unknown[]) => log.error(format(...a));
  return log;
}

/** Install the signal handlers; `isStopping()` tells the loop to take no new job. */
export function installWorkerShutdown(o: { workerId: string; log: Logger; currentJob: () => number | null }) {
  let stopping = false;
  const stop = async (signal: NodeJS.Signals) => {
    if (stopping) {
      o.log.warn({ signal }, 'second signal: exiting without waiting');
      process.exit(1);
    }
    stopping = true;
    const job = o.currentJob();
    o.log.info({ signal, reductionId: job }, 'stopping');
    if (job !== null) {
      await releaseReduction(getDb(), job, o.workerId).then(
        () => o.log.info({ reductionId: job }, 'handed the job back to the queue'),
        (err: unknown) => o.log.error({ reductionId: job, err }, 'could not hand the job back; its lease will run out'),
      );
    }
    await runShutdownHooks();
    o.log.info('stopped');
    process.exit(0);
  };
  process.on('SIGINT', (s) => void stop(s));
  process.on('SIGTERM', (s) => void stop(s));
  return { isStopping: () => stopping };
}

/** One log line for a handled job: how it ended, which attempt, how long it took. */
export async function logJobOutcome(log: Logger, workerId: string, reductionId: number, startedAt: number) {
  const ms = Math.round(performance.now() - startedAt);
  const job = await findReduction(getDb(), reductionId).catch(() => undefined);
  const outcome = !job
    ? 'unknown'
    : job.status === 'done' || job.status === 'failed'
      ? job.status
      : job.status === 'queued'
        ? 'requeued'
        : job.leaseOwner === workerId
          ? 'running'
          : 'lease-lost';
  const line = {
    event: 'job',
    reductionId,
    testId: job?.testId ?? null,
    outcome,
    attempt: job?.attempts ?? null,
    ms,
    ...(job?.error && outcome !== 'done' ? { error: job.error.slice(0, 500) } : {}),
  };
  if (outcome === 'failed' || outcome === 'requeued') log.warn(line, 'job');
  else log.info(line, 'job');
}
