// The request being served, for log lines and error bodies deep inside a handler: its id (sent
// back as X-Request-Id and shown on error pages so a user can quote it) and when it started.
import { AsyncLocalStorage } from 'node:async_hooks';
import { randomBytes } from 'node:crypto';

export interface RequestContext {
  id: string;
  startedAt: number;
  /** the request's log line was written (an error page rendered for it must not write another) */
  logged: boolean;
}

const storage = new AsyncLocalStorage<RequestContext>();
// Astro renders an error page for the same Request object through the middleware again
const byRequest = new WeakMap<Request, RequestContext>();

/** A load balancer's id is kept when it looks like one; otherwise a fresh random id. */
const INCOMING_ID = /^[A-Za-z0-9._:-]{8,64}$/;

export function requestIdFrom(request: Request): string {
  const incoming = request.headers.get('x-request-id');
  return incoming && INCOMING_ID.test(incoming) ? incoming : randomBytes(9).toString('base64url');
}

/** The context of `request`, and whether it was created now (false: an error page for it). */
export function contextFor(request: Request): { context: RequestContext; fresh: boolean } {
  const known = byRequest.get(request);
  if (known) return { context: known, fresh: false };
  const context: RequestContext = { id: requestIdFrom(request), startedAt: performance.now(), logged: false };
  byRequest.set(request, context);
  return { context, fresh: true };
}

export function runInRequest<T>(context: RequestContext, fn: () => T): T {
  return storage.run(context, fn);
}

/** The id of the request being served, or null outside a request (the worker, scripts). */
export function currentRequestId(): string | null {
  return storage.getStore()?.id ?? null;
}
