// Prometheus metrics (prom-client) for GET /api/metrics. Per process: request counts and latency
// per route, requests in flight, signed-in users seen lately, Node's own figures. From the
// database, so every app server reports the same cluster-wide values (aggregate them with
// max, not sum): the reduction queue, job durations and the outbox backlog.
import { Counter, Gauge, Histogram, Registry, collectDefaultMetrics } from 'prom-client';
import { getDb } from '../../db/client.server';
import { openLiveStreams } from '../live-events.server';
import { outboxBacklog, reductionDurationHistogram, reductionQueueDepth } from '../../db/queries/operations';

export const registry = new Registry();
collectDefaultMetrics({ register: registry, prefix: 'hoopline_process_' });

const requests = new Counter({
  name: 'hoopline_http_requests_total',
  help: 'HTTP requests answered, by method, route pattern and status.',
  labelNames: ['method', 'route', 'status'] as const,
  registers: [registry],
});
const latency = new Histogram({
  name: 'hoopline_http_request_duration_seconds',
  help: 'Time from a request reaching the app to its response being ready, by method and route pattern.',
  labelNames: ['method', 'route'] as const,
  buckets: [0.005, 0.01, 0.025, 0.05, 0.1, 0.25, 0.5, 1, 2.5, 5, 10],
  registers: [registry],
});
const inFlight = new Gauge({
  name: 'hoopline_http_requests_in_flight',
  help: 'Requests being served by this process now.',
  registers: [registry],
});

/** Counted by report-cache.server.ts; here so the series exists (at 0) before the first render. */
export const reportRenders = new Counter({
  name: 'hoopline_report_renders_total',
  help: 'PDF reports rendered by this process (each record version once; then served from the cache).',
  registers: [registry],
});

const ACTIVE_WINDOW_MS = 15 * 60_000;
const lastSeen = new Map<number, number>();
new Gauge({
  name: 'hoopline_active_users',
  help: 'Distinct signed-in users (session or API token) with a request to this process in the last 15 minutes.',
  registers: [registry],
  collect() {
    const since = Date.now() - ACTIVE_WINDOW_MS;
    for (const [id, at] of lastSeen) if (at < since) lastSeen.delete(id);
    this.set(lastSeen.size);
  },
});

new Gauge({
  name: 'hoopline_live_event_streams',
  help: 'Live test event streams (Server-Sent Events) this process is serving now.',
  registers: [registry],
  collect() {
    this.set(openLiveStreams());
  },
});

/** Database figures are read at most this often, however often the endpoint is scraped. */
const DB_FIGURES_TTL_MS = 5_000;
const JOB_BOUNDS = [1, 2, 5, 10, 30, 60, 120, 300, 600, 1800];
let dbFigures: { at: number; value: Promise<DbFigures> } | null = null;
interface DbFigures {
  queue: Awaited<ReturnType<typeof reductionQueueDepth>>;
  durations: Awaited<ReturnType<typeof reductionDurationHistogram>>;
  outbox: number;
}
const figuresUp = new Gauge({
  name: 'hoopline_database_figures_up',
  help: '1 when the queue, job and outbox figures below could be read from the database at the last scrape, else 0.',
  registers: [registry],
});

function readDbFigures(): Promise<DbFigures> {
  if (dbFigures && Date.now() - dbFigures.at < DB_FIGURES_TTL_MS) return dbFigures.value;
  const db = getDb();
  const value = Promise.all([
    reductionQueueDepth(db),
    reductionDurationHistogram(db, JOB_BOUNDS),
    outboxBacklog(db),
  ]).then(([queue, durations, outbox]) => ({ queue, durations, outbox }));
  dbFigures = { at: Date.now(), value };
  value.then(
    () => figuresUp.set(1),
    () => {
      figuresUp.set(0);
      dbFigures = null;
    },
  );
  return value;
}

new Gauge({
  name: 'hoopline_reduction_queue_jobs',
  help: 'Reduction jobs waiting (queued) and being worked on (running), across all workers.',
  labelNames: ['status'] as const,
  registers: [registry],
  async collect() {
    const f = await readDbFigures().catch(() => null);
    if (!f) return this.reset();
    this.set({ status: 'queued' }, f.queue.queued);
    this.set({ status: 'running' }, f.queue.running);
  },
});
new Gauge({
  name: 'hoopline_reduction_queue_oldest_seconds',
  help: 'Age of the oldest queued reduction job (0 when none waits).',
  registers: [registry],
  async collect() {
    const f = await readDbFigures().catch(() => null);
    if (!f) return this.reset();
    this.set(f.queue.oldestQueuedSeconds);
  },
});
new Gauge({
  name: 'hoopline_outbox_backlog_messages',
  help: 'E-mails stored in the outbox and not sent yet.',
  registers: [registry],
  async collect() {
    const f = await readDbFigures().catch(() => null);
    if (!f) return this.reset();
    this.set(f.outbox);
  },
});

// A histogram computed from the reductions table rather than observed in this process: the
// workers run the jobs, the app servers are what Prometheus scrapes. The registry formats any
// object with get(); prom-client's types only admit its own classes, hence the one cast.
const JOB_METRIC = 'hoopline_reduction_duration_seconds';
const JOB_HELP = 'Duration of finished reduction jobs (last attempt, claim to finish), by outcome, across all workers.';
interface SampleLine {
  metricName: string;
  labels: Record<string, string | number>;
  value: number;
}
const jobDurations = {
  name: JOB_METRIC,
  help: JOB_HELP,
  type: 'histogram',
  aggregator: 'max',
  async get() {
    const values: SampleLine[] = [];
    const durations = await readDbFigures().then(
      (f) => f.durations,
      () => [],
    );
    for (const h of durations) {
      const bucket = (le: string | number, value: number) =>
        values.push({ metricName: `${JOB_METRIC}_bucket`, labels: { status: h.status, le }, value });
      JOB_BOUNDS.forEach((le, i) => bucket(le, h.buckets[i] ?? 0));
      bucket('+Inf', h.count);
      values.push({ metricName: `${JOB_METRIC}_sum`, labels: { status: h.status }, value: h.sumSeconds });
      values.push({ metricName: `${JOB_METRIC}_count`, labels: { status: h.status }, value: h.count });
    }
    return { name: JOB_METRIC, help: JOB_HELP, type: 'histogram', aggregator: 'max', values };
  },
};
registry.registerMetric(jobDurations as unknown as Histogram);

/** Count a request as started; the returned function records its end. */
export function startRequestMetrics(): (o: {
  method: string;
  route: string;
  status: number;
  seconds: number;
  userId: number | null;
}) => void {
  inFlight.inc();
  return ({ method, route, status, seconds, userId }) => {
    inFlight.dec();
    requests.inc({ method, route, status: String(status) });
    latency.observe({ method, route }, seconds);
    if (userId !== null) lastSeen.set(userId, Date.now());
  };
}

/** The Prometheus text exposition of every metric. */
export async function renderMetrics(): Promise<{ body: string; contentType: string }> {
  return { body: await registry.metrics(), contentType: registry.contentType };
}
