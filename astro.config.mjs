// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import authAstro from 'auth-astro';
import { fileURLToPath } from 'node:url';

/**
 * Make the built server entry import src/server/startup.server.ts before anything else, so the
 * server refuses an unsafe configuration (DESIGN 6) before it listens.
 */
function startupChecksFirst() {
  const startup = fileURLToPath(new URL('./src/server/startup.server.ts', import.meta.url));
  return {
    name: 'hoopline:startup-checks-first',
    enforce: /** @type {const} */ ('post'),
    /** @param {string} code @param {string} id */
    transform(code, id) {
      if (id !== '\0@astrojs-ssr-virtual-entry') return null;
      return { code: `import ${JSON.stringify(startup)};\n${code}`, map: null };
    },
  };
}

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), authAstro()],
  server: { host: '127.0.0.1', port: 4321 },
  security: {
    // Astro's own check would refuse `curl -F` uploads that carry an API token (no Origin
    // header); src/middleware.ts applies the same rule to every cookie-authenticated write.
    checkOrigin: false,
    allowedDomains: [
      { protocol: 'http', hostname: '127.0.0.1' },
      { protocol: 'http', hostname: 'localhost' },
    ],
  },
  experimental: {
    // Astro hashes its own inline scripts (island loader, hydration directives) and styles into
    // each page's Content-Security-Policy header; src/server/security.server.ts adds the rest.
    csp: {
      directives: [
        "default-src 'self'",
        "img-src 'self' data: blob:",
        "font-src 'self'",
        "connect-src 'self'",
        "object-src 'none'",
        "base-uri 'self'",
        "form-action 'self'",
        "frame-ancestors 'none'",
      ],
    },
  },
  vite: {
    plugins: [tailwindcss(), startupChecksFirst()],
    ssr: {
      external: [
        'pdfkit',
        'mysql2',
        'bcryptjs',
        'jstat',
        '@zxcvbn-ts/core',
        '@zxcvbn-ts/language-common',
        '@zxcvbn-ts/language-en',
      ],
    },
  },
});
