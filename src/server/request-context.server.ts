// What the middleware learns about a request that code deeper down needs without a parameter:
// the client's address, for throttling sign-in (Auth.js calls our credentials check with a bare
// Request, which carries no socket). Node's AsyncLocalStorage follows the request's async work.
import { AsyncLocalStorage } from 'node:async_hooks';
import { isIP } from 'node:net';

interface RequestContext {
  clientAddress: string;
}

const storage = new AsyncLocalStorage<RequestContext>();

export function runWithRequestContext<T>(ctx: RequestContext, fn: () => T): T {
  return storage.run(ctx, fn);
}

/** The client's address for this request ('unknown' outside a request, e.g. in a script). */
export function currentClientAddress(): string {
  return storage.getStore()?.clientAddress ?? 'unknown';
}

/**
 * The client's address: the socket's peer, or — only when a trusted proxy sits in front
 * (TRUST_PROXY=true) — the last address in X-Forwarded-For, the one that proxy itself saw
 * (earlier entries are whatever the client chose to send).
 */
export function clientAddressOf(request: Request, socketAddress: string | undefined, trustProxy: boolean): string {
  if (trustProxy) {
    const forwarded = request.headers.get('x-forwarded-for');
    const last = forwarded?.split(',').at(-1)?.trim();
    if (last && isIP(last)) return last;
  }
  const a = (socketAddress ?? '').replace(/^::ffff:/, '');
  return a || 'unknown';
}
