// auth-astro/server for `tsc` (see ./index.d.ts for why and what to do on an upgrade).
import type { Session } from '@auth/core/types';
import type { APIContext } from 'astro';
import type { FullAuthConfig } from './index';

export function AstroAuth(options?: FullAuthConfig): {
  GET(context: APIContext): Promise<Response>;
  POST(context: APIContext): Promise<Response>;
};

export function getSession(req: Request, options?: FullAuthConfig): Promise<Session | null>;
