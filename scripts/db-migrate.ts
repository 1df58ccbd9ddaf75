// npm run db:migrate — apply migrations/ to DATABASE_URL.
import { getConfig } from '../src/config.server';
import { migrateDatabase } from '../src/db/migrate.server';

try {
  await migrateDatabase(getConfig().DATABASE_URL);
  console.log('migrations applied');
} catch (err) {
  console.error(`migration failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
}
