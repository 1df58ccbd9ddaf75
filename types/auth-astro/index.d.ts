// Declarations of auth-astro 4.2.0's entry points for `tsc` only (tsconfig.tsc.json maps the
// package here). auth-astro ships TypeScript sources, not declarations, and those sources do not
// type-check on their own (they import next-auth types it never installs). `astro check` reads
// the real sources and skips node_modules; `tsc` would fail inside them.
// When auth-astro is upgraded: compare these three files with its index.ts, server.ts and
// client.ts (and src/config.ts), then update AUTH_ASTRO_DECLARED_VERSION in
// scripts/auth-astro-types.test.ts, which fails until you do.
import type { AuthConfig } from '@auth/core';
import type { AstroIntegration } from 'astro';

export interface AstroAuthConfig {
  /** base path of the auth routes (default `/api/auth`) */
  prefix?: string;
  /** whether the integration injects the API routes (default true) */
  injectEndpoints?: boolean;
  /** path to the config file */
  configFile?: string;
}

export interface FullAuthConfig extends AstroAuthConfig, Omit<AuthConfig, 'raw'> {}

export function defineConfig(config: FullAuthConfig): FullAuthConfig;

declare function integration(config?: AstroAuthConfig): AstroIntegration;
export default integration;
