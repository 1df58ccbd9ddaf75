import { defineConfig } from 'drizzle-kit';

// Only `drizzle-kit generate` is used: push and pull fail on MariaDB (STACK.md).
// Migrations are applied by scripts/db-migrate.ts and the tests with drizzle's migrator.
export default defineConfig({
  dialect: 'mysql',
  schema: './src/db/schema/index.ts',
  out: './migrations',
});
