// Small helpers every endpoint uses: JSON responses, the error shape, role and token-scope
// checks, body parsing with a size limit.
import type { APIContext } from 'astro';
import { z } from 'zod';
import { can, type Permission, type Role } from '../lib/roles';
import { AppError, errors, toAppError } from './errors';
import { describeFault, faultToAppError } from './faults.server';
import { logger } from './observability/logger.server';
import { currentRequestId } from './observability/request-context.server';

import type { TokenScope } from './api/schemas';

export { tokenScopes, type TokenScope } from './api/schemas';

export interface RequestUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  via: 'session' | 'token';
  /** the token's scopes; null for a browser session */
  scopes: readonly TokenScope[] | null;
}

/** The largest JSON body any endpoint reads (DESIGN 6): larger answers 413 before parsing. */
export const JSON_BODY_LIMIT = 1024 * 1024;

export function json(data: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(data), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers },
  });
}

/** The error shape of DESIGN 5, with the request id a user can quote. */
export function errorResponse(err: AppError): Response {
  const retry = (err.details as { retryAfterSeconds?: number } | undefined)?.retryAfterSeconds;
  const requestId = currentRequestId();
  return json(
    { error: { code: err.code, message: err.message, details: err.details ?? null, requestId } },
    err.status,
    retry ? { 'retry-after': String(retry) } : {},
  );
}

type Ctx = Pick<APIContext, 'locals' | 'request'>;
const isRead = (request: Request) => request.method === 'GET' || request.method === 'HEAD';

function requireScope(user: RequestUser, scope: TokenScope): void {
  if (user.via === 'token' && !user.scopes?.includes(scope)) throw errors.tokenScope(scope);
}

/**
 * The signed-in user, or 401. An API token passes only for reading (scope `read`); a token can
 * never write through an endpoint that asks for a plain user (its own tokens, for one).
 */
export function requireUser(ctx: Ctx): RequestUser {
  const user = ctx.locals.user;
  if (!user) throw new AppError('unauthenticated');
  if (user.via === 'token') {
    if (!isRead(ctx.request)) throw new AppError('token-not-allowed');
    requireScope(user, 'read');
  }
  return user;
}

/** A person signed in with the browser: API tokens are refused (signing, managing tokens). */
export function requireSessionUser(ctx: Ctx, permission?: Permission): RequestUser {
  const user = ctx.locals.user;
  if (!user) throw new AppError('unauthenticated');
  if (user.via === 'token') throw new AppError('token-not-allowed');
  if (permission && !can(user.role, permission)) throw errors.forbidden(permission);
  return user;
}

/**
 * The signed-in user if their role holds `permission` (src/lib/roles.ts, DESIGN 1), else 401/403.
 * With an API token a GET also needs the `read` scope, and a write is refused unless the endpoint
 * names the scope that allows it (`tokenWrite: 'upload'` for logs, live sessions and reductions).
 * Every endpoint calls this itself; the UI hiding a button is not security.
 */
export function requirePermission(
  ctx: Ctx,
  permission: Permission,
  opts: { tokenWrite?: TokenScope } = {},
): RequestUser {
  const user = ctx.locals.user;
  if (!user) throw new AppError('unauthenticated');
  if (!can(user.role, permission)) throw errors.forbidden(permission);
  if (user.via === 'token') {
    if (isRead(ctx.request)) requireScope(user, 'read');
    else if (!opts.tokenWrite) throw new AppError('token-not-allowed');
    else requireScope(user, opts.tokenWrite);
  }
  return user;
}

/** The body's bytes, refusing more than `limit` whatever Content-Length says (413 with `tooLarge`). */
export async function readBodyBytes(
  request: Request,
  limit = JSON_BODY_LIMIT,
  tooLarge: (limitBytes: number) => AppError = errors.tooLargeBody,
): Promise<Buffer> {
  const declared = Number(request.headers.get('content-length') ?? NaN);
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(limit);
  if (!request.body) return Buffer.alloc(0);
  const reader = request.body.getReader();
  const parts: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(limit);
    }
    parts.push(value);
  }
  return Buffer.concat(parts);
}

/** The body as text, refusing more than `limit` bytes whatever Content-Length says (413). */
export async function readBodyText(request: Request, limit = JSON_BODY_LIMIT): Promise<string> {
  return (await readBodyBytes(request, limit)).toString('utf8');
}

/** Parse a JSON body (at most 1 MB) with a zod schema; 400 naming the fields when it does not fit. */
export async function readJson<T extends z.ZodType>(request: Request, schema: T): Promise<z.infer<T>> {
  const text = await readBodyText(request);
  let body: unknown;
  try {
    body = text.length ? JSON.parse(text) : {};
  } catch {
    throw errors.invalid('The request body is not valid JSON.');
  }
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw zodToAppError(parsed.error);
  return parsed.data;
}

export function zodToAppError(error: z.ZodError, status: 400 | 422 = 400): AppError {
  const issues = error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
  const first = issues[0];
  const message = first ? `${first.path || 'body'}: ${first.message}` : 'The request is not valid.';
  return new AppError(status === 400 ? 'invalid-request' : 'invalid-plan', message, { issues });
}

/** Parse a numeric route parameter; 404 when it is not a positive integer. */
export function idParam(value: string | undefined, what: string): number {
  const n = Number(value);
  if (!Number.isSafeInteger(n) || n <= 0) throw errors.notFound(what);
  return n;
}

type Handler = (ctx: APIContext) => Promise<Response> | Response;

/**
 * Wrap an endpoint: AppErrors become the error shape; a stopped database or storage answers 503;
 * anything else is logged and answers 500 with no internal detail.
 */
export function endpoint(handler: Handler): Handler {
  return async (ctx) => {
    try {
      return await handler(ctx);
    } catch (err) {
      const mapped = mapError(err);
      if (mapped) {
        if (mapped.status === 503)
          logger().warn(
            { reqId: currentRequestId(), route: ctx.routePattern, fault: describeFault(err) },
            'a service did not answer',
          );
        return errorResponse(mapped);
      }
      logger().error({ reqId: currentRequestId(), route: ctx.routePattern, err }, 'unexpected error in an endpoint');
      return errorResponse(new AppError('internal'));
    }
  };
}

/** Map known error kinds to an AppError (zod errors from a handler are a bad request). */
export function mapError(err: unknown): AppError | null {
  if (err instanceof z.ZodError) return zodToAppError(err);
  return toAppError(err) ?? faultToAppError(err);
}
