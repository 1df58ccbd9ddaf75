// types/auth-astro/*.d.ts stand in for auth-astro's entry points under `tsc` (tsconfig.tsc.json).
// They were written against one release; this test fails on an upgrade until someone compares
// them with the new index.ts, server.ts, client.ts and src/config.ts and bumps the version here.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const AUTH_ASTRO_DECLARED_VERSION = '4.2.0';
const root = path.resolve(import.meta.dirname, '..');
const read = (p: string) => readFileSync(path.join(root, p), 'utf8');

/** Names a module's source exports (functions, consts, interfaces, default). */
function exportedNames(source: string): string[] {
  const names = new Set<string>();
  for (const m of source.matchAll(/export\s+(?:async\s+)?(?:function|const|interface|type)\s+(\w+)/g))
    if (m[1]) names.add(m[1]);
  for (const m of source.matchAll(/export\s*\{([^}]*)\}/g))
    for (const part of (m[1] ?? '').split(',')) {
      const name = part
        .trim()
        .split(/\s+as\s+/)
        .pop();
      if (name) names.add(name);
    }
  if (/export\s+default\b/.test(source)) names.add('default');
  return [...names].sort();
}

describe('auth-astro declarations for tsc', () => {
  it('match the installed auth-astro release', () => {
    const installed = JSON.parse(read('node_modules/auth-astro/package.json')) as { version: string };
    expect(installed.version, 'auth-astro was upgraded: review types/auth-astro/*.d.ts').toBe(
      AUTH_ASTRO_DECLARED_VERSION,
    );
  });

  it.each([
    ['index.ts', 'types/auth-astro/index.d.ts', ['defineConfig', 'default']],
    ['server.ts', 'types/auth-astro/server.d.ts', ['AstroAuth', 'getSession']],
    ['client.ts', 'types/auth-astro/client.d.ts', ['signIn', 'signOut']],
  ])('declare what %s exports and the app uses', (source, declaration, used) => {
    const real = exportedNames(read(`node_modules/auth-astro/${source}`));
    const declared = exportedNames(read(declaration));
    for (const name of used) {
      expect(real, `auth-astro/${source} no longer exports ${name}`).toContain(name);
      expect(declared, `${declaration} lacks ${name}`).toContain(name);
    }
  });
});
