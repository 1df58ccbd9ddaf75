// Every request passes here: the request id, log line, metrics and compression
// (src/server/observability/), security headers and the body limit (src/server/security.server.ts),
// origin check for cookie-authenticated writes, who the caller is, and turning away anonymous
// callers (pages redirect to /signin, the API answers 401 JSON). Each endpoint still checks the
// permission itself (src/server/http.ts requirePermission).
import type { APIContext, MiddlewareNext } from 'astro';
import { defineMiddleware, sequence } from 'astro:middleware';
import { AppError, errors } from './server/errors';
import { errorResponse } from './server/http';
import { resolveRequestUser } from './server/auth/request-user.server';
import { getConfig } from './config.server';
import { guardRequest } from './server/security.server';
import { logger } from './server/observability/logger.server';
import { observeRequest } from './server/observability/observe.server';

const PUBLIC_PREFIXES = [
  '/signin',
  '/api/auth/',
  '/api/health',
  '/api/ready',
  '/api/metrics',
  '/api/docs',
  '/api/openapi.json',
  '/share/',
  '/api/share/',
  '/_astro/',
  '/favicon',
  '/forgot-password',
  '/set-password/',
  '/api/password/',
];
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

const isPublic = (path: string) => PUBLIC_PREFIXES.some((p) => path === p.replace(/\/$/, '') || path.startsWith(p));

const guard = defineMiddleware((ctx, next) => guardRequest(ctx, () => resolveCaller(ctx, next)));

async function resolveCaller(ctx: APIContext, next: MiddlewareNext) {
  const { request, url } = ctx;
  const path = url.pathname;
  const isApi = path.startsWith('/api/');
  ctx.locals.user = null;

  // Same rule as Astro's own origin check, for every content type, but a request that carries
  // a Bearer token is exempt: browsers never attach one on their own, so it cannot be forged
  // cross-site, and a data-acquisition PC's `curl -F` sends no Origin header.
  const bearer = /^bearer\s+/i.test(request.headers.get('authorization') ?? '');
  if (
    !SAFE_METHODS.has(request.method) &&
    !bearer &&
    !path.startsWith('/api/auth/') &&
    !path.startsWith('/api/share/') &&
    !path.startsWith('/share/')
  ) {
    // behind a TLS proxy the request URL is the inner one: the public address counts too
    const origin = request.headers.get('origin');
    if (origin !== url.origin && origin !== new URL(getConfig().PUBLIC_BASE_URL).origin)
      return errorResponse(new AppError('cross-origin'));
  }

  if (path.startsWith('/api/auth/') || path.startsWith('/_astro/')) return next();

  try {
    ctx.locals.user = await resolveRequestUser(request, { allowToken: isApi });
  } catch (err) {
    if (err instanceof AppError) return errorResponse(err);
    logger().error({ err }, 'resolving the caller failed');
    if (isApi) return errorResponse(errors.unavailable('The database is not answering; try again shortly.'));
    if (!isPublic(path))
      return new Response(
        `Hoopline cannot reach its database right now. Try again shortly. (Reference: ${ctx.locals.requestId})`,
        { status: 503 },
      );
    return next();
  }

  if (!ctx.locals.user && !isPublic(path)) {
    if (isApi) return errorResponse(new AppError('unauthenticated'));
    const back = encodeURIComponent(path + url.search);
    return ctx.redirect(`/signin?next=${back}`, 302);
  }
  return next();
}

// request id, log line, metrics and compression around everything else
export const onRequest = sequence(observeRequest, guard);
