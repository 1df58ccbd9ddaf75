// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';
import authAstro from 'auth-astro';

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
  vite: {
    plugins: [tailwindcss()],
    ssr: { external: ['pdfkit', 'mysql2', 'bcryptjs', 'jstat'] },
  },
});
