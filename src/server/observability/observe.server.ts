// The first middleware step: give the request an id (X-Request-Id), serve it inside that
// context, compress a large JSON answer, count it, and write its one log line — request id,
// user id, route, status, duration — when the response is ready. Paths with a share-link
// token are logged with the token cut out; query strings are never logged.
import type { APIContext, MiddlewareNext } from 'astro';
import { compressJsonResponse } from '../compression.server';
import { logger, serializeError } from './logger.server';
import { startRequestMetrics } from './metrics.server';
import { contextFor, runInRequest } from './request-context.server';

/** The path as logged: a share token (a secret) replaced by `[token]`. */
export function loggablePath(path: string): string {
  return path.replace(/\/share\/[^/]+/, '/share/[token]').slice(0, 300);
}

/** Set a header even on a response whose headers are immutable (a fetched or static Response). */
function withHeader(response: Response, name: string, value: string): Response {
  try {
    response.headers.set(name, value);
    return response;
  } catch {
    const copy = new Response(response.body, response);
    copy.headers.set(name, value);
    return copy;
  }
}

export async function observeRequest(ctx: APIContext, next: MiddlewareNext): Promise<Response> {
  const { context, fresh } = contextFor(ctx.request);
  ctx.locals.requestId = context.id;
  // an error page Astro renders for this same request: same id, no second log line or count
  if (!fresh) return withHeader(await runInRequest(context, next), 'x-request-id', context.id);

  const route = ctx.routePattern || '(unmatched)';
  const method = ctx.request.method;
  const done = startRequestMetrics();
  const finish = (status: number, err?: unknown) => {
    context.logged = true;
    const ms = performance.now() - context.startedAt;
    const user = ctx.locals.user;
    done({ method, route, status, seconds: ms / 1000, userId: user?.id ?? null });
    const line = {
      reqId: context.id,
      method,
      route,
      path: loggablePath(ctx.url.pathname),
      status,
      ms: Math.round(ms * 10) / 10,
      userId: user?.id ?? null,
      via: user?.via ?? (route.includes('[token]') ? 'share-link' : null),
      ...(err ? { err: serializeError(err) } : {}),
    };
    if (status >= 500) logger().error(line, 'request failed');
    else logger().info(line, 'request');
  };
  try {
    const response = await compressJsonResponse(ctx.request, await runInRequest(context, next));
    finish(response.status);
    return withHeader(response, 'x-request-id', context.id);
  } catch (err) {
    finish(500, err);
    throw err;
  }
}
