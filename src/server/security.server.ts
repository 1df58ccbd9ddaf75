// What every response carries and every request body must respect (DESIGN 6): a Content-Security-
// Policy without inline script (Astro hashes its own island scripts into the policy of each page;
// other responses get a deny-all policy), no framing, nosniff, Referrer-Policy same-origin, HSTS
// when served over HTTPS; and request bodies over 1 MB answer 413 before anything reads them
// (log uploads excepted: they stream, with their own limit).
import type { APIContext } from 'astro';
import { getConfig } from '../config.server';
import { errors } from './errors';
import { errorResponse, JSON_BODY_LIMIT } from './http';
import { clientAddressOf, runWithRequestContext } from './request-context.server';

/** Routes whose bodies are log data, streamed with UPLOAD_MAX_BYTES as their limit. */
const STREAMED_BODY = [/^\/api\/tests\/\d+\/logs\/?$/, /^\/api\/tests\/\d+\/live\/[^/]+\/chunks\/\d+\/?$/];

/** For responses Astro did not give a policy (API answers, files, plain-text errors). */
const DENY_ALL_POLICY = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'self'";
/**
 * Added to the policy Astro builds for pages: React renders a few `style` attributes (bar widths),
 * which a style-src with hashes would block; attributes can carry no script.
 */
const PAGE_POLICY_EXTRA = "style-src-attr 'unsafe-inline'";

const isJson = (type: string | null) => !!type && /^application\/([\w.+-]+\+)?json\b/i.test(type);

/** 413 for a body over the limit, judged from Content-Length before anything reads it; else null. */
export function refuseOversizedBody(request: Request, path: string): Response | null {
  if (request.method === 'GET' || request.method === 'HEAD') return null;
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (!Number.isFinite(declared) || declared <= JSON_BODY_LIMIT) return null;
  if (!isJson(request.headers.get('content-type')) && STREAMED_BODY.some((r) => r.test(path))) return null;
  return errorResponse(errors.tooLargeBody(JSON_BODY_LIMIT));
}

/** Whether the client reached us over HTTPS (directly, through a trusted proxy, or by configuration). */
function servedOverHttps(request: Request, url: URL): boolean {
  const c = getConfig();
  if (url.protocol === 'https:' || c.PUBLIC_BASE_URL.startsWith('https:')) return true;
  return c.TRUST_PROXY && request.headers.get('x-forwarded-proto')?.split(',')[0]?.trim() === 'https';
}

/** The security headers on a response (a copy when its headers are immutable). */
export function withSecurityHeaders(response: Response, request: Request, url: URL): Response {
  let res = response;
  try {
    res.headers.set('x-content-type-options', 'nosniff');
  } catch {
    res = new Response(response.body, response);
    res.headers.set('x-content-type-options', 'nosniff');
  }
  const h = res.headers;
  const policy = h.get('content-security-policy');
  if (!policy) h.set('content-security-policy', DENY_ALL_POLICY);
  else if (!policy.includes('style-src-attr'))
    h.set('content-security-policy', `${policy.replace(/;?\s*$/, ';')} ${PAGE_POLICY_EXTRA};`);
  h.set('x-frame-options', 'DENY');
  h.set('referrer-policy', 'same-origin');
  h.set('cross-origin-opener-policy', 'same-origin');
  if (servedOverHttps(request, url)) h.set('strict-transport-security', 'max-age=31536000; includeSubDomains');
  return res;
}

function socketAddress(ctx: Pick<APIContext, 'clientAddress'>): string | undefined {
  try {
    return ctx.clientAddress;
  } catch {
    return undefined; // the adapter gave none (never with @astrojs/node)
  }
}

/**
 * Around every request: remember the client's address for code deeper down, refuse an oversized
 * body at once, and put the security headers on whatever answers.
 */
export function guardRequest(
  ctx: Pick<APIContext, 'request' | 'url' | 'clientAddress'>,
  handle: () => Promise<Response>,
): Promise<Response> {
  const clientAddress = clientAddressOf(ctx.request, socketAddress(ctx), getConfig().TRUST_PROXY);
  return runWithRequestContext({ clientAddress }, async () => {
    const refused = refuseOversizedBody(ctx.request, ctx.url.pathname);
    const res = refused ?? (await handle());
    return withSecurityHeaders(res, ctx.request, ctx.url);
  });
}
