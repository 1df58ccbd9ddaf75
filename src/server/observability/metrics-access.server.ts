// Who may read /api/metrics: a caller on this machine (a scraper beside the server), or an
// administrator's API token. A request that came through a proxy (X-Forwarded-For, Forwarded)
// is never taken for a local one, even though its socket is the proxy's loopback connection.
import type { APIContext } from 'astro';
import { AppError } from '../errors';

const LOOPBACK = /^(?:127\.\d{1,3}\.\d{1,3}\.\d{1,3}|::1|::ffff:127\.\d{1,3}\.\d{1,3}\.\d{1,3})$/;

export function isLoopbackCaller(ctx: Pick<APIContext, 'request' | 'clientAddress'>): boolean {
  const h = ctx.request.headers;
  if (h.has('x-forwarded-for') || h.has('forwarded') || h.has('x-real-ip')) return false;
  let address = '';
  try {
    address = ctx.clientAddress;
  } catch {
    return false;
  }
  return LOOPBACK.test(address);
}

/** Throws 401/403 unless the caller may read the metrics. */
export function requireMetricsAccess(ctx: Pick<APIContext, 'request' | 'clientAddress' | 'locals'>): void {
  if (isLoopbackCaller(ctx)) return;
  const user = ctx.locals.user;
  if (!user)
    throw new AppError('unauthenticated', "Metrics are served to this machine, or to an administrator's API token.");
  if (user.via !== 'token' || user.role !== 'admin')
    throw new AppError('forbidden', "Metrics need an administrator's API token (or a request from this machine).");
}
