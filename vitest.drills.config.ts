import { defineConfig } from 'vitest/config';

// Fault drills: each file starts a private MariaDB, S3 and SMTP fake and the built app
// (tests/drills/stack.ts), then stops and starts them, kills and freezes workers and races
// requests, checking that nothing is lost or half-written. `npm run test:drills`.
export default defineConfig({
  test: {
    name: 'drills',
    environment: 'node',
    include: ['tests/drills/**/*.test.ts'],
    globalSetup: ['tests/drills/global-setup.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    poolOptions: { forks: { singleFork: true } },
  },
});
