// Small helpers every endpoint uses: JSON responses, the error shape, role checks, body parsing.
import type { APIContext } from 'astro';
import { z } from 'zod';
import type { Role } from '../db/schema/users';
import { AppError, errors } from './errors';

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
  if (!user) throw errors.unauthenticated();
  return user;
}

/**
 * The signed-in user if their role is one of `allowed`, else 401/403. Roles nest as in
 * DESIGN 1: an engineer may do what a technician may; qa and admin see everything.
 */
export function requireRole(ctx: Pick<APIContext, 'locals'>, ...allowed: Role[]): RequestUser {
  const user = requireUser(ctx);
  if (!allowed.includes(user.role)) throw errors.forbidden(allowed);
  return user;
}

export const roleSets = {
  anyone: ['technician', 'engineer', 'qa', 'admin'] as Role[],
  technicianPlus: ['technician', 'engineer', 'admin'] as Role[],
  engineer: ['engineer', 'admin'] as Role[],
  qa: ['qa', 'admin'] as Role[],
};

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
  return new AppError(status, status === 400 ? 'invalid-request' : 'invalid-plan', message, { issues });
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
      return json(
        {
          error: {
            code: 'internal',
            message: 'Something went wrong on the server; it has been logged.',
            details: null,
          },
        },
        500,
      );
    }
  };
}

/** Map known error kinds to an AppError; engine input errors become 422. */
export function mapError(err: unknown): AppError | null {
  if (err instanceof AppError) return err;
  if (err instanceof z.ZodError) return zodToAppError(err);
  if (err && typeof err === 'object' && (err as { name?: string }).name === 'InputError') {
    const e = err as { code?: string; message: string; details?: unknown };
    return new AppError(422, e.code ?? 'invalid-input', e.message, e.details);
  }
  return null;
}
