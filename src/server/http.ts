// Small helpers every endpoint uses: JSON responses, the error shape, role checks, body parsing.
import type { APIContext } from 'astro';
import { z } from 'zod';
import { can, type Permission, type Role } from '../lib/roles';
import { AppError, errors, toAppError } from './errors';

export interface RequestUser {
  id: number;
  email: string;
  name: string;
  role: Role;
  via: 'session' | 'token';
}

export function json(data: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(data), {
    status,
    headers: { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store', ...headers },
  });
}

export function errorResponse(err: AppError): Response {
  return json({ error: { code: err.code, message: err.message, details: err.details ?? null } }, err.status);
}

/** The signed-in user, or 401. */
export function requireUser(ctx: Pick<APIContext, 'locals'>): RequestUser {
  const user = ctx.locals.user;
  if (!user) throw new AppError('unauthenticated');
  return user;
}

/**
 * The signed-in user if their role holds `permission` (src/lib/roles.ts, DESIGN 1), else 401/403.
 * Every endpoint calls this itself; the UI hiding a button is not security.
 */
export function requirePermission(ctx: Pick<APIContext, 'locals'>, permission: Permission): RequestUser {
  const user = requireUser(ctx);
  if (!can(user.role, permission)) throw errors.forbidden(permission);
  return user;
}

/** Parse a JSON body with a zod schema; 400 naming the fields when it does not fit. */
export async function readJson<T extends z.ZodType>(request: Request, schema: T): Promise<z.infer<T>> {
  let body: unknown;
  try {
    const text = await request.text();
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

/** Wrap an endpoint: AppErrors become the error shape; anything else is logged and answers 500. */
export function endpoint(handler: Handler): Handler {
  return async (ctx) => {
    try {
      return await handler(ctx);
    } catch (err) {
      const mapped = mapError(err);
      if (mapped) return errorResponse(mapped);
      console.error(`[${new Date().toISOString()}] ${ctx.request.method} ${ctx.url.pathname} failed:`, err);
      return errorResponse(new AppError('internal'));
    }
  };
}

/** Map known error kinds to an AppError (zod errors from a handler are a bad request). */
export function mapError(err: unknown): AppError | null {
  if (err instanceof z.ZodError) return zodToAppError(err);
  return toAppError(err);
}
