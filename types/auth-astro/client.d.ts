// auth-astro/client for `tsc` (see ./index.d.ts for why and what to do on an upgrade).
export interface AstroSignInOptions extends Record<string, unknown> {
  /** where to go after signing in (default: the current page) */
  callbackUrl?: string;
  /** false: resolve with the response instead of navigating (credentials and e-mail providers) */
  redirect?: boolean;
  /** base path of the auth routes (default `/api/auth`) */
  prefix?: string;
}

export interface AstroSignOutParams {
  callbackUrl?: string;
  prefix?: string;
}

export function signIn(
  providerId?: string,
  options?: AstroSignInOptions,
  authorizationParams?: Record<string, string>,
): Promise<Response | undefined>;

export function signOut(options?: AstroSignOutParams): Promise<void>;
