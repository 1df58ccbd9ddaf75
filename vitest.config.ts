import { defineConfig } from 'vitest/config';

// Two projects: `unit` runs the pure engine tests beside the code (no services);
// `integration` runs tests/ against a private MariaDB, the S3 fake and the SMTP fake
// that tests/global-setup.ts starts and tears down.
export default defineConfig({
  test: {
    environment: 'node',
    projects: [
      {
        test: {
          name: 'unit',
          environment: 'node',
          include: ['src/**/*.test.ts', 'scripts/**/*.test.ts'],
        },
      },
      {
        test: {
          name: 'integration',
          environment: 'node',
          include: ['tests/**/*.test.ts'],
          exclude: ['tests/e2e/**', 'tests/drills/**', 'tests/scale/**'],
          globalSetup: ['tests/global-setup.ts'],
          setupFiles: ['tests/support/setup-env.ts'],
          testTimeout: 60_000,
          hookTimeout: 120_000,
          // one file at a time: the files share one app server, database and worker queue
          poolOptions: { forks: { singleFork: true } },
        },
      },
    ],
  },
});
