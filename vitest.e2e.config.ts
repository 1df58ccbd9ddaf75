import { defineConfig } from 'vitest/config';

// Browser journeys: the same global setup as the integration tests (private MariaDB, S3 and
// SMTP fakes, the built app on a free port), then headless Chromium through playwright-core.
export default defineConfig({
  test: {
    name: 'e2e',
    environment: 'node',
    include: ['tests/e2e/**/*.test.ts'],
    globalSetup: ['tests/global-setup.ts'],
    setupFiles: ['tests/support/setup-env.ts'],
    testTimeout: 120_000,
    hookTimeout: 180_000,
    poolOptions: { forks: { singleFork: true } },
  },
});
