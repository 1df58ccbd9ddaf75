import { endpoint } from '../../server/http';
import { requireMetricsAccess } from '../../server/observability/metrics-access.server';
import { renderMetrics } from '../../server/observability/metrics.server';

/** GET /api/metrics — Prometheus text format; loopback callers or an admin's API token only. */
export const GET = endpoint(async (ctx) => {
  requireMetricsAccess(ctx);
  const { body, contentType } = await renderMetrics();
  return new Response(body, { headers: { 'content-type': contentType, 'cache-control': 'no-store' } });
});
