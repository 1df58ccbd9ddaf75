import { defineConfig } from 'vitest/config';

// The scale drill: it starts its own stack (scripts/stack.ts) — two app servers, two workers,
// one MariaDB, one object store — so it needs no global setup.
export default defineConfig({
  test: {
    name: 'scale',
    environment: 'node',
    include: ['tests/scale/**/*.test.ts'],
    testTimeout: 120_000,
    hookTimeout: 300_000,
    poolOptions: { forks: { singleFork: true } },
  },
});
