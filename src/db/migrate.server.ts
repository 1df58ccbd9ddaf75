// Applies migrations/ with drizzle's migrator (drizzle-kit push does not work on MariaDB).
import { drizzle } from 'drizzle-orm/mysql2';
import { migrate } from 'drizzle-orm/mysql2/migrator';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createPool } from './client.server';

export const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../migrations');

/** Migrate the database at `url` to the newest schema. */
export async function migrateDatabase(url: string, folder = migrationsFolder): Promise<void> {
  const pool = createPool(url);
  try {
    await migrate(drizzle(pool), { migrationsFolder: folder });
  } finally {
    await pool.end();
  }
}
