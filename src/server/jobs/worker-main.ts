// `npm run worker`: a reduction worker process. Several may run, on one machine or several;
// they share the MariaDB queue (FOR UPDATE SKIP LOCKED + leases). SIGINT/SIGTERM: finish or
// give back the current job, then exit.
import { hostname } from 'node:os';
import { closeDb, getDb } from '../../db/client.server';
import { releaseReduction } from '../../db/queries/reductions';
import { getConfig } from '../../config.server';
import { runNextReduction } from './reduction-job.server';
import { reductionNotices } from './notices.server';
import { deliverDueMail } from '../outbox.server';
import { assertSafeToStart } from '../startup-checks.server';
import { createPollPause } from './backoff.server';

assertSafeToStart('worker');
const config = getConfig();
const pause = createPollPause({ pollMs: config.WORKER_POLL_MS, maxMs: config.WORKER_RETRY_MAX_SECONDS * 1000 });
const workerId = process.env.WORKER_ID || `${hostname()}-${process.pid}`;
let stopping = false;
let current: number | null = null;

async function stop() {
  if (stopping) return;
  stopping = true;
  console.log(`[${workerId}] stopping`);
  if (current !== null) await releaseReduction(getDb(), current, workerId).catch(() => undefined);
  await closeDb();
  process.exit(0);
}
process.on('SIGINT', () => void stop());
process.on('SIGTERM', () => void stop());

console.log(
  `[${workerId}] reduction worker started (lease ${config.WORKER_LEASE_SECONDS} s, poll ${config.WORKER_POLL_MS} ms)`,
);
let lastMailAt = 0;
while (!stopping) {
  if (Date.now() - lastMailAt >= config.WORKER_POLL_MS) {
    lastMailAt = Date.now();
    await deliverDueMail().catch((err) =>
      console.error(`[${workerId}] outbox:`, err instanceof Error ? err.message : err),
    );
  }
  try {
    const handled = await runNextReduction(workerId, {
      ...reductionNotices,
      onClaimed: (id) => {
        current = id;
      },
    });
    current = null;
    pause.ok();
    if (handled !== null) {
      console.log(`[${workerId}] handled reduction ${handled}`);
      continue;
    }
  } catch (err) {
    console.error(`[${workerId}] queue error (will retry):`, err instanceof Error ? err.message : err);
    pause.failed();
  }
  await new Promise((r) => setTimeout(r, pause.next()));
}
